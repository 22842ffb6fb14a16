// On the web the faces are declared in the page itself (scripts/webfonts.mjs writes WOFF2 subsets, @font-face
// rules with font-display: swap, and preloads into index.html): text shows at once in a fallback face and
// changes face when its file arrives, so nothing waits for a font.
export function useAppFonts(): boolean {
  return true;
}
