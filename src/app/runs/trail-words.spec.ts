import { AUDIT_ACTIONS } from '@shared/api';
import { trailDetail, trailWords } from './trail-words';

describe('trailWords', () => {
  it('gives every action the server records words of its own', () => {
    const unnamed = AUDIT_ACTIONS.filter((action) => trailWords(action) === action);
    expect(unnamed).toEqual([]);
  });

  it('names the exports, re-verifications and signing keys', () => {
    expect(trailWords('run.exported')).toBe('Exported');
    expect(trailWords('run.reverification-requested')).toBe('Re-verification requested');
    expect(trailWords('run.reverification-finished')).toBe('Re-verification finished');
    expect(trailWords('signing-key.registered')).toBe('Report-signing key put in use');
    expect(trailWords('signing-key.retired')).toBe('Report-signing key retired');
    expect(trailWords('audit.exported')).toBe('Trail exported');
  });

  it('keeps the words the run page already used', () => {
    expect(trailWords('run.uploaded')).toBe('Uploaded the log');
    expect(trailWords('run.signed-off')).toBe('Signed off');
  });

  it('shows an action it does not know as written', () => {
    expect(trailWords('run.archived-elsewhere')).toBe('run.archived-elsewhere');
  });
});

describe('trailDetail', () => {
  it('names the format of an export', () => {
    expect(trailDetail({ action: 'run.exported', details: { format: 'counts.csv' } })).toBe('Counts CSV');
    expect(trailDetail({ action: 'run.exported', details: { format: 'pdf' } })).toBe('PDF report');
  });

  it('says how a re-verification ended, with its error when it could not run', () => {
    expect(trailDetail({ action: 'run.reverification-finished', details: { state: 'reproduced' } })).toBe('Reproduced');
    expect(trailDetail({ action: 'run.reverification-finished', details: { state: 'differs', differenceCount: 2 } })).toBe('Differs in 2 fields');
    expect(trailDetail({ action: 'run.reverification-finished', details: { state: 'differs', differenceCount: 1 } })).toBe('Differs in 1 field');
    expect(trailDetail({ action: 'run.reverification-finished', details: { state: 'failed', error: 'The archived log is missing.' } })).toBe(
      'Could not run: The archived log is missing.',
    );
  });

  it('names the re-verification asked for and how many lines an export of the trail held', () => {
    expect(trailDetail({ action: 'run.reverification-requested', details: { reverificationId: 5 } })).toBe('Re-verification 5');
    expect(trailDetail({ action: 'audit.exported', details: { filter: { action: 'run.' }, rows: 1500 } })).toBe('1\u2009500 lines');
  });

  it('does not read a run’s own state as a re-verification’s', () => {
    expect(trailDetail({ action: 'run.finished', details: { state: 'aborted', verdict: 'ABORT' } })).toBe('Verdict ABORT');
  });

  it('says what changed about a person', () => {
    expect(trailDetail({ action: 'user.created', details: { email: 'wren.addo@kestrelfen.example', roles: ['experimentalist', 'shift-lead'] } })).toBe(
      'wren.addo@kestrelfen.example · Roles: Experimentalist, Shift lead',
    );
    expect(trailDetail({ action: 'user.changed', details: { active: false } })).toBe('Deactivated');
    expect(trailDetail({ action: 'user.changed', details: { roles: ['auditor'], active: true } })).toBe('Roles: Auditor · Reactivated');
  });

  it('names profiles, their versions, setups and the key that took over', () => {
    expect(trailDetail({ action: 'profile.created', details: { name: 'Night standard', version: 1 } })).toBe('Night standard v1');
    expect(trailDetail({ action: 'profile.version-created', details: { version: 4 } })).toBe('Version 4');
    expect(trailDetail({ action: 'setup.changed', details: { name: 'Mill Lane link', shiftLeadIds: [2] } })).toBe('Mill Lane link');
    expect(trailDetail({ action: 'signing-key.retired', details: { replacedBy: '5c1e0a9b7d2f4e38' } })).toBe('Replaced by key 5c1e0a9b7d2f4e38');
  });

  it('keeps a sign-off’s comment, a mail’s recipients and an analysis error', () => {
    expect(trailDetail({ action: 'run.signed-off', details: { comment: 'Detector realigned.', verdict: 'ABORT' } })).toBe('“Detector realigned.”');
    expect(trailDetail({ action: 'run.signed-off', details: { decision: 'hardware-action', comment: 'Detector realigned.', verdict: 'ABORT' } })).toBe(
      'Hardware action needed: “Detector realigned.”',
    );
    expect(trailDetail({ action: 'setup.changed', details: { name: 'Fen link', fourEyes: false } })).toBe('Fen link · four-eyes rule off');
    expect(
      trailDetail({
        action: 'setup.changed',
        details: {
          name: 'Fen link',
          changes: {
            fourEyes: { from: true, to: false },
            shiftLeads: { from: ['Ada Reyes', 'Lucia Brandt'], to: ['Lucia Brandt'] },
            description: { from: '', to: 'North Hall to Mill Lane' },
          },
        },
      }),
    ).toBe('Four-eyes rule: on → off · Shift leads: Ada Reyes, Lucia Brandt → Lucia Brandt · Description: (empty) → North Hall to Mill Lane');
    expect(
      trailDetail({ action: 'user.changed', details: { active: false, changes: { active: { from: true, to: false }, roles: { from: ['auditor'], to: ['auditor', 'admin'] } } } }),
    ).toBe('Account: active → deactivated · Roles: Auditor → Auditor, Admin');
    expect(trailDetail({ action: 'setup.changed', details: { name: 'Fen link', changes: {} } })).toBe('No field changed');
    const millLane = { columns: { round: 'RoundNo', x: 'SetNorth' }, outcomes: '±1' };
    expect(trailDetail({ action: 'setup.changed', details: { changes: { columnMapping: { from: null, to: millLane } } } })).toBe(
      'Column mapping: none → round ← “RoundNo”, x ← “SetNorth”; outcomes written ±1',
    );
    expect(trailDetail({ action: 'run.withdrawn', details: { reason: 'Wrong setup.', verdict: 'ACCEPT' } })).toBe('“Wrong setup.”');
    expect(trailDetail({ action: 'run.mail-sent', details: { recipients: ['lucia.brandt@kestrelfen.example'] } })).toBe('To lucia.brandt@kestrelfen.example');
    expect(trailDetail({ action: 'run.failed', details: { error: 'The log ended mid-row.' } })).toBe('The log ended mid-row.');
  });

  it('leaves the line empty when the details say nothing worth showing', () => {
    expect(trailDetail({ action: 'signing-key.registered', details: {} })).toBe('');
    expect(trailDetail({ action: 'run.exported', details: { format: 'xlsx' } })).toBe('');
  });
});
