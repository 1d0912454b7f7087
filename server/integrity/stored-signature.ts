import type { ResultSignatureDto } from '@shared/api';
import type { RunRecord } from '../runs/run.model';
import { signedInputSha256 } from '../runs/station-pair-record';

/** The signature stored with a run's result, with the statement it covers rebuilt from the run. */
export function storedSignature(run: RunRecord): ResultSignatureDto | null {
  if (!run.signature || !run.signingKeyId || !run.signedAt || !run.result) return null;
  return {
    algorithm: 'Ed25519',
    keyId: run.signingKeyId.trim(),
    statement: { runId: run.id, fileSha256: signedInputSha256(run), fingerprint: run.result.fingerprint, signedAt: run.signedAt.toISOString() },
    signature: run.signature,
  };
}
