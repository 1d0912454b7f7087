import type { ModelRound } from '@fixtures/device-model';
import { stationCsvBytes, type StationCsvOptions } from '@fixtures/stations/station-csv';
import type { LogSource } from '../../../node/log-source';
import type { Station } from '../../station-columns';
import type { StationRow } from '../../station-row';
import { asyncSlices } from '../../testing/async-slices';

/** A log held in memory, handed out in 64 KiB pieces like a file read, openable any number of times. */
export function memorySource(bytes: Uint8Array): LogSource {
  return { open: () => asyncSlices(bytes, 65_536), bytes: bytes.length };
}

/** Both station logs of a pair, written in memory from their rows. */
export function pairSources(rows: Record<Station, Iterable<StationRow>>, options: Partial<Record<Station, StationCsvOptions>> = {}): Record<Station, LogSource> {
  return { A: memorySource(stationCsvBytes('A', rows.A, options.A)), B: memorySource(stationCsvBytes('B', rows.B, options.B)) };
}

/** How `pairSources` writes two logs of rows without times (`stationHalf`'s). */
export const UNTIMED: Record<Station, StationCsvOptions> = { A: { times: false }, B: { times: false } };

/** One station's half of rounds held as joined records (no times: write them with `UNTIMED`). */
export function stationHalf(rounds: Iterable<ModelRound>, station: Station): StationRow[] {
  return [...rounds].map((r) => ({
    round: r.round,
    setting: station === 'A' ? r.x : r.y,
    outcome: station === 'A' ? r.a : r.b,
    settingTime: null,
    outcomeTime: null,
  }));
}

/** A joined log (`round,x,y,a,b`) of rounds, in memory. */
export function joinedLog(rounds: Iterable<Pick<ModelRound, 'round' | 'x' | 'y' | 'a' | 'b'>>): LogSource {
  const text = 'round,x,y,a,b\n' + [...rounds].map((r) => `${r.round},${r.x},${r.y},${r.a},${r.b}\n`).join('');
  return memorySource(new TextEncoder().encode(text));
}
