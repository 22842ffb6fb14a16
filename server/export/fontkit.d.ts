// The part of fontkit (pdfkit's own font parser) the exports use: parse a font file once.
declare module 'fontkit' {
  export function create(buffer: Uint8Array, postscriptName?: string): { layout: (text: string) => unknown };
}
