// The demo class's lesson and assignment, our own invention: Dana Whitcombe teaches Light One from her own
// copies of two demo setups (a clamshell headshot, twin rims on black), with her words for each step.
import type { Check } from '../model/classes';

export const DEMO_LESSON = {
  title: 'One key, then the edges',
  summary: 'How far the paper sits behind the sitter decides how dark it goes; rims add edges without touching the face.',
  setups: [
    {
      from: 'Clamshell headshot on grey',
      note: 'Everything here is one light. Watch the paper: it is further from the octa than the face is, so it falls off.',
      steps: {
        s1: 'The octa sits just above the eyes and about a metre out. The grey paper is twice as far from it as the face, so it reads about two stops darker.',
        s2: 'The silver panel only lifts the shadows under the chin and eyes; the reading at the face barely moves. That is why a reflector is fill, not a second key.',
      },
    },
    {
      from: 'Twin rims on black for a runner',
      note: 'Two lights from behind. The meter at the face reads nothing until the key comes in: rims light edges, not the face.',
      steps: {
        s1: 'Both strips point back towards the camera, gridded so the black paper stays black. The flag keeps the left strip out of the lens.',
        s2: 'Only now does the face get light. Set the dish so the face reads the camera aperture; the rims stay where they were.',
      },
    },
  ],
} as const;

export const DEMO_ASSIGNMENT: { title: string; brief: string; check: Check } = {
  title: 'One light, paper two stops down',
  brief:
    'Reproduce the clamshell look with one light and a reflector. Keep the grey paper at least 2 stops under the face, and expose the face within half a stop of the camera setting. Start from a copy of the reference if you like.',
  check: {
    criteria: [
      { measure: 'lights', min: null, max: 1 },
      { measure: 'background', min: null, max: -2 },
      { measure: 'subject', min: -0.5, max: 0.5 },
    ],
  },
};
