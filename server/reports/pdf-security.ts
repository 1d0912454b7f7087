import type { AnalysisResult } from '@shared/analysis';
import { formatCount, formatScientific } from '@shared/format/numbers';
import { writeAbsentPart } from './pdf-absent-part';
import { fields, grid } from './pdf-blocks';
import { writeCaution } from './pdf-caution';
import { KEY_CAUTION, KEY_FIGURE_OF_MODEL } from './attack-model-words';

/**
 * The ε bookkeeping: the key figure that counts and its attack model, its total security parameter
 * and the terms it is made of, how they add up, and how the statistical checks share the
 * significance. The key figure's caution closes the section.
 */
export function writeSecurity(doc: PDFKit.PDFDocument, result: AnalysisResult): void {
  // Results stored before engine 2.0 have no `security`.
  const security = result.security ?? null;
  if (security === null) {
    writeAbsentPart(doc, result, 'security parameters');
    return;
  }
  const { checks } = security;
  fields(doc, [
    { label: 'Key figure that counts', value: KEY_FIGURE_OF_MODEL[security.model] },
    { label: 'Total security parameter', value: `ε_key = ${formatScientific(security.keyEpsilon)}, from the ${formatCount(security.terms.length)} terms below` },
  ]);
  doc.y += 2;
  grid(
    doc,
    [
      { header: 'Term', width: 10 },
      { header: 'Value', width: 12, align: 'right' },
      { header: 'What it bounds', width: 78 },
    ],
    security.terms.map((term) => [term.symbol, formatScientific(term.value), term.usedFor]),
  );
  fields(doc, [
    { label: 'How they add up', value: security.rule },
    {
      label: 'How the tests share α',
      value: `α/k = ${formatScientific(checks.significance)}/${formatCount(checks.count)} = ${formatScientific(checks.perCheck)} per check. ${checks.correction}`,
    },
  ]);
  writeCaution(doc, KEY_CAUTION[security.model]);
}
