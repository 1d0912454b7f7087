import type { AnalysisResult } from '@shared/analysis';
import { resultFingerprint } from '@shared/analysis/node';
import { formatCount } from '@shared/format/numbers';
import { VERDICT_STATES, type VerificationCheckDto, type VerificationDto } from '@shared/api';
import { checkTrailChain } from '../audit/trail-check';
import type { Models } from '../database/models';
import { HttpError } from '../http/http-error';
import { StoredLogCorruptError, StoredLogMissingError, type LogStore } from '../storage/log-store';
import { signatureProblem } from './signed-statement';
import type { SigningKeysService } from './signing-keys.service';
import { storedSignature } from './stored-signature';

export interface VerificationService {
  /**
   * Checks a finished run's stored result against its fingerprint and signature, its archived file
   * against its SHA-256, and the system trail (which holds the run's history) against its hash chain.
   */
  verify(runId: number): Promise<VerificationDto>;
}

export function createVerificationService(models: Models, logStore: LogStore, signingKeys: SigningKeysService): VerificationService {
  function fingerprintCheck(result: AnalysisResult): VerificationCheckDto {
    const recomputed = resultFingerprint(result);
    return recomputed === result.fingerprint
      ? { check: 'result-fingerprint', passed: true, detail: `The stored result hashes to its fingerprint ${recomputed}.` }
      : {
          check: 'result-fingerprint',
          passed: false,
          detail: `The stored result hashes to ${recomputed}, not to its recorded fingerprint ${result.fingerprint}: the result was changed after it was stored.`,
        };
  }

  async function signatureCheck(run: InstanceType<Models['Run']>): Promise<VerificationCheckDto> {
    const signature = storedSignature(run);
    if (!signature) return { check: 'signature', passed: false, detail: 'The stored result carries no signature.' };
    const key = await signingKeys.find(signature.keyId);
    if (!key) return { check: 'signature', passed: false, detail: `The result is signed with key ${signature.keyId}, which this server never listed.` };
    const problem = signatureProblem(signature, key.publicKeyPem);
    return problem
      ? {
          check: 'signature',
          passed: false,
          detail: `The Ed25519 signature by key ${signature.keyId} fails: ${problem} (run ${run.id}, file, fingerprint and time as stored now).`,
        }
      : {
          check: 'signature',
          passed: true,
          detail: `The Ed25519 signature by key ${signature.keyId} of ${signature.statement.signedAt} holds for run ${run.id}, its file and its fingerprint.`,
        };
  }

  async function archiveCheck(sha256: string): Promise<VerificationCheckDto> {
    const recorded = await models.ArchiveFile.findByPk(sha256);
    const failed = (detail: string): VerificationCheckDto => ({ check: 'archive-file', passed: false, detail });
    // The store checks the bytes against their SHA-256 as they are read; here they are only counted.
    let bytes = 0;
    try {
      for await (const chunk of logStore.read(sha256) as AsyncIterable<Buffer>) bytes += chunk.length;
    } catch (error) {
      if (error instanceof StoredLogMissingError) return failed(`The archived file ${sha256} fails: it is missing.`);
      if (error instanceof StoredLogCorruptError && error.foundSha256) {
        return failed(`The archived file hashes to ${error.foundSha256}, not to the SHA-256 ${sha256} recorded at upload: its bytes were changed.`);
      }
      if (error instanceof StoredLogCorruptError) return failed(`The archived file ${sha256} fails: ${error.problem}.`);
      return failed(`The archived file ${sha256} fails: it cannot be read (${(error as Error).message}).`);
    }
    if (recorded && recorded.bytes !== bytes) {
      return failed(`The archived file is ${formatCount(bytes)} bytes, not the ${formatCount(recorded.bytes)} recorded at upload.`);
    }
    return { check: 'archive-file', passed: true, detail: `The archived file (${formatCount(bytes)} bytes) still hashes to its SHA-256 ${sha256}.` };
  }

  async function trailCheck(): Promise<VerificationCheckDto> {
    const trail = await checkTrailChain(models.AuditEvent.sequelize!);
    if (trail.intact) {
      return {
        check: 'system-trail',
        passed: true,
        detail: `The system trail’s hash chain holds: all ${formatCount(trail.events)} events are linked in order and each still hashes to its link.`,
      };
    }
    const more =
      trail.problemCount > 1 ? ` ${formatCount(trail.problemCount - 1)} more ${trail.problemCount === 2 ? 'problem is' : 'problems are'} listed under Audit, System trail.` : '';
    return { check: 'system-trail', passed: false, detail: `The system trail’s hash chain is broken. ${trail.problems[0]}${more}` };
  }

  return {
    async verify(runId) {
      const run = await models.Run.findByPk(runId);
      if (!run) throw HttpError.notFound(`There is no run with id ${runId}.`);
      if (!VERDICT_STATES.includes(run.state) || !run.result) {
        throw HttpError.conflict(`Run ${runId} is ${run.state}: only a run with a stored result can be verified.`);
      }
      const files = run.stationBSha256 ? [run.fileSha256, run.stationBSha256] : [run.fileSha256];
      const archive = await Promise.all(files.map((sha256) => archiveCheck(sha256)));
      const checks = [fingerprintCheck(run.result), await signatureCheck(run), ...archive, await trailCheck()];
      return { runId, checkedAt: new Date().toISOString(), intact: checks.every((check) => check.passed), checks };
    },
  };
}
