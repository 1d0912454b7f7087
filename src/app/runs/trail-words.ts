import { isRole, ROLE_LABELS, SIGN_OFF_DECISION_WORDS, SIGN_OFF_DECISIONS, type AuditAction, type AuditEventDto, type SignOffDecision } from '@shared/api';
import { formatCount } from '@shared/format/numbers';
import { EXPORT_FORMAT_LABELS, isExportFormat } from './export-formats';
import { shownDate } from '../dates/shown-dates';
import { changeWords } from './trail-changes';
import { isReverificationState, lookOfReverification } from './reverification-look';

/** The trail's actions in words: every action the server records. */
const ACTION_WORDS: Record<AuditAction, string> = {
  'user.created': 'User added',
  'user.changed': 'User changed',
  'user.password-changed': 'Changed their password',
  'user.password-reset-link-sent': 'Password reset link mailed',
  'user.password-reset': 'Password set by a reset link',
  'setup.created': 'Setup added',
  'setup.changed': 'Setup changed',
  'profile.created': 'Profile added',
  'profile.version-created': 'Profile version added',
  'booking.created': 'Night booked',
  'upload-token.created': 'Upload token made',
  'upload-token.revoked': 'Upload token revoked',
  'station-log.uploaded': 'Station log uploaded',
  'run.uploaded': 'Uploaded the log',
  'run.realigned': 'Re-run at a stated offset',
  'run.analysis-started': 'Analysis started',
  'run.finished': 'Analysis finished',
  'run.failed': 'Analysis failed',
  'run.mail-sent': 'Verdict mail sent',
  'run.mail-skipped': 'Verdict mail not sent',
  'run.signed-off': 'Signed off',
  'run.withdrawn': 'Upload withdrawn',
  'run.exported': 'Exported',
  'run.reverification-requested': 'Re-verification requested',
  'run.reverification-finished': 'Re-verification finished',
  'signing-key.registered': 'Report-signing key put in use',
  'signing-key.retired': 'Report-signing key retired',
  'audit.exported': 'Trail exported',
};

/** A trail action in words; an action this client does not know yet is shown as written. */
export function trailWords(action: string): string {
  return ACTION_WORDS[action as AuditAction] ?? action;
}

type Details = Record<string, unknown>;

