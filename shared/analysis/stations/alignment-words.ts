import { formatCount, formatFixed } from '../../format/numbers';
import { AlignmentDecision } from './alignment-decision';
import { OFFSET_REACH } from './offset-scan';

/** An offset with its sign: "+3", "−3", "0". */
export function signedRounds(offset: number): string {
  return offset > 0 ? `+${formatCount(offset)}` : offset < 0 ? `−${formatCount(-offset)}` : '0';
}

/** A CHSH value with two decimals and a true minus sign ("−0.31"), never "-0.00"; an en dash when there is none. */
function shownS(value: number | null): string {
  return formatFixed(value === null ? null : Math.round(value * 100) / 100 || 0, 2).replace('-', '−');
}

/**
 * The alignment decision as a sentence. Sign convention: at offset k station A's round r meets
 * station B's round r + k, so k > 0 means B's record numbers each trigger k more than A's: it runs k
 * rounds ahead of A's; k < 0, behind. "Station B's record runs 3 rounds behind station A's: at that
 * offset S = 2.71, at zero 0.02."
 */
export function alignmentSentence(decision: AlignmentDecision): string {
  const { best, atCentre, centre } = decision;
  const where = centre === 0 ? 'at zero' : `at the stated offset (${signedRounds(centre)})`;
  if (decision.shifted) {
    const rounds = Math.abs(best.offset);
    const direction = best.offset > 0 ? 'ahead of' : 'behind';
    return `Station B's record runs ${formatCount(rounds)} ${rounds === 1 ? 'round' : 'rounds'} ${direction} station A's: at that offset S = ${shownS(best.chshValue)}, ${where} ${shownS(atCentre.chshValue)}.`;
  }
  const than = centre === 0 ? 'zero' : `the stated offset (${signedRounds(centre)})`;
  return (
    `No offset from ${signedRounds(centre - OFFSET_REACH)} to ${signedRounds(centre + OFFSET_REACH)} fits clearly better than ${than}: ` +
    `S = ${shownS(atCentre.chshValue)} ${where}, ${shownS(best.chshValue)} at the best other offset (${signedRounds(best.offset)}).`
  );
}
