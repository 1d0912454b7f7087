import { execFile } from 'node:child_process';
import { mkdtemp, rm, writeFile } from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { promisify } from 'node:util';

const run = promisify(execFile);

/** The script that reads a PDF with pdfjs-dist (ESM only, so it runs outside jest's CommonJS). */
const TEXT_SCRIPT = path.join(__dirname, 'pdf-text-reader.mjs');

/**
 * The text of a PDF (a file path or its bytes), as pdfjs-dist reads it: one line per baseline,
 * items joined by spaces, pages separated by a form feed. pdfjs gives thin spaces back as plain
 * spaces.
 */
export async function pdfText(pdf: Buffer | string): Promise<string> {
  if (typeof pdf === 'string') return textOfFile(pdf);
  const folder = await mkdtemp(path.join(os.tmpdir(), 'bellkeep-pdf-'));
  try {
    const file = path.join(folder, 'document.pdf');
    await writeFile(file, pdf);
    return await textOfFile(file);
  } finally {
    await rm(folder, { recursive: true, force: true });
  }
}

async function textOfFile(file: string): Promise<string> {
  const { stdout } = await run(process.execPath, [TEXT_SCRIPT, file], { maxBuffer: 64 * 1024 * 1024 });
  return stdout;
}

/** One font dictionary of a PDF and whether its glyphs travel inside the file. */
export interface PdfFontEntry {
  /** `/BaseFont`, e.g. `BZZZZZ+DejaVuSans` (a subset) or `Helvetica` (a standard font, not embedded). */
  baseFont: string;
  /** `/Subtype`: Type0, TrueType, Type1, Type3... */
  subtype: string;
  /** Whether its font descriptor (the descendant's, for Type0) carries a FontFile, FontFile2 or FontFile3. */
  embedded: boolean;
}

/**
 * The font dictionaries of a PDF, read from its uncompressed objects (pdfkit writes no object
 * streams; fonts inside compressed object streams would not be found).
 */
export function pdfFonts(pdf: Buffer): PdfFontEntry[] {
  const objects = pdfObjects(pdf);
  const referenced = (dictionary: string, key: string) => {
    const match = new RegExp(`/${key}\\s*\\[?\\s*(\\d+) 0 R`).exec(dictionary);
    return match ? (objects.get(Number(match[1])) ?? '') : '';
  };
  const hasFontFile = (descriptor: string) => /\/FontFile[23]?\s/.test(descriptor);
  return [...objects.values()]
    .filter((dictionary) => /\/Type\s*\/Font\b/.test(dictionary))
    .filter((dictionary) => !/\/Subtype\s*\/CIDFontType[02]\b/.test(dictionary))
    .map((dictionary) => {
      const subtype = /\/Subtype\s*\/(\w+)/.exec(dictionary)?.[1] ?? '';
      const baseFont = /\/BaseFont\s*\/([^\s/<>[\]()]+)/.exec(dictionary)?.[1] ?? '';
      const descriptor = subtype === 'Type0' ? referenced(referenced(dictionary, 'DescendantFonts'), 'FontDescriptor') : referenced(dictionary, 'FontDescriptor');
      // A Type3 font's glyphs are content streams of the PDF itself.
      return { baseFont, subtype, embedded: subtype === 'Type3' || hasFontFile(descriptor) };
    });
}

/** Whether the PDF has fonts and every one of them is embedded. */
export function pdfFontsEmbedded(pdf: Buffer): boolean {
  const fonts = pdfFonts(pdf);
  return fonts.length > 0 && fonts.every((font) => font.embedded);
}

/** The dictionary part (before any stream) of every `N 0 obj ... endobj`, by object number. */
function pdfObjects(pdf: Buffer): Map<number, string> {
  const objects = new Map<number, string>();
  for (const match of pdf.toString('latin1').matchAll(/(\d+) 0 obj\b([\s\S]*?)\bendobj\b/g)) {
    objects.set(Number(match[1]), match[2].split(/\bstream\b/)[0]);
  }
  return objects;
}
