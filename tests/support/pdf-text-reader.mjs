// Prints the text of a PDF: `node tests/support/pdf-text.mjs <file>`. pdfjs-dist is ESM only, so the
// CommonJS tests run this as a child process (see pdf-text.ts). Items on one baseline are joined by
// spaces into a line, lines top to bottom; pages are separated by a form feed.
import { readFile } from 'node:fs/promises';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';

/** Items whose baselines differ by less than this (in points) share a line. */
const SAME_LINE = 1;

async function pageText(page) {
  const content = await page.getTextContent();
  const items = content.items.filter((item) => 'str' in item && item.str.trim() !== '');
  const lines = [];
  for (const item of items) {
    const [x, y] = [item.transform[4], item.transform[5]];
    let line = lines.find((candidate) => Math.abs(candidate.y - y) < SAME_LINE);
    if (!line) lines.push((line = { y, items: [] }));
    line.items.push({ x, text: item.str });
  }
  return lines
    .sort((a, b) => b.y - a.y)
    .map((line) =>
      line.items
        .sort((a, b) => a.x - b.x)
        .map((item) => item.text)
        .join(' '),
    )
    .join('\n');
}

const file = process.argv[2];
if (!file) {
  process.stderr.write('usage: node tests/support/pdf-text.mjs <file.pdf>\n');
  process.exit(2);
}
const data = new Uint8Array(await readFile(file));
const pdf = await getDocument({ data, isEvalSupported: false, useSystemFonts: false, verbosity: 0 }).promise;
const pages = [];
for (let number = 1; number <= pdf.numPages; number++) {
  pages.push(await pageText(await pdf.getPage(number)));
}
process.stdout.write(pages.join('\n\f\n'));
