import type { RunReportDto } from '@shared/api';
import { SIGNED_STATEMENT_PREFIX } from '../integrity/signed-statement';
import { fields, monoBlock, paragraph } from './pdf-blocks';
import { formatInstant } from './pdf-dates';
import { TONE, TYPE } from './pdf-style';

/**
 * The server's signature over the result: what was signed, the signature and the public key that
 * checks it, so the statement can be verified offline; or a plain sentence when there is none.
 */
export function writeSignature(doc: PDFKit.PDFDocument, report: RunReportDto): void {
  const { signature, publicKey } = report;
  if (signature === null) {
    paragraph(doc, 'This result carries no signature.');
    return;
  }
  const { statement } = signature;
  fields(doc, [
    { label: 'Algorithm', value: signature.algorithm },
    { label: 'Key id', value: signature.keyId, mono: true },
    { label: 'Signed at', value: formatInstant(statement.signedAt) },
    { label: 'Signed bytes', value: `${JSON.stringify(SIGNED_STATEMENT_PREFIX)}, then the canonical JSON of the four fields below (keys sorted, no whitespace), in UTF-8` },
    { label: '  runId', value: String(statement.runId), mono: true },
    { label: '  fileSha256', value: statement.fileSha256, mono: true },
    { label: '  fingerprint', value: statement.fingerprint, mono: true },
    { label: '  signedAt', value: statement.signedAt, mono: true },
  ]);
  paragraph(doc, 'Signature (Ed25519, base64)', { size: TYPE.small, colour: TONE.muted });
  monoBlock(doc, signature.signature);
  if (publicKey === null) {
    paragraph(doc, `The public key ${signature.keyId} is not in this report; ask the server for it before checking the signature.`);
    return;
  }
  const keyState = publicKey.retiredAt === null ? 'in use' : `retired ${formatInstant(publicKey.retiredAt)}`;
  paragraph(doc, `Public key ${publicKey.keyId} (SubjectPublicKeyInfo, PEM; created ${formatInstant(publicKey.createdAt)}, ${keyState})`, { size: TYPE.small, colour: TONE.muted });
  monoBlock(doc, publicKey.publicKeyPem.trim());
}
