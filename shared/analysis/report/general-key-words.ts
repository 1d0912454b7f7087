import { formatCount, formatFixed, formatScientific } from '../../format/numbers';
import type { GeneralKeySummary } from './general-key-summary';

/** The general-attack key figure in one sentence, for the mail and the PDF report. */
export function generalKeySentence(general: GeneralKeySummary): string {
  const figure = general.bits > 0 ? `${formatCount(general.bits)} bits` : 'no key';
  const setting = `over the ${formatCount(general.rounds)} CHSH test and key-setting generation rounds, γ′ = ${formatFixed(general.testProbability, 4)} (γ = ${formatFixed(general.logTestProbability, 4)} of all ${formatCount(general.logRounds)}), ω_thr = ${formatFixed(general.omegaThreshold, 6)}, syndrome ${formatCount(general.syndromeBits)} bits, soundness ${formatScientific(general.soundness)}`;
  return `${figure} against general attacks (entropy accumulation; ${setting})${general.reason ? `. ${general.reason}` : ''}`;
}
