import { type AnalysisResult, type CheckResult, generalKeySentence, winThresholdOf } from '@shared/analysis';
import type { RunDto } from '@shared/api';
import { bookingWords } from '@shared/format/booking-words';
import { checkLabel } from '@shared/format/check-labels';
import { formatCount, formatFixed, formatPercent, formatPValue, formatScientific } from '@shared/format/numbers';
import { KEY_FIGURE_OF_MODEL, keyCautions } from '../reports/attack-model-words';
import { missingRoundsWords } from '../reports/missing-rounds-words';
import { SHIFT_REMEDY, stationFilesText, statedOffsetSentence, TIMING_CAUTION, timingNotCheckedSentence, timingSentence } from '../reports/station-words';
import { mailHtml, mailText, type MailBlock } from './mail-blocks';
import type { OutgoingMail } from './mailer';
import { verdictSentence } from '@shared/format/verdict-sentence';

/** The verdict as the subject says it: INVALID is no verdict at all. */
const SUBJECT_VERDICT = { ACCEPT: 'ACCEPT', ABORT: 'ABORT', INVALID: 'no verdict was possible' } as const;

/**
 * Whom a verdict mail goes to: `signers` may sign the run off and get the link to do it; the
 * `uploader`'s own mail (the setup's four-eyes rule forbids them to sign it) offers the run instead.
 */
export type VerdictAudience = 'signers' | 'uploader';

/**
 * The verdict mail of a finished run: a subject that says, in a sentence, which run of which setup
 * was analysed (its attempt, or that it was unbooked), the verdict, and that it awaits sign-off;
 * booked or unbooked with the attempts; the uploader's notes; for two station logs, both files, the
 * stated offset, a shift found and the timing; the reasons for an abort; the key figures with their
 * bounds, the missing rounds when any, the key figure's total ε and attack model, and the caution of
 * each model shown; the tests of the log that failed or warned, each by its label; a link straight to
 * the run's sign-off, or for its uploader under the four-eyes rule, to the run and who signs it.
 */
export function composeVerdictMail(run: RunDto, publicUrl: string, recipients: string[], audience: VerdictAudience = 'signers'): OutgoingMail & { html: string } {
  const result = run.result;
  if (!result) throw new Error(`Run ${run.id} has no result to mail.`);
  const verdict = result.verdict;
  const messagesOf = (status: CheckResult['status']) => result.checks.filter((check) => check.status === status).map((check) => `${checkLabel(check.id)}: ${check.message}`);
  const booking = bookingWords(run);
  const attempt = run.booking && run.booking.attempt > 1 ? ` (attempt ${run.booking.attempt})` : run.booking ? '' : ' (unbooked)';
  const blocks: MailBlock[] = [
    {
      kind: 'lead',
      headline: `Run ${run.id} on ${run.setupName}: ${verdict}.`,
      detail: `${verdictSentence(result)} Acquired ${run.acquiredOn ?? 'on an unrecorded date'}; profile ${run.profileName} v${run.profileVersion}; uploaded by ${run.uploadedBy}.`,
    },
    ...listUnlessEmpty(`${booking.state}:`, [booking.headline, ...booking.details]),
    ...(run.notes.trim() ? [{ kind: 'paragraph', text: `Uploader’s notes: ${run.notes.trim()}` } as const] : []),
    ...stationBlocks(run, result),
    ...listUnlessEmpty('Reasons:', result.reasons),
    ...listUnlessEmpty('Figures:', figureLines(result), result.key ? keyCautions(result.key) : []),
    ...listUnlessEmpty('Tests of the log that failed:', messagesOf('fail')),
    ...listUnlessEmpty('Tests of the log that warned:', messagesOf('warn')),
    ...(verdict === 'INVALID' && result.errorCount > 0
      ? [{ kind: 'paragraph', text: `The log has ${formatCount(result.errorCount)} problem(s); the first: ${result.errors[0]?.message ?? 'see the run page'}` } as const]
      : []),
    ...(audience === 'signers'
      ? [{ kind: 'link', text: 'Sign it off', label: `Sign off run ${run.id}`, url: `${publicUrl}/runs/${run.id}#sign-off` } as const]
      : [
          { kind: 'paragraph', text: 'You uploaded this run: under the setup’s four-eyes rule another shift lead signs it off.' } as const,
          { kind: 'link', text: 'Open the run', label: `Open run ${run.id}`, url: `${publicUrl}/runs/${run.id}` } as const,
        ]),
  ];
  const awaits = audience === 'signers' ? 'it awaits sign-off' : 'it awaits sign-off by another shift lead';
  return {
    to: recipients.join(', '),
    subject: `Run ${run.id} of ${run.setupName}${attempt} is analysed: ${SUBJECT_VERDICT[verdict]}; ${awaits}`,
    text: mailText(blocks),
    html: mailHtml(blocks),
  };
}

