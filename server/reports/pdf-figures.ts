import type { AnalysisResult } from '../../shared/analysis/result';
import { generalKeySentence } from '../../shared/analysis/report/general-key-words';
import { LOCAL_CHSH_VALUE, QUANTUM_CHSH_VALUE } from '../../shared/analysis/statistics/bell-bounds';
import { hoeffdingDeviation } from '../../shared/analysis/statistics/hoeffding';
import { formatCount, formatFixed, formatLog10, formatPercent, formatScientific } from '../../shared/format/numbers';
import { COLLECTIVE_ATTACK_CAUTION } from '../mail/verdict-mail';
import { ensureSpace, fields, paragraph, textColumn, useType } from './pdf-blocks';
import { PERCENT_DECIMALS, TONE, TYPE, WIN_DECIMALS } from './pdf-style';

/**
 * The figures of the run, each with its Hoeffding deviation or bound; the key figures, which hold
 * only against collective attacks, followed by the caution that says so.
 */
export function writeFigures(doc: PDFKit.PDFDocument, result: AnalysisResult): void {
  const { chsh, qber, key, profile } = result;
  if (chsh === null || qber === null || key === null) {
    paragraph(doc, 'No figures: the log could not be analysed.', { colour: TONE.muted });
    return;
  }
  const epsilon = `ε = ${formatScientific(profile.epsilon)}`;
  const percent = (value: number | null) => formatPercent(value, PERCENT_DECIMALS);
  fields(doc, [
    {
      label: 'CHSH win fraction',
      value:
        `${formatFixed(chsh.winFraction, WIN_DECIMALS)} ± ${formatFixed(hoeffdingDeviation(chsh.rounds, profile.epsilon), WIN_DECIMALS)} (Hoeffding, ${epsilon}); ` +
        `${formatCount(chsh.wins)} won of ${formatCount(chsh.rounds)} CHSH test rounds`,
    },
    {
      label: 'CHSH value S',
      value:
        `${formatFixed(chsh.S, 4)}, lower bound ${formatFixed(key.chshValueLower, 4)} from the win fraction's bound; ` +
        `local bound ${LOCAL_CHSH_VALUE}, quantum bound 2√2 ≈ ${formatFixed(QUANTUM_CHSH_VALUE, 4)}`,
    },
    {
      label: 'QBER on the key setting',
      value:
        `${percent(qber.rate)} ± ${percent(hoeffdingDeviation(qber.rounds, profile.epsilon))} (Hoeffding, ${epsilon}); ` +
        `${formatCount(qber.errors)} disagreements in ${formatCount(qber.rounds)} key-setting test rounds; ` +
        `untested key rounds ≤ ${percent(qber.untestedRateUpper)} (sampling without replacement)`,
    },
    {
      label: 'p-value against local models',
      value: `${formatLog10(chsh.log10PValue)} (binomial tail at 3/4); Azuma–Hoeffding form ${formatLog10(chsh.log10PValueHoeffding)}`,
    },
  ]);
  doc.y += 3;
  fields(doc, [
    { label: 'Raw key', value: `${formatCount(key.rawBits)} bits (untested rounds with the key setting)` },
    {
      label: 'Finite key estimate',
      value: `${formatCount(key.finiteKeyBits)} bits${key.finiteKeyBits === 0 ? ' (no key at this size)' : ''}, at f = ${profile.reconciliationEfficiency}, ε_EC = ${formatScientific(profile.epsilonEC)}, ε_PA = ${formatScientific(profile.epsilonPA)}`,
    },
    ...(key.generalAttack ? [{ label: 'Key against general attacks', value: generalKeySentence(key.generalAttack) }] : []),
    {
      label: 'Asymptotic rate',
      value: `${formatFixed(key.asymptoticRate)} bits per raw bit; min-entropy ${formatFixed(key.minEntropyPerRound)} per round at the lower bound of S`,
    },
  ]);
  writeCaution(doc);
}

/** The collective-attack caution, on an amber rule beside the key figures. */
function writeCaution(doc: PDFKit.PDFDocument): void {
  const { left, width } = textColumn(doc);
  const indent = 8;
  useType(doc, 'body', TYPE.small, TONE.threshold);
  const height = doc.heightOfString(COLLECTIVE_ATTACK_CAUTION, { width: width - indent });
  ensureSpace(doc, height + 4);
  const top = doc.y + 1;
  doc.rect(left, top - 1, 2, height + 2).fill(TONE.threshold);
  useType(doc, 'body', TYPE.small, TONE.threshold).text(COLLECTIVE_ATTACK_CAUTION, left + indent, top, { width: width - indent });
  doc.y += 3;
}
