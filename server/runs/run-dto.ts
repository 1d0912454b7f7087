import { type AnalysisResult, QUANTUM_WIN_FRACTION } from '@shared/analysis';
import type { MailDeliveryDto, ResultSignatureDto, RunDto, RunSummaryDto, SignOffDto, WithdrawalDto } from '@shared/api';

/** One row of the runs query in runs.service.ts: the run joined with the names it shows. */
export interface RunRow {
  id: number;
  setup_id: number;
  setup_name: string;
  profile_version_id: number;
  profile_name: string;
  profile_version: number;
  chsh_tolerance: number | null;
  /** ω_thr of a general-attack profile's result, which replaces ω_Q − tolerance. */
  general_threshold: number | null;
  state: RunSummaryDto['state'];
  progress: number;
  verdict: RunSummaryDto['verdict'];
  win_fraction: number | null;
  qber: number | null;
  chsh_value: number | null;
  finite_key_bits: number | null;
  uploaded_by_name: string;
  acquired_on: string | null;
  created_at: Date;
  finished_at: Date | null;
  duplicate_of: number | null;
  booking_id: number | null;
  attempt: number | null;
  replay_of: number | null;
  signed_off: boolean;
  station_pair: boolean;
  withdrawn: boolean;
  file_sha256: string;
  fingerprint: string | null;
}

export function toRunSummary(row: RunRow): RunSummaryDto {
  return {
    id: row.id,
    setupId: row.setup_id,
    setupName: row.setup_name,
    profileVersionId: row.profile_version_id,
    profileName: row.profile_name,
    profileVersion: row.profile_version,
    state: row.state,
    progress: row.progress,
    verdict: row.verdict,
    winFraction: row.win_fraction === null ? null : Number(row.win_fraction),
    // The acceptance threshold of the CHSH criterion: ω_Q − tolerance, or ω_thr under the general model (see shared/analysis).
    winThreshold: row.general_threshold !== null ? Number(row.general_threshold) : row.chsh_tolerance === null ? null : QUANTUM_WIN_FRACTION - Number(row.chsh_tolerance),
    qber: row.qber === null ? null : Number(row.qber),
    chshValue: row.chsh_value === null ? null : Number(row.chsh_value),
    finiteKeyBits: row.finite_key_bits === null ? null : Number(row.finite_key_bits),
    uploadedBy: row.uploaded_by_name,
    acquiredOn: row.acquired_on,
    createdAt: row.created_at.toISOString(),
    finishedAt: row.finished_at?.toISOString() ?? null,
    duplicateOf: row.duplicate_of,
    bookingId: row.booking_id,
    attempt: row.attempt,
    replayOf: row.replay_of,
    signedOff: row.signed_off,
    stationPair: row.station_pair,
    withdrawn: row.withdrawn,
    fileSha256: row.file_sha256,
    fingerprint: row.fingerprint,
  };
}

export interface RunDetails {
  file: RunDto['file'];
  seed: string;
  mapping: Record<string, unknown> | null;
  notes: string;
  error: string | null;
  attempts: number;
  analysedBy: string | null;
  startedAt: Date | null;
  heartbeatAt: Date | null;
  result: AnalysisResult | null;
  signature: ResultSignatureDto | null;
  signOff: SignOffDto | null;
  withdrawal: WithdrawalDto | null;
  uploadedById: number | null;
  fourEyes: boolean;
  deliveries: MailDeliveryDto[];
  booking: RunDto['booking'];
  stations: RunDto['stations'];
}

export function toRunDto(row: RunRow, details: RunDetails): RunDto {
  return { ...toRunSummary(row), ...details, startedAt: details.startedAt?.toISOString() ?? null, heartbeatAt: details.heartbeatAt?.toISOString() ?? null };
}
