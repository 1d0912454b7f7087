import { LOCAL_WIN_FRACTION, QUANTUM_WIN_FRACTION } from '../statistics/bell-bounds';
import { bestAlphaDoublePrime } from './best-alpha-double-prime';
import { intervalMinimum, IntervalSearch } from './interval-minimum';
import { keyLengthBudget } from './key-length-budget';
import { KeyLengthParameters, KeyLengthSetting } from './key-length-parameters';
import { smoothingCost } from './smoothing-cost';
import { SoundnessSplit, soundnessSplit } from './soundness-split';

/** The largest bit budget found and the parameters that give it. */
export interface OptimisedBudget {
  budget: number;
  parameters: KeyLengthParameters;
}

/** Where to look for t and for ln(α′ − 1), and how finely. */
interface SearchRegion {
  t: { low: number; high: number };
  logAlphaExcess: { low: number; high: number };
  search: IntervalSearch;
  alphaSearch: IntervalSearch;
}

// The first sweep looks everywhere: t over [¾, ω_max) (η′ is infinite at ω_max), α′ − 1 over
// [1e-9, 0.99] on a log scale (the best α′ − 1 falls like 1/√n and spans decades; K grows without
// bound as α′ → 2). The budget is peaked in t (a bit is lost about 3e-4 from the best t at
// n = 10^6): t is refined to 1e-9, ln(α′ − 1) to 1e-7, far below a hundredth of a bit.
const FIRST_REGION: SearchRegion = {
  t: { low: LOCAL_WIN_FRACTION, high: QUANTUM_WIN_FRACTION - 1e-9 },
  logAlphaExcess: { low: Math.log(1e-9), high: Math.log(0.99) },
  search: { gridPoints: 24, tolerance: 1e-9 },
  alphaSearch: { gridPoints: 24, tolerance: 1e-7 },
};
// Later sweeps only follow the optimum as the soundness split moves (it depends on α′ through a
// log): they search a small region around the last one.
const T_REACH = 2e-3;
const LOG_ALPHA_REACH = 0.3;
const LOCAL_SEARCH = { gridPoints: 5, tolerance: 1e-9 };
const LOCAL_ALPHA_SEARCH = { gridPoints: 5, tolerance: 1e-7 };
const MOST_SWEEPS = 8;
const SETTLED_BITS = 1e-4;

/**
 * The free parameters that maximise the bit budget x (`keyLengthBudget`) for one setting and total
 * soundness, by block-coordinate ascent. Each sweep fixes α′ and settles the two closed-form
 * blocks together, the soundness split (`soundnessSplit`) and α″ (`bestAlphaDoublePrime`), then
 * maximises over t and α′ jointly by nested one-dimensional searches (`intervalMinimum`: a grid
 * scan, then golden section), α′ inside t since the two are tightly coupled. No sweep lowers x;
 * sweeps stop when one gains less than 1e-4 bits.
 */
export function optimiseKeyLength(setting: KeyLengthSetting, totalSoundness: number): OptimisedBudget {
  let alphaPrime = 1 + 1 / Math.sqrt(setting.rounds);
  let alphaDoublePrime = alphaPrime;
  let region = FIRST_REGION;
  let best: OptimisedBudget | undefined;
  for (let sweep = 0; sweep < MOST_SWEEPS; sweep++) {
    let split: SoundnessSplit;
    ({ split, alphaDoublePrime } = settledSoundness(setting.rounds, totalSoundness, alphaPrime, alphaDoublePrime));
    const parametersAt = (t: number, logAlphaExcess: number): KeyLengthParameters => ({ t, alphaPrime: 1 + Math.exp(logAlphaExcess), alphaDoublePrime, ...split });
    const bestAlphaAt = (t: number) =>
      intervalMinimum((logExcess) => -keyLengthBudget(setting, parametersAt(t, logExcess)), region.logAlphaExcess.low, region.logAlphaExcess.high, region.alphaSearch);
    const tangent = intervalMinimum((t) => bestAlphaAt(t).value, region.t.low, region.t.high, region.search);
    const logAlphaExcess = bestAlphaAt(tangent.at).at;
    const candidate = { budget: -tangent.value, parameters: parametersAt(tangent.at, logAlphaExcess) };
    const gain = best === undefined ? Infinity : candidate.budget - best.budget;
    if (best === undefined || gain > 0) {
      best = candidate;
    }
    if (gain < SETTLED_BITS) {
      break;
    }
    alphaPrime = candidate.parameters.alphaPrime;
    region = localRegion(tangent.at, logAlphaExcess);
  }
  return best!;
}

/** The soundness split and α″, each the other's best (both closed forms), for a given α′. */
function settledSoundness(rounds: number, totalSoundness: number, alphaPrime: number, startAlphaDoublePrime: number): { split: SoundnessSplit; alphaDoublePrime: number } {
  let alphaDoublePrime = startAlphaDoublePrime;
  let split = soundnessSplit(totalSoundness, alphaPrime, alphaDoublePrime);
  // ε″ depends on α″ only through a log: a handful of rounds settle it to 1e-12.
  for (let round = 0; round < 20; round++) {
    const next = bestAlphaDoublePrime(rounds, smoothingCost(split.epsilonDoublePrime), split.epsilonEA);
    split = soundnessSplit(totalSoundness, alphaPrime, next);
    const settled = Math.abs(next - alphaDoublePrime) < 1e-12;
    alphaDoublePrime = next;
    if (settled) break;
  }
  return { split, alphaDoublePrime };
}

function localRegion(t: number, logAlphaExcess: number): SearchRegion {
  return {
    t: { low: Math.max(FIRST_REGION.t.low, t - T_REACH), high: Math.min(FIRST_REGION.t.high, t + T_REACH) },
    logAlphaExcess: {
      low: Math.max(FIRST_REGION.logAlphaExcess.low, logAlphaExcess - LOG_ALPHA_REACH),
      high: Math.min(FIRST_REGION.logAlphaExcess.high, logAlphaExcess + LOG_ALPHA_REACH),
    },
    search: LOCAL_SEARCH,
    alphaSearch: LOCAL_ALPHA_SEARCH,
  };
}
