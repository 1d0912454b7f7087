import crypto from 'node:crypto';
import type { AnalysisResult } from '@shared/analysis';
import { analyseLog, analyseStationPair, resultFingerprint } from '@shared/analysis/node';
import { RUN_REPORT_FORMAT, type RunReportDto, type RunStationsDto } from '@shared/api';
import { seedCommitment } from '../bookings/seed-commitment';
import { resultDifferences } from '../integrity/result-differences';
import { signatureProblem } from '../integrity/signed-statement';
import { signingKeyId } from '../integrity/signing-key';
import { stationPairOptions } from '../runs/station-pair-record';

/** One line of the offline verification. */
export interface ReportCheck {
  passed: boolean;
  text: string;
}

/** Differences shown when a re-derived result disagrees. */
const SHOWN_DIFFERENCES = 10;

/** Whether a parsed JSON value is a run report this version understands; else why not. */
export function reportProblem(value: unknown): string | null {
  const report = value as Partial<RunReportDto> | null;
  if (report === null || typeof report !== 'object') return 'it is not a JSON object';
  if (report.format !== RUN_REPORT_FORMAT) return `its "format" is ${JSON.stringify(report.format)}, not "${RUN_REPORT_FORMAT}"`;
  if (report.formatVersion !== 1) return `its "formatVersion" is ${JSON.stringify(report.formatVersion)}; this command reads version 1`;
  if (!report.result || !report.profile || typeof report.seed !== 'string' || !report.run) return 'it lacks its "result", "profile", "seed" or "run"';
  return null;
}

/** The report's own consistency: its result against its fingerprint, its signature against its public key (and a pinned one). */
export function reportSignatureChecks(report: RunReportDto, pinnedPublicKeyPem?: string): ReportCheck[] {
  const checks: ReportCheck[] = [];
  const recomputed = resultFingerprint(report.result);
  checks.push(
    recomputed === report.result.fingerprint
      ? { passed: true, text: `The report's result hashes to its fingerprint ${recomputed}.` }
      : { passed: false, text: `The report's result hashes to ${recomputed}, not to its fingerprint ${report.result.fingerprint}: the result was changed.` },
  );
  const { signature, publicKey } = report;
  if (!signature || !publicKey) {
    checks.push({ passed: false, text: 'The report carries no signature or no public key.' });
    return checks;
  }
  const statement = signature.statement;
  const mismatches = [
    statement.runId !== report.run.id && `run ${statement.runId} (the report is of run ${report.run.id})`,
    statement.fingerprint !== report.result.fingerprint && `fingerprint ${statement.fingerprint}`,
    statement.fileSha256 !== report.result.input.sha256 && `file ${statement.fileSha256}`,
  ].filter(Boolean);
  if (mismatches.length > 0) checks.push({ passed: false, text: `The signed statement names ${mismatches.join(', ')}, not what the report holds.` });
  const problem = signatureProblem(signature, publicKey.publicKeyPem);
  checks.push(
    problem
      ? { passed: false, text: `The Ed25519 signature fails: ${problem}.` }
      : { passed: true, text: `The Ed25519 signature by key ${signature.keyId} of ${statement.signedAt} holds.` },
  );
  if (pinnedPublicKeyPem !== undefined) {
    const pinned = signingKeyId(crypto.createPublicKey(pinnedPublicKeyPem));
    checks.push(
      pinned === signature.keyId
        ? { passed: true, text: `The signing key is the pinned key ${pinned}.` }
        : { passed: false, text: `The report is signed by key ${signature.keyId}, not by the pinned key ${pinned}.` },
    );
  } else {
    checks.push({ passed: true, text: `Signing key ${signature.keyId}: compare it with the server's published keys (GET /api/signing-keys), or pin one with --public-key.` });
  }
  return checks;
}

/**
 * The seed against the booking's commitment, published before acquisition: SHA-256 of the seed's
 * hex characters must equal it, or the seed was not the one drawn at booking.
 */
export function seedCommitmentCheck(report: RunReportDto): ReportCheck {
  const booking = report.run.booking;
  if (!booking) {
    return { passed: true, text: 'Unbooked run: its seed was drawn at upload, after the data existed, so there is no commitment to check it against.' };
  }
  const found = seedCommitment(report.seed);
  return found === booking.seedCommitment
    ? { passed: true, text: `The seed matches booking ${booking.bookingId}'s commitment ${booking.seedCommitment}, published before acquisition.` }
    : { passed: false, text: `The seed hashes to ${found}, not to booking ${booking.bookingId}'s commitment ${booking.seedCommitment}: it is not the seed drawn at booking.` };
}

