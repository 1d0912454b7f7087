import { modelLogChunks } from '@bench/pipeline/model-log-chunks';
import { FIXTURE_SEED, steadyPair } from '@fixtures/fixture-set';
import type { LogBytes } from './runs-api';

/**
 * A log of the fixtures' steady device, in memory: `rounds` rounds drawn from the fixture seed
 * with `variant` in its last four bytes, so every variant has bytes of its own (never a duplicate).
 */
export function modelLog(rounds: number, variant: number): LogBytes {
  const seed = FIXTURE_SEED.slice(0, 56) + variant.toString(16).padStart(8, '0');
  return { bytes: Buffer.concat([...modelLogChunks({ ...steadyPair, rounds }, seed)]), name: `night-${variant}.csv` };
}
