import type { AnalysisResult } from '../../shared/analysis/result';
import { generalKeySentence } from '../../shared/analysis/report/general-key-words';
import { winThresholdOf } from '../../shared/analysis/report/win-threshold';
import type { RunDto } from '../../shared/api';
import { formatCount, formatFixed, formatLog10, formatPercent, formatScientific } from '../../shared/format/numbers';
import type { OutgoingMail } from './mailer';

/** The one-line caution that stands beside every key figure. */
export const COLLECTIVE_ATTACK_CAUTION =
  'Key figures are estimates against collective (i.i.d.) attacks, not a security certificate; final claims rest on the lab’s own proof, certification and local rules.';

/** Words of each verdict in the mail's subject and first line. */
const VERDICT_WORDS = { ACCEPT: 'ACCEPT: the key may be kept', ABORT: 'ABORT: no key may be kept', INVALID: 'INVALID: the log could not be analysed' } as const;

/**
 * The verdict mail of a finished run: subject with verdict, setup and run number; the key figures
 * with their bounds; the reasons for an abort; the checks that warned; a link to the run's page.
 */
export function composeVerdictMail(run: RunDto, publicUrl: string, recipients: string[]): OutgoingMail & { html: string } {
  const result = run.result as unknown as AnalysisResult;
  const verdict = result.verdict;
  const link = `${publicUrl}/runs/${run.id}`;
  const lines = figureLines(result);
  const warned = result.checks.filter((check) => check.status === 'warn');
  const failed = result.checks.filter((check) => check.status === 'fail');

  const text = [
    `Run ${run.id} on ${run.setupName}: ${VERDICT_WORDS[verdict]}.`,
    `Acquired ${run.acquiredOn ?? 'on an unrecorded date'}; profile ${run.profileName} v${run.profileVersion}; uploaded by ${run.uploadedBy}.`,
    '',
    ...(result.reasons.length > 0 ? ['Reasons:', ...result.reasons.map((reason) => `  - ${reason}`), ''] : []),
    ...(lines.length > 0 ? ['Figures:', ...lines.map((line) => `  ${line}`), '', COLLECTIVE_ATTACK_CAUTION, ''] : []),
    ...(failed.length > 0 ? ['Checks that failed:', ...failed.map((check) => `  - ${check.message}`), ''] : []),
    ...(warned.length > 0 ? ['Checks that warned:', ...warned.map((check) => `  - ${check.message}`), ''] : []),
    ...(verdict === 'INVALID' ? [`The log has ${formatCount(result.errorCount)} problem(s); the first: ${result.errors[0]?.message ?? 'see the run page'}`, ''] : []),
    `Open the run and sign it off: ${link}`,
  ].join('\n');

  const list = (items: string[]) => `<ul>${items.map((item) => `<li>${escapeHtml(item)}</li>`).join('')}</ul>`;
  const html = [
    `<p><strong>Run ${run.id} on ${escapeHtml(run.setupName)}: ${escapeHtml(VERDICT_WORDS[verdict])}.</strong></p>`,
    `<p>Acquired ${escapeHtml(run.acquiredOn ?? 'on an unrecorded date')}; profile ${escapeHtml(run.profileName)} v${run.profileVersion}; uploaded by ${escapeHtml(run.uploadedBy)}.</p>`,
    result.reasons.length > 0 ? `<p>Reasons:</p>${list(result.reasons)}` : '',
    lines.length > 0 ? `<p>Figures:</p>${list(lines)}<p><em>${escapeHtml(COLLECTIVE_ATTACK_CAUTION)}</em></p>` : '',
    failed.length > 0 ? `<p>Checks that failed:</p>${list(failed.map((check) => check.message))}` : '',
    warned.length > 0 ? `<p>Checks that warned:</p>${list(warned.map((check) => check.message))}` : '',
    `<p><a href="${escapeHtml(link)}">Open run ${run.id} and sign it off</a></p>`,
  ].join('\n');

  return {
    to: recipients.join(', '),
    subject: `[Bellkeep] ${verdict} · ${run.setupName} · run ${run.id}`,
    text,
    html,
  };
}

/** The key figures, each with its bound and threshold, as sentences of numbers. */
function figureLines(result: AnalysisResult): string[] {
  const { chsh, qber, key, profile } = result;
  if (!chsh || !qber || !key) return [];
  const epsilon = formatScientific(profile.epsilon);
  const winThreshold = winThresholdOf(result);
  return [
    `CHSH win fraction ${formatFixed(chsh.winFraction)} (threshold ${formatFixed(winThreshold)}; lower bound ${formatFixed(chsh.winFractionLower)} at ε = ${epsilon}) over ${formatCount(chsh.rounds)} test rounds`,
    `S = ${formatFixed(chsh.S, 3)} (local bound 2, quantum bound 2.828); p-value against local models ${formatLog10(chsh.log10PValue)}`,
    `QBER ${formatPercent(qber.rate)} (tolerance ${formatPercent(profile.qberTolerance)}; upper bound ${formatPercent(qber.rateUpper)} at ε = ${epsilon}) over ${formatCount(qber.rounds)} key-setting test rounds`,
    `Raw key ${formatCount(key.rawBits)} bits; finite key estimate ${formatCount(key.finiteKeyBits)} bits (collective attacks)`,
    ...(key.generalAttack ? [`Key length ${generalKeySentence(key.generalAttack)}`] : []),
  ];
}

function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (character) => `&#${character.charCodeAt(0)};`);
}
