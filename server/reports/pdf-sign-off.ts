import { SIGN_OFF_DECISION_WORDS, type ReverificationDto, type RunReportDto } from '@shared/api';
import { bullets, fields, paragraph, type Field } from './pdf-blocks';
import { formatInstant } from './pdf-dates';
import { TONE } from './pdf-style';

/** What each re-verification state means, in a few words. */
const REVERIFICATION_STATE: Record<ReverificationDto['state'], string> = {
  queued: 'queued',
  analysing: 'analysing',
  reproduced: 'reproduced: the same result digest',
  differs: 'DIFFERS from the stored result',
  failed: 'failed to run',
};

/** How many differing fields of one re-verification the report lists. */
const LISTED_DIFFERENCES = 12;

/** The shift lead's sign-off (or the upload's withdrawal), then every re-verification of the archived log. */
export function writeSignOff(doc: PDFKit.PDFDocument, report: RunReportDto): void {
  const { signOff, withdrawal } = report;
  const comment = signOff?.comment.trim() ? `: ${signOff.comment.trim()}` : '.';
  paragraph(
    doc,
    withdrawal
      ? `Upload withdrawn by ${withdrawal.userName} on ${formatInstant(withdrawal.createdAt)} as a mistake: ${withdrawal.reason} It awaits no sign-off.`
      : signOff === null
        ? 'Not signed off yet.'
        : `Signed off by ${signOff.userName} on ${formatInstant(signOff.createdAt)}. ${SIGN_OFF_DECISION_WORDS[signOff.decision]}${comment}`,
  );
  doc.y += 4;
  if (report.reverifications.length === 0) {
    paragraph(doc, 'No re-verification has been asked for.', { colour: TONE.muted });
    return;
  }
  for (const reverification of report.reverifications) {
    writeReverification(doc, reverification);
  }
}

function writeReverification(doc: PDFKit.PDFDocument, reverification: ReverificationDto): void {
  const rows: Field[] = [
    { label: `Re-verification ${reverification.id}`, value: REVERIFICATION_STATE[reverification.state] },
    { label: 'Asked for', value: `${formatInstant(reverification.createdAt)} by ${reverification.requestedBy}; finished ${formatInstant(reverification.finishedAt)}` },
    ...(reverification.seed
      ? [{ label: 'Another seed', value: `${reverification.seed}: a fresh draw of test rounds by an admin; it never replaces the verdict`, mono: true }]
      : []),
    { label: 'Engine versions', value: `stored ${reverification.storedEngineVersion}, re-analysed ${reverification.newEngineVersion ?? '–'}` },
    { label: 'Stored result digest', value: reverification.storedFingerprint, mono: true },
    { label: 'New result digest', value: reverification.newFingerprint ?? '–', mono: true },
  ];
  if (reverification.error !== null) rows.push({ label: 'Error', value: reverification.error });
  if (reverification.differenceCount > 0) rows.push({ label: 'Differing fields', value: String(reverification.differenceCount) });
  fields(doc, rows);
  const listed = reverification.differences.slice(0, LISTED_DIFFERENCES);
  bullets(
    doc,
    listed.map((difference) => `${difference.path}: stored ${asJson(difference.stored)}, re-analysed ${asJson(difference.recomputed)}`),
  );
  const more = reverification.differenceCount - listed.length;
  if (more > 0) paragraph(doc, `… and ${more} more differing fields.`, { colour: TONE.muted });
  doc.y += 4;
}

/** A stored or recomputed value as JSON; a field one side lacks is named so. */
function asJson(value: unknown): string {
  return value === undefined ? '(absent)' : JSON.stringify(value);
}
