import { missingRoundsState, type MissingRoundsState, type MissingRoundsSummary, missingShareText } from '@shared/analysis';
import { formatCount } from '@shared/format/numbers';

/** The missing rounds of a log: its state and the sentence with every figure. */
export interface MissingRoundsWords {
  state: MissingRoundsState;
  /** Whether more rounds are missing than the profile tolerates (the log-integrity check then fails). */
  overTolerance: boolean;
  /** `12 of 24 000 triggers missing (0.050 %) in round indices 0–23 999, 24 tolerated; 6 of them drawn for testing, …` */
  sentence: string;
}

/** The missing-rounds figures of a result in words, for the mail and the PDF. */
export function missingRoundsWords(summary: MissingRoundsSummary): MissingRoundsWords {
  const { firstRound, lastRound, triggers, missing, tolerated, drawnForTesting } = summary;
  const overTolerance = missing > tolerated;
  const drawn = missing === 0 ? '' : `; ${formatCount(drawnForTesting)} of them drawn for testing, each counted as a lost CHSH game`;
  return {
    state: missingRoundsState(summary),
    overTolerance,
    sentence:
      `${formatCount(missing)} of ${formatCount(triggers)} triggers missing (${missingShareText(summary)}) ` +
      `in round indices ${formatCount(firstRound)}–${formatCount(lastRound)}, ${formatCount(tolerated)} tolerated${drawn}.`,
  };
}