/** A list block, or none when it has no items. */
function listUnlessEmpty(heading: string, items: readonly string[], notes: readonly string[] = []): MailBlock[] {
  return items.length > 0 ? [{ kind: 'list', heading, items, notes }] : [];
}

/**
 * A run of two station logs: both files, the offset a shift lead stated with the reason, the
 * alignment check's sentence when it refused the run, and the timing figures (with their caution)
 * or why the timing was not checked. None for a joined log.
 */
function stationBlocks(run: RunDto, result: AnalysisResult): MailBlock[] {
  const pair = result.stations;
  if (run.stations === null || pair === undefined) return [];
  const offset = statedOffsetSentence(pair, run.stations);
  const shifted = pair.alignment?.shifted === true ? [`Alignment check: ${pair.alignment.sentence} ${SHIFT_REMEDY}`] : [];
  const items = [
    `Files: ${stationFilesText(run.file.originalName, run.stations.stationB.originalName)}.`,
    ...(offset === null ? [] : [offset]),
    ...shifted,
    pair.timing === null ? timingNotCheckedSentence(pair, run.stations) : timingSentence(pair.timing),
  ];
  return listUnlessEmpty('Two station logs:', items, pair.timing === null ? [] : [TIMING_CAUTION]);
}

/**
 * The figures, each with its bound and threshold, as sentences of numbers; the missing rounds when
 * any are missing; the key figures with their attack models, and the total ε of the one that counts.
 */
function figureLines(result: AnalysisResult): string[] {
  const { chsh, qber, key, profile } = result;
  // Results stored before engine 2.0 have neither `missingRounds` nor `security`.
  const missing = result.missingRounds ? missingRoundsWords(result.missingRounds) : null;
  const security = result.security ?? null;
  if (!chsh || !qber || !key) return [];
  const epsilon = formatScientific(profile.epsilon);
  const winThreshold = winThresholdOf(result);
  return [
    `CHSH win fraction ${formatFixed(chsh.winFraction)} (threshold ${formatFixed(winThreshold)}; lower bound ${formatFixed(chsh.winFractionLower)} at ε = ${epsilon}) over ${formatCount(chsh.rounds)} test rounds`,
    `S = ${formatFixed(chsh.S, 3)} (local bound 2, quantum bound 2.828); p-value against local models ${formatPValue(chsh.log10PValue)}`,
    `QBER ${formatPercent(qber.rate)} (tolerance ${formatPercent(profile.qberTolerance)}; upper bound ${formatPercent(qber.rateUpper)} at ε = ${epsilon}) over ${formatCount(qber.rounds)} key-setting test rounds`,
    ...(missing && missing.state !== 'None missing' ? [`Missing rounds (${missing.state.toLowerCase()}): ${missing.sentence}`] : []),
    key.finiteKeyReason
      ? `Raw key ${formatCount(key.rawBits)} bits; no finite key estimate (collective attacks): the lower bound of S is above 2√2, which no quantum device reaches`
      : `Raw key ${formatCount(key.rawBits)} bits; finite key estimate ${formatCount(key.finiteKeyBits)} bits (collective attacks)`,
    ...(key.generalAttack ? [`Key length ${generalKeySentence(key.generalAttack)}`] : []),
    ...(security
      ? [`Key figure that counts: ${KEY_FIGURE_OF_MODEL[security.model]}; total ε_key = ${formatScientific(security.keyEpsilon)} over ${security.terms.length} terms`]
      : []),
  ];
}
