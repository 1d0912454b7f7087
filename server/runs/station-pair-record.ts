import type { StationPairAnalysisOptions } from '@shared/analysis/node';
import { stationPairDigest } from '@shared/analysis/node';
import type { OutcomeEncoding } from '@shared/analysis';
import type { RunStationsDto } from '@shared/api';

/** What a run records of its two station logs, as the run's row and its exported report both carry it. */
export interface RecordedPair {
  /** Station A's file (the run's `file_sha256`). */
  fileSha256: string;
  mapping: Record<string, unknown> | null;
  seed: string;
  stations: Pick<RunStationsDto, 'stationB' | 'offset' | 'offsetReason' | 'geometry'>;
}

/**
 * The engine's options for a recorded pair, exactly as recorded: the seed, the outcome encoding of
 * the upload's mapping, the stated offset with its reason, the geometry kept with the run. The
 * first analysis, every re-verification and the offline `verify` build them here.
 */
export function stationPairOptions(pair: RecordedPair, profile: unknown): StationPairAnalysisOptions {
  const { offset, offsetReason, geometry } = pair.stations;
  return {
    profile,
    seed: pair.seed,
    outcomes: (pair.mapping?.outcomes as OutcomeEncoding | undefined) ?? '0/1',
    statedOffset: offset === null ? undefined : { rounds: offset, reason: offsetReason ?? '' },
    geometry: geometry ?? undefined,
  };
}

/**
 * The SHA-256 a run's result names as its input and its signature covers: the log's own, or for
 * two station logs the one digest of both (see `stationPairDigest`).
 */
export function signedInputSha256(run: { fileSha256: string; stationBSha256?: string | null }): string {
  return run.stationBSha256 ? stationPairDigest(run.fileSha256, run.stationBSha256) : run.fileSha256;
}
