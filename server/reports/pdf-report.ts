import PDFDocument from 'pdfkit';
import type { RunReportDto } from '@shared/api';
import { heading } from './pdf-blocks';
import { writeChecks } from './pdf-checks';
import { writeCriteria } from './pdf-criteria';
import { writeDriftChart } from './pdf-drift-chart';
import { writeFigures } from './pdf-figures';
import { fontFile, registerFonts } from './pdf-fonts';
import { writeFooters } from './pdf-footer';
import { writeHeader } from './pdf-header';
import { writeMissingRounds } from './pdf-missing-rounds';
import { writeProvenance } from './pdf-provenance';
import { writeSecurity } from './pdf-security';
import { writeSettingPairs } from './pdf-setting-pairs';
import { writeSettingsTable } from './pdf-settings-table';
import { writeSignOff } from './pdf-sign-off';
import { writeSignature } from './pdf-signature';
import { isStationPair, writeStations } from './pdf-stations';
import { PAGE } from './pdf-style';
import { writeVerdict, writeWithdrawn } from './pdf-verdict';

/**
 * The sections after the verdict, in order; `keepWith` keeps a title on the page of its first lines;
 * `shown`, when given, says whether the report has the section at all.
 */
const SECTIONS: ReadonlyArray<{
  title: string;
  keepWith?: number;
  shown?: (report: RunReportDto) => boolean;
  write: (doc: PDFKit.PDFDocument, report: RunReportDto) => void;
}> = [
  { title: 'Acceptance criteria', write: (doc, report) => writeCriteria(doc, report.result) },
  { title: 'CHSH by setting pair', keepWith: 110, write: (doc, report) => writeSettingPairs(doc, report.result) },
  { title: 'Missing rounds', write: (doc, report) => writeMissingRounds(doc, report.result) },
  { title: 'Two station logs', keepWith: 90, shown: isStationPair, write: writeStations },
  { title: 'Bell-test statistics and key estimates', write: (doc, report) => writeFigures(doc, report.result) },
  { title: 'Security parameters', keepWith: 110, write: (doc, report) => writeSecurity(doc, report.result) },
  { title: 'Drift across the run', keepWith: 170, write: (doc, report) => writeDriftChart(doc, report.result) },
  { title: 'Rounds per setting pair', keepWith: 90, write: (doc, report) => writeSettingsTable(doc, report.result) },
  { title: 'Statistical tests of the log', write: (doc, report) => writeChecks(doc, report.result) },
  { title: 'Provenance', write: writeProvenance },
  { title: 'Signature', write: writeSignature },
  { title: 'Sign-off and re-verifications', write: writeSignOff },
];

/**
 * The PDF report of a run, for a signature-and-file workflow: A4, every font embedded (DejaVu),
 * all text real text, the drift chart in vector lines. Returns the document already ended: a
 * readable stream of the PDF's bytes.
 */
export function createPdfReport(report: RunReportDto): PDFKit.PDFDocument {
  const doc = new PDFDocument({
    size: PAGE.size,
    margins: { top: PAGE.margin, left: PAGE.margin, right: PAGE.margin, bottom: PAGE.bottomMargin },
    // Passing the default font here keeps pdfkit from ever loading a standard (non-embedded) font.
    font: fontFile('body'),
    bufferPages: true,
    lang: 'en',
    displayTitle: true,
    info: {
      Title: `Bellkeep run report, run ${report.run.id}`,
      Subject: `${report.result.verdict} · ${report.run.setupName} · ${report.run.originalName}`,
      Creator: 'Bellkeep',
      CreationDate: new Date(report.exportedAt),
    },
  });
  registerFonts(doc);
  writeHeader(doc, report);
  writeVerdict(doc, report.result);
  if (report.withdrawal) writeWithdrawn(doc, report.withdrawal);
  for (const section of SECTIONS) {
    if (section.shown && !section.shown(report)) continue;
    heading(doc, section.title, section.keepWith);
    section.write(doc, report);
  }
  writeFooters(doc, report);
  doc.end();
  return doc;
}
