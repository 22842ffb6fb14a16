// What the frame leaves out, apart from the renderer (render.ts), so a page can say it without loading it.

/** What the frame leaves out, in one line a photographer reads. */
export const FRAME_LIMITS =
  'Not modelled: light scattering under the skin, shine on skin and props (only the eyes reflect the lights), lens flare and depth of field — everything is in focus.';
