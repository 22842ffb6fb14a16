// svg-to-pdfkit ships no types; this is the part of its API the crew sheet uses.
declare module 'svg-to-pdfkit' {
  type Options = {
    width?: number;
    height?: number;
    preserveAspectRatio?: string;
    assumePt?: boolean;
    /** Maps an SVG font-family to a font registered with pdfkit. */
    fontCallback?: (family: string, bold: boolean, italic: boolean, options: { fauxBold: boolean; fauxItalic: boolean }) => string;
    warningCallback?: (message: string) => void;
  };
  function SVGtoPDF(doc: PDFKit.PDFDocument, svg: string, x: number, y: number, options?: Options): void;
  export = SVGtoPDF;
}
