import { LIKELY_PASS } from '@shared/planner/plan-rounds';
import { formatPercent } from '@shared/format/numbers';

/** How a pass probability is shown: its percentage, an icon and a word, never the colour alone. */
export interface PassLook {
  readonly percent: string;
  readonly word: 'likely' | 'unlikely';
  /** Material Symbols name. */
  readonly icon: string;
  /** Names the `bk-tone-*` class. */
  readonly tone: 'accept' | 'abort';
}

/** The look of a pass probability: likely from the planner's own "likely pass", 99 %, up. */
export function passLook(probability: number): PassLook {
  const likely = probability >= LIKELY_PASS;
  return { percent: formatProbability(probability), word: likely ? 'likely' : 'unlikely', icon: likely ? 'check_circle' : 'cancel', tone: likely ? 'accept' : 'abort' };
}

/** Shown to one decimal, the last tenth of a percent at either end said as a bound, so a near-certainty never reads as 100 % or 0 %. */
const SHOWN_RESOLUTION = 0.001;

/** A probability as a percentage: 0.8765 → "87.7 %", 0.99995 → "> 99.9 %", 1 → "100.0 %". */
export function formatProbability(probability: number): string {
  if (probability > 1 - SHOWN_RESOLUTION && probability < 1) return `> ${formatPercent(1 - SHOWN_RESOLUTION, 1)}`;
  if (probability > 0 && probability < SHOWN_RESOLUTION) return `< ${formatPercent(SHOWN_RESOLUTION, 1)}`;
  return formatPercent(probability, 1);
}
