import type { AnalysisProfile } from '../analysis/profile';
import { CHECK_FAMILY_LABELS } from './check-labels';
import { formatCount, formatScientific } from './numbers';

/** A number of the profile the form edits as text (ε's in scientific notation). */
export type NumberField =
  | 'chshTolerance'
  | 'qberTolerance'
  | 'epsilon'
  | 'minTestRounds'
  | 'reconciliationEfficiency'
  | 'epsilonEC'
  | 'epsilonPA'
  | 'significance'
  | 'driftBlocks'
  | 'missingRoundsTolerance';

/** What a profile field is called on screen and what it means, in the hint under it. */
export interface FieldMeaning {
  readonly label: string;
  readonly hint: string;
}

/** The numbers of a profile, in the form's order. */
export const NUMBER_FIELDS: readonly NumberField[] = [
  'chshTolerance',
  'qberTolerance',
  'epsilon',
  'minTestRounds',
  'reconciliationEfficiency',
  'epsilonEC',
  'epsilonPA',
  'significance',
  'driftBlocks',
  'missingRoundsTolerance',
];

/** The profile form's fields for the key length against general attacks. */
export type GeneralField = 'generalBasis' | 'generalSoundness' | 'designChshValue' | 'designQber' | 'omegaThreshold' | 'syndromeBits' | 'generalTestProbability';

/** Every field a profile is shown by: in the app's form and view, and in the PDF report. */
export type ProfileField =
  NumberField | 'mode' | 'fraction' | 'probability' | 'criterion' | 'securityModel' | 'requirePositiveKey' | 'blockingChecks' | 'spaceLikeSeparation' | GeneralField;

/** Label and meaning of every profile field, the one name the app and the PDF give it. */
export const FIELD_MEANINGS: Record<ProfileField, FieldMeaning> = {
  mode: { label: 'Test rounds chosen', hint: 'By a fixed share drawn from the seed, by each round independently, or by the log’s own test column.' },
  fraction: { label: 'Test fraction', hint: 'Exactly this share of all rounds is tested (between 0 and 1). Common: 0.01–0.5.' },
  probability: { label: 'Test probability γ', hint: 'Each round is tested with this probability, independently (between 0 and 1).' },
  chshTolerance: { label: 'CHSH tolerance η', hint: 'Accept when the win fraction reaches ω_Q − η, ω_Q ≈ 0.8536. Above 0, at most 0.25. Common: 0.01–0.05.' },
  qberTolerance: { label: 'QBER tolerance', hint: 'Accept when the error rate on the key setting is at most this (above 0, at most 0.5). Common: 0.02–0.08.' },
  epsilon: { label: 'Confidence ε', hint: 'Failure probability of every confidence bound, e.g. 1e-9. Common: 1e-6 to 1e-12.' },
  criterion: {
    label: 'Judged on',
    hint: 'Confidence bounds against the thresholds (the default), or observed values. Either way the win fraction’s lower bound must be above 3/4.',
  },
  securityModel: {
    label: 'Attack model of the key',
    hint: 'Collective: the finite key estimate, assuming i.i.d. devices. General: the entropy-accumulation key length, which needs round-by-round test selection and its settings below; CHSH is then judged against ω_thr.',
  },
  generalBasis: {
    label: 'Key against general attacks',
    hint: 'Computed from design values (the syndrome length m and threshold ω_thr follow at each run’s N), from a fixed m and ω_thr, or not at all (collective profiles only).',
  },
  generalSoundness: { label: 'Total soundness ε', hint: 'Soundness of the whole protocol, split by the optimiser, e.g. 1e-10. Above 4·2⁻⁶¹, below 1.' },
  designChshValue: { label: 'Design CHSH value S', hint: 'The S the protocol is designed for: above 2, at most 2√2 ≈ 2.8284.' },
  designQber: { label: 'Design QBER', hint: 'The error rate the syndrome length is designed for, between 0 and 0.5, e.g. 0.018.' },
  omegaThreshold: { label: 'Threshold ω_thr', hint: 'Fixed acceptance threshold on the CHSH win fraction: above 3/4, below 1.' },
  syndromeBits: { label: 'Syndrome length m (bits)', hint: 'Bits error correction discloses, fixed in advance. A whole number ≥ 0.' },
  generalTestProbability: { label: 'Test probability γ of the marking', hint: 'The probability with which the lab marks a round as a test round (its test column).' },
  minTestRounds: { label: 'Minimum test rounds', hint: 'Fewest CHSH test rounds, and fewest key-setting test rounds, a run may have. A whole number ≥ 1.' },
  reconciliationEfficiency: { label: 'Error-correction efficiency f', hint: 'Bits leaked per bit of Shannon limit, from 1 to 2. Common: 1.1–1.2.' },
  epsilonEC: { label: 'ε of error correction', hint: 'Failure probability of error correction, e.g. 1e-10.' },
  epsilonPA: { label: 'ε of privacy amplification', hint: 'Failure probability of privacy amplification, e.g. 1e-10.' },
  significance: {
    label: 'Check significance α',
    hint: 'Shared by the statistical checks (Bonferroni): each fails below α divided by their number, so an honest run fails any with probability at most α, e.g. 0.001.',
  },
  missingRoundsTolerance: {
    label: 'Missing rounds tolerated',
    hint: 'Largest share of the round indices, first to last, the log may lack (0 to below 0.5, e.g. 0.001). Missing rounds drawn for testing count as lost games anyway.',
  },
  driftBlocks: { label: 'Drift blocks', hint: 'Blocks of consecutive rounds for the stationarity check and the drift chart, 2 to 1000.' },
  requirePositiveKey: { label: 'Require a positive finite key', hint: 'ACCEPT also needs a finite key estimate above 0 bits.' },
  blockingChecks: {
    label: 'Tests that abort a run',
    hint: 'Checks whose failure aborts the run; the others only warn. Missing rounds past the tolerance and the log’s test marks always block, and stationarity blocks under collective attacks.',
  },
  spaceLikeSeparation: {
    label: 'Space-like separation',
    hint: 'Two station logs with times and the setup’s distance show whether each round’s outcomes came before light from the other station’s setting could arrive. Reported: shown, the verdict left to the other rules. Required: a run that cannot show it is INVALID, and any round without it aborts the run.',
  },
};