/** The log against the report: same bytes, and the same result re-derived with the report's profile, mapping and seed. */
export async function rederivationChecks(report: RunReportDto, log: string): Promise<ReportCheck[]> {
  const recorded = report.result;
  const result = await analyseLog({ path: log }, { profile: report.profile.parameters, mapping: report.mapping ?? undefined, seed: report.seed });
  return [fileHashCheck('The log', result.input.sha256, recorded.input.sha256), fingerprintCheck(recorded, result, 'the log')];
}

/**
 * Two station logs against the report of their run: each file's bytes (station A's as the recorded
 * result names it, station B's as the run records it), the two together as the signed input names
 * them (`stationPairDigest`), and the same result re-derived with the report's profile, mapping,
 * seed, stated offset and geometry (`stationPairOptions`, as the worker builds them).
 */
export async function stationPairRederivationChecks(report: RunReportDto & { stations: RunStationsDto }, logA: string, logB: string): Promise<ReportCheck[]> {
  const recorded = report.result;
  const recordedA = recorded.stations?.files[0]?.sha256 ?? null;
  const recordedB = report.stations.stationB.sha256;
  const options = stationPairOptions({ fileSha256: recordedA ?? '', mapping: report.mapping, seed: report.seed, stations: report.stations }, report.profile.parameters);
  const result = await analyseStationPair({ path: logA }, { path: logB }, options);
  // The engine names both files in every result of a pair, INVALID ones included.
  const [foundA, foundB] = result.stations!.files.map((file) => file.sha256);
  const swapped = foundA === recordedB && foundB === recordedA ? " The two logs look swapped: give station A's log first." : '';
  const checks = [
    recordedA === null
      ? { passed: false, text: "The report's result names no station A log: it is not the result of two station logs." }
      : fileHashCheck("Station A's log", foundA, recordedA, swapped),
    fileHashCheck("Station B's log", foundB, recordedB, swapped),
    result.input.sha256 === recorded.input.sha256
      ? { passed: true, text: `Together they hash to the recorded SHA-256 of the pair ${recorded.input.sha256}, the input the signature names.` }
      : { passed: false, text: `Together they hash to ${result.input.sha256}, not to the recorded SHA-256 of the pair ${recorded.input.sha256}.` },
  ];
  return [...checks, fingerprintCheck(recorded, result, 'the two station logs')];
}

/** A file's SHA-256 against the recorded one. */
function fileHashCheck(file: string, found: string, recorded: string, hint = ''): ReportCheck {
  return found === recorded
    ? { passed: true, text: `${file} hashes to the recorded SHA-256 ${recorded}.` }
    : { passed: false, text: `${file} hashes to ${found}, not to the recorded SHA-256 ${recorded}: it is not the analysed file.${hint}` };
}

/** The re-derived result against the recorded one: the same fingerprint, or the fields that differ. */
function fingerprintCheck(recorded: AnalysisResult, result: AnalysisResult, source: string): ReportCheck {
  if (result.fingerprint === recorded.fingerprint) {
    return { passed: true, text: `Re-derived from ${source}, the result reproduces the fingerprint ${recorded.fingerprint} (verdict ${result.verdict}).` };
  }
  const differences = resultDifferences(recorded, result);
  const shown = differences
    .slice(0, SHOWN_DIFFERENCES)
    .map((difference) => `  ${difference.path}: recorded ${JSON.stringify(difference.stored)}, re-derived ${JSON.stringify(difference.recomputed)}`);
  const more = differences.length > SHOWN_DIFFERENCES ? [`  ... and ${differences.length - SHOWN_DIFFERENCES} more`] : [];
  return {
    passed: false,
    text: [
      `Re-derived from ${source}, the result has fingerprint ${result.fingerprint}, not ${recorded.fingerprint}; ${differences.length} field(s) differ (engine ${recorded.engineVersion} then, ${result.engineVersion} now):`,
      ...shown,
      ...more,
    ].join('\n'),
  };
}
