import { KESTREL_FEN_TIMING, STATION_PAIR_SEED, stationRecord, type StationPairOptions } from '@fixtures/stations/station-pair';
import { SLIP_PROBABILITY, SLIP_PS } from '@fixtures/stations/station-scenarios';
import type { AnalysisResult } from '@shared/analysis';
import { analyseStationPair, type StationPairAnalysisOptions } from '@shared/analysis/node';
import { pairSources } from '@shared/analysis/stations/node/testing/pair-sources';
import type { StationCsvOptions } from '@fixtures/stations/station-csv';
import type { RunStationsDto, StationGeometryDto } from '@shared/api';
import { SEED } from '@tests/cli/run-analyse';
import { NIGHTLY } from '@tests/support/fixture-results';

// Runs of two station logs for the report and mail specs: real engine results on pairs written by
// the committed generator (fixtures/stations), with the run's record of the pair beside them.

/** Triggers of each generated night: over the nightly profile's 1 000 key-setting test rounds. */
const ROUNDS = 16_000;

/** Station A's and station B's file names as uploaded. */
export const STATION_FILE_NAMES = { A: 'north-hall-2025-03-13.csv', B: 'mill-lane-2025-03-13.csv' } as const;

/** The run this night's re-run at a stated offset re-runs. */
export const REALIGNED_FROM = 417;

/** The reason a shift lead gave for the stated offset. */
export const OFFSET_REASON = "Mill Lane's counter was started four triggers late";

/** A finished run of two station logs: the engine's result and the run's record of the pair. */
export interface StationPairRun {
  result: AnalysisResult;
  stations: RunStationsDto;
}

/** The nights the specs show. */
export type StationPairNight =
  /** Aligned, both logs timed, the setup's geometry: every round space-like separated. */
  | 'aligned'
  /** As aligned, with station B's clock slipping 5 µs late in 1 % of the rounds. */
  | 'clock-slips'
  /** Station B's record runs 3 rounds ahead; the setup had no geometry: refused, timing unchecked. */
  | 'shifted'
  /** Station B's record runs 4 rounds behind, re-run at that stated offset; B's log has no times. */
  | 'stated-offset';

const NIGHTS: Record<
  StationPairNight,
  { generator: StationPairOptions; geometry: StationGeometryDto | null; csv?: Partial<Record<'A' | 'B', StationCsvOptions>>; offset?: number }
> = {
  aligned: { generator: { rounds: ROUNDS }, geometry: KESTREL_FEN_TIMING.geometry },
  'clock-slips': {
    generator: { rounds: ROUNDS, clockSlip: { station: 'B', probability: SLIP_PROBABILITY, picoseconds: SLIP_PS } },
    geometry: KESTREL_FEN_TIMING.geometry,
  },
  shifted: { generator: { rounds: ROUNDS, shiftB: 3 }, geometry: null },
  'stated-offset': { generator: { rounds: ROUNDS, shiftB: -4 }, geometry: KESTREL_FEN_TIMING.geometry, csv: { B: { times: false } }, offset: -4 },
};

/** One night of the Fen link analysed as two station logs under the nightly profile, with the fixed test seed. */
export async function stationPairRun(night: StationPairNight): Promise<StationPairRun> {
  const { generator, geometry, csv, offset } = NIGHTS[night];
  const logs = pairSources({ A: stationRecord('A', generator, STATION_PAIR_SEED), B: stationRecord('B', generator, STATION_PAIR_SEED) }, csv);
  const options: StationPairAnalysisOptions = {
    profile: NIGHTLY.parameters,
    seed: SEED,
    ...(geometry === null ? {} : { geometry }),
    ...(offset === undefined ? {} : { statedOffset: { rounds: offset, reason: OFFSET_REASON } }),
  };
  const result = await analyseStationPair(logs.A, logs.B, options);
  const stationB = result.stations!.files[1];
  return {
    result,
    stations: {
      stationB: { sha256: stationB.sha256, bytes: stationB.bytes, originalName: STATION_FILE_NAMES.B },
      offset: offset ?? null,
      offsetReason: offset === undefined ? null : OFFSET_REASON,
      realignedFrom: offset === undefined ? null : REALIGNED_FROM,
      geometry,
    },
  };
}