/** The detail line of the actions whose details need reading by their action. */
const DETAIL_OF_ACTION: Partial<Record<AuditAction, (details: Details) => string>> = {
  'booking.created': ({ night, seedCommitment }) => (typeof night === 'string' && typeof seedCommitment === 'string' ? `Night ${night} · seed commitment ${seedCommitment}` : ''),
  'upload-token.created': ({ name, expiresAt }) =>
    typeof name === 'string' ? `“${name}”${typeof expiresAt === 'string' ? `, valid until ${shownDate(expiresAt, 'day')}` : ''}` : '',
  'upload-token.revoked': ({ name }) => (typeof name === 'string' ? `“${name}”` : ''),
  'run.uploaded': ({ attempt, replacementReason, replayOf, uploadToken }) =>
    [
      typeof uploadToken === 'string' ? `By upload token “${uploadToken}”` : '',
      typeof attempt === 'number' ? `Attempt ${attempt}` : 'Unbooked',
      typeof replacementReason === 'string' && replacementReason !== '' ? `replaces the earlier log: ${replacementReason}` : '',
      typeof replayOf === 'number' ? `same bytes as run ${replayOf}` : '',
    ]
      .filter(Boolean)
      .join(' · '),
  'run.exported': ({ format }) => (isExportFormat(format) ? EXPORT_FORMAT_LABELS[format] : ''),
  'run.reverification-requested': ({ reverificationId }) => (typeof reverificationId === 'number' ? `Re-verification ${reverificationId}` : ''),
  'run.reverification-finished': ({ state, error, differenceCount }) => {
    if (!isReverificationState(state)) return '';
    const word = lookOfReverification(state).word;
    if (typeof error === 'string') return `${word}: ${error}`;
    return state === 'differs' && typeof differenceCount === 'number' ? `${word} in ${countOf(differenceCount, 'field')}` : word;
  },
  'user.created': ({ email, roles }) => [typeof email === 'string' ? email : '', roleWords(roles)].filter(Boolean).join(' · '),
  'user.changed': ({ name, roles, active, changes }) =>
    isChanges(changes)
      ? changeWords(changes)
      : [typeof name === 'string' ? `Name ${name}` : '', roleWords(roles), active === true ? 'Reactivated' : active === false ? 'Deactivated' : ''].filter(Boolean).join(' · '),
  'profile.created': ({ name, version }) => (typeof name !== 'string' ? '' : typeof version === 'number' ? `${name} v${version}` : name),
  'profile.version-created': ({ version }) => (typeof version === 'number' ? `Version ${version}` : ''),
  'setup.created': ({ name }) => (typeof name === 'string' ? name : ''),
  'setup.changed': ({ name, fourEyes, changes }) =>
    isChanges(changes)
      ? changeWords(changes)
      : [typeof name === 'string' ? name : '', fourEyes === false ? 'four-eyes rule off' : fourEyes === true ? 'four-eyes rule on' : ''].filter(Boolean).join(' · '),
  'user.password-reset-link-sent': ({ email, expiresAt }) =>
    typeof email === 'string' ? `To ${email}${typeof expiresAt === 'string' ? `, usable until ${shownDate(expiresAt, 'minute')}` : ''}` : '',
  'run.signed-off': ({ decision, comment }) =>
    [isSignOffDecision(decision) ? SIGN_OFF_DECISION_WORDS[decision] : '', typeof comment === 'string' && comment !== '' ? `“${comment}”` : ''].filter(Boolean).join(': '),
  'run.withdrawn': ({ reason }) => (typeof reason === 'string' ? `“${reason}”` : ''),
  'station-log.uploaded': ({ station, supersedes }) =>
    typeof station === 'string' ? `Station ${station}'s log${typeof supersedes === 'number' ? `, in place of log ${supersedes}` : ''}` : '',
  'run.realigned': ({ realignedFrom, offset, reason }) =>
    typeof offset === 'number' && typeof realignedFrom === 'number' ? `Run ${realignedFrom} at offset ${offset}${typeof reason === 'string' ? `: “${reason}”` : ''}` : '',
  'signing-key.retired': ({ replacedBy }) => (typeof replacedBy === 'string' ? `Replaced by key ${replacedBy}` : ''),
  'audit.exported': ({ rows }) => (typeof rows === 'number' ? countOf(rows, 'line') : ''),
};

/**
 * The one detail of a trail event worth a line: what was exported, how a re-verification ended,
 * what changed about a person, setup or profile; else the comment, verdict, recipients or error.
 */
export function trailDetail(event: Pick<AuditEventDto, 'action' | 'details'>): string {
  const ofAction = DETAIL_OF_ACTION[event.action as AuditAction];
  return ofAction === undefined ? commonDetail(event.details) : ofAction(event.details);
}

function commonDetail(details: Details): string {
  const { verdict, recipients, comment, error, reason, originalName } = details;
  if (typeof comment === 'string') return `“${comment}”`;
  if (typeof verdict === 'string') return `Verdict ${verdict}`;
  if (Array.isArray(recipients)) return `To ${recipients.join(', ')}`;
  if (typeof error === 'string') return error;
  if (typeof reason === 'string') return reason;
  return typeof originalName === 'string' ? originalName : '';
}

/** 1 → "1 line", 1500 → "1 500 lines". */
function countOf(count: number, noun: string): string {
  return `${formatCount(count)} ${noun}${count === 1 ? '' : 's'}`;
}

/** `['auditor', 'admin']` → "Roles: Auditor, Admin". */
function roleWords(roles: unknown): string {
  if (!Array.isArray(roles)) return '';
  return roles.length === 0 ? 'No roles' : `Roles: ${roles.map((role) => (isRole(role) ? ROLE_LABELS[role] : String(role))).join(', ')}`;
}

function isSignOffDecision(value: unknown): value is SignOffDecision {
  return SIGN_OFF_DECISIONS.includes(value as SignOffDecision);
}

function isChanges(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}
