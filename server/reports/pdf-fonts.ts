import path from 'node:path';

/** The DejaVu faces the report is set in, by the name the document knows them by. */
const FONT_FILES = {
  body: 'DejaVuSans.ttf',
  bold: 'DejaVuSans-Bold.ttf',
  mono: 'DejaVuSansMono.ttf',
} as const;

/** A face of the report: running text, headings and figures that stand out, hex and base64. */
export type PdfFont = keyof typeof FONT_FILES;

// Resolved from the installed package only, never from anything a request carries.
const FONT_FOLDER = path.join(path.dirname(require.resolve('dejavu-fonts-ttf/package.json')), 'ttf');

/** The TrueType file of a face; pdfkit embeds (a subset of) it, so the PDF renders the same everywhere. */
export function fontFile(font: PdfFont): string {
  return path.join(FONT_FOLDER, FONT_FILES[font]);
}

/** Registers every face under its name, so `doc.font('mono')` picks the embedded DejaVu Sans Mono. */
export function registerFonts(doc: PDFKit.PDFDocument): void {
  for (const font of Object.keys(FONT_FILES) as PdfFont[]) {
    doc.registerFont(font, fontFile(font));
  }
}
