/** The trail's actions in words. */
const ACTION_WORDS: Record<string, string> = {
  'run.uploaded': 'Uploaded the log',
  'run.analysis-started': 'Analysis started',
  'run.finished': 'Analysis finished',
  'run.failed': 'Analysis failed',
  'run.mail-sent': 'Verdict mail sent',
  'run.mail-skipped': 'Verdict mail not sent',
  'run.signed-off': 'Signed off',
};

/** A trail action in words; an action this client does not know yet is shown as written. */
export function trailWords(action: string): string {
  return ACTION_WORDS[action] ?? action;
}

/** The one detail of a trail event worth a line: the comment, the verdict, the recipients or the error. */
export function trailDetail(details: Record<string, unknown>): string {
  const { verdict, recipients, comment, error, reason, originalName } = details;
  if (typeof comment === 'string') return `“${comment}”`;
  if (typeof verdict === 'string') return `Verdict ${verdict}`;
  if (Array.isArray(recipients)) return `To ${recipients.join(', ')}`;
  if (typeof error === 'string') return error;
  if (typeof reason === 'string') return reason;
  return typeof originalName === 'string' ? originalName : '';
}