/** Words for the two rules of space-like separation, as the dialog offers them and the view shows them. */
export const SPACE_LIKE_SEPARATION_WORDS: Record<AnalysisProfile['spaceLikeSeparation'], string> = {
  reported: 'Reported, not judged',
  required: 'Required of every round',
};

/** Fields shown in scientific notation. */
const SCIENTIFIC: readonly NumberField[] = ['epsilon', 'epsilonEC', 'epsilonPA', 'significance'];

/** A profile number as the form writes it (text that reads back as the same number). */
export function profileNumberText(field: NumberField, value: number): string {
  return SCIENTIFIC.includes(field) ? formatScientific(value) : String(value);
}

/** A profile number as the read-only view shows it (counts with thin spaces). */
function shownProfileNumber(field: NumberField, value: number): string {
  return field === 'minTestRounds' || field === 'driftBlocks' ? formatCount(value) : profileNumberText(field, value);
}

/** The lines of a profile's read-only view: label, value, meaning. */
export function describeProfile(profile: AnalysisProfile): { label: string; value: string; hint: string }[] {
  const selection = profile.testSelection;
  const modeWords = { 'fixed-fraction': 'Fixed share from the seed', bernoulli: 'Each round independently', 'from-log': 'The log’s test column' };
  const lines = [{ ...FIELD_MEANINGS.mode, value: modeWords[selection.mode] }];
  if (selection.mode === 'fixed-fraction') lines.push({ ...FIELD_MEANINGS.fraction, value: String(selection.fraction) });
  if (selection.mode === 'bernoulli') lines.push({ ...FIELD_MEANINGS.probability, value: String(selection.probability) });
  lines.push({ ...FIELD_MEANINGS.criterion, value: profile.criterion === 'certified' ? 'Confidence bounds must clear the thresholds' : 'Observed values' });
  for (const field of NUMBER_FIELDS) lines.push({ ...FIELD_MEANINGS[field], value: shownProfileNumber(field, profile[field]) });
  const general = profile.generalAttack;
  const generalWords = general
    ? `General attacks (entropy accumulation), soundness ${general.soundness}, ${general.design ? `design S = ${general.design.chshValue}, QBER = ${general.design.qber}` : `ω_thr = ${general.omegaThreshold}, syndrome ${general.syndromeBits} bits`}${general.testProbability === undefined ? '' : `, marking γ = ${general.testProbability}`}`
    : 'General attacks (settings missing)';
  lines.push({ ...FIELD_MEANINGS.securityModel, value: (profile.securityModel ?? 'collective') === 'general' ? generalWords : 'Collective attacks (finite key estimate)' });
  lines.push({ ...FIELD_MEANINGS.requirePositiveKey, value: profile.requirePositiveKey ? 'Yes' : 'No' });
  // Versions saved before engine 2.3 lack the field; the engine reads them as reported.
  lines.push({ ...FIELD_MEANINGS.spaceLikeSeparation, value: SPACE_LIKE_SEPARATION_WORDS[profile.spaceLikeSeparation ?? 'reported'] });
  lines.push({
    ...FIELD_MEANINGS.blockingChecks,
    value: profile.blockingChecks.map((family) => CHECK_FAMILY_LABELS[family]).join(', ') || 'None',
  });
  return lines.map(({ label, value, hint }) => ({ label, value, hint }));
}
