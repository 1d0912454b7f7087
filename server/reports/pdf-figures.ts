import { type AnalysisProfile, type AnalysisResult, generalKeySentence, hoeffdingDeviation, type KeySummary, LOCAL_CHSH_VALUE, QUANTUM_CHSH_VALUE } from '@shared/analysis';
import { formatCount, formatFixed, formatPercent, formatPValue, formatScientific } from '@shared/format/numbers';
import { keyCautions } from './attack-model-words';
import { ensureSpace, fields, fieldsHeight, paragraph, type Field } from './pdf-blocks';
import { cautionHeight, writeCaution } from './pdf-caution';
import { PERCENT_DECIMALS, TONE, WIN_DECIMALS } from './pdf-style';

/**
 * The figures of the run, each with its Hoeffding bound; the key figures, each naming its attack
 * model, followed by the caution of each model shown.
 */
export function writeFigures(doc: PDFKit.PDFDocument, result: AnalysisResult): void {
  const { chsh, qber, key, profile } = result;
  if (chsh === null || qber === null || key === null) {
    paragraph(doc, 'No figures: the log could not be analysed.', { colour: TONE.muted });
    return;
  }
  const epsilon = `ε = ${formatScientific(profile.epsilon)}`;
  const fraction = (value: number | null) => formatFixed(value, WIN_DECIMALS);
  const percent = (value: number | null) => formatPercent(value, PERCENT_DECIMALS);
  fields(doc, [
    {
      label: 'CHSH win fraction',
      value:
        `${fraction(chsh.winFraction)}, lower bound ${fraction(chsh.winFractionLower)} (Hoeffding, ${epsilon}), the four setting pairs weighed equally; ` +
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
      value:
        `${formatPValue(chsh.log10PValue)}, the larger of the binomial tail at 3/4 (${formatPValue(chsh.log10PValueBinomial)}) ` +
        `and the balanced win fraction's Hoeffding tail (${formatPValue(chsh.log10PValueHoeffding)})`,
    },
  ]);
  doc.y += 3;
  const keyFigures: Field[] = [
    { label: 'Raw key', value: `${formatCount(key.rawBits)} bits (untested rounds with the key setting)` },
    { label: 'Finite key estimate', value: finiteKeyLine(key, profile) },
    ...(key.generalAttack ? [{ label: 'Key against general attacks', value: generalKeySentence(key.generalAttack) }] : []),
    { label: 'Asymptotic rate', value: `${formatFixed(key.asymptoticRate)} bits per raw bit (collective attacks); ${minEntropyLine(key)}` },
  ];
  const cautions = keyCautions(key);
  // A caution must never be parted from its figures by a page break.
  ensureSpace(doc, fieldsHeight(doc, keyFigures) + cautions.reduce((total, caution) => total + cautionHeight(doc, caution), 0));
  fields(doc, keyFigures);
  for (const caution of cautions) writeCaution(doc, caution);
}

/** The collective-attack key length with its parameters, and why none was computed when the bound of S is unphysical. */
function finiteKeyLine(key: KeySummary, profile: AnalysisProfile): string {
  const parameters = `f = ${profile.reconciliationEfficiency}, ε_EC = ${formatScientific(profile.epsilonEC)}, ε_PA = ${formatScientific(profile.epsilonPA)}`;
  if (key.finiteKeyReason) return `none computed (collective attacks; ${parameters}). ${key.finiteKeyReason}`;
  const none = key.finiteKeyBits === 0 ? ': no key at this size' : '';
  return `${formatCount(key.finiteKeyBits)} bits against collective (i.i.d.) attacks, at ${parameters}${none}`;
}

/** The min-entropy per round at S_low; an en dash when none is computed. */
function minEntropyLine(key: KeySummary): string {
  const value = formatFixed(key.minEntropyPerRound);
  return key.minEntropyPerRound === null
    ? `min-entropy per round ${value}${key.finiteKeyReason ? ' (none above 2√2)' : ''}`
    : `min-entropy ${value} per round at the lower bound of S`;
}
