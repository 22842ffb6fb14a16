// The part of subset-font (harfbuzz's subsetter) the exports use: cut a font down to the given characters.
declare module 'subset-font' {
  export default function subsetFont(font: Buffer, text: string, options?: { targetFormat?: 'truetype' | 'woff' | 'woff2' | 'sfnt' }): Promise<Buffer>;
}
