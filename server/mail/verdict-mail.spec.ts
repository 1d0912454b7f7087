import type { AnalysisResult } from '@shared/analysis';
import { STATE_OF_VERDICT, type RunBookingDto, type RunDto } from '@shared/api';
import { REVEALED_SEED_CAUTION, UNBOOKED_CAUTION } from '@shared/format/booking-words';
import { formatCount, formatScientific } from '@shared/format/numbers';
import { SEED } from '@tests/cli/run-analyse';
import { analysedFixture, GENERAL_PROFILE, NIGHTLY } from '@tests/support/fixture-results';
import { COLLECTIVE_ATTACK_CAUTION, KEY_CAUTION } from '../reports/attack-model-words';
import { composeVerdictMail } from './verdict-mail';

const analysed = analysedFixture;

/** Run 418 of the Fen link, finished with this result. */
function finishedRun(result: AnalysisResult): RunDto {
  return {
    id: 418,
    setupId: 1,
    setupName: 'Fen link',
    profileVersionId: 1,
    profileName: NIGHTLY.name,
    profileVersion: 1,
    state: STATE_OF_VERDICT[result.verdict],
    progress: 1,
    verdict: result.verdict,
    winFraction: result.chsh?.winFraction ?? null,
    winThreshold: null,
    qber: result.qber?.rate ?? null,
    chshValue: result.chsh?.S ?? null,
    finiteKeyBits: result.key?.finiteKeyBits ?? null,
    uploadedBy: 'Dev Okafor',
    acquiredOn: '2025-03-13',
    createdAt: '2025-03-14T05:02:11.000Z',
    finishedAt: '2025-03-14T05:03:40.000Z',
    duplicateOf: null,
    signedOff: false,
    withdrawn: false,
    fileSha256: result.input.sha256,
    fingerprint: result.fingerprint,
    file: { sha256: result.input.sha256, bytes: result.input.bytes, originalName: 'fen-link-2025-03-13.csv' },
    seed: SEED,
    mapping: null,
    notes: '',
    error: null,
    attempts: 1,
    analysedBy: 'test:1',
    startedAt: '2025-03-14T05:02:12.000Z',
    heartbeatAt: '2025-03-14T05:03:40.000Z',
    result,
    signature: null,
    signOff: null,
    withdrawal: null,
    uploadedById: 2,
    fourEyes: true,
    deliveries: [],
    bookingId: null,
    attempt: null,
    replayOf: null,
    booking: null,
  };
}

function mailOf(result: AnalysisResult) {
  return composeVerdictMail(finishedRun(result), 'https://bellkeep.example', ['night-desk@kestrelfen.example']);
}

/** The items of the text part's "Figures:" list. */
function figureLines(text: string): string[] {
  const lines = text.split('\n');
  const start = lines.indexOf('Figures:') + 1;
  const end = lines.indexOf('', start);
  return lines.slice(start, end).map((line) => line.replace(/^ {2}- /, ''));
}

/** The HTML part with its character references read back, so it compares with the text part. */
function decoded(html: string): string {
  return html.replace(/&#(\d+);/g, (_, code: string) => String.fromCharCode(Number(code)));
}

describe('the verdict mail', () => {
  let accepted: AnalysisResult;

  beforeAll(async () => {
    accepted = await analysed('accepted-run.csv');
  });

  it('gives the key figure’s total ε and attack model in one line, in the text and the HTML', () => {
    const mail = mailOf(accepted);
    const line = `Key figure that counts: the finite key estimate, against collective (i.i.d.) attacks; total ε_key = ${formatScientific(accepted.security!.keyEpsilon)} over 4 terms`;
    expect(figureLines(mail.text)).toContain(line);
    expect(decoded(mail.html)).toContain(`<li>${line}</li>`);
    expect(mail.text).toContain(COLLECTIVE_ATTACK_CAUTION);
  });

  it('has no missing-rounds line when none is missing', () => {
    expect(accepted.missingRounds!.missing).toBe(0);
    const mail = mailOf(accepted);
    expect(mail.text).not.toContain('Missing rounds');
    expect(mail.html).not.toContain('Missing rounds');
  });

  it('names the missing rounds, their share, the tolerance and those counted as lost games', () => {
    const missingRounds = { ...accepted.missingRounds!, missing: 40, drawnForTesting: 19 };
    const mail = mailOf({ ...accepted, missingRounds });
    const line =
      `Missing rounds (over tolerance): ${formatCount(40)} of ${formatCount(missingRounds.triggers)} triggers missing (0.17\u2009%) ` +
      `in round indices ${formatCount(missingRounds.firstRound)}–${formatCount(missingRounds.lastRound)}, ${formatCount(missingRounds.tolerated)} tolerated; ` +
      '19 of them drawn for testing, each counted as a lost CHSH game.';
    expect(figureLines(mail.text)).toContain(line);
    expect(decoded(mail.html)).toContain(`<li>${line}</li>`);
  });

  it('says why no finite key was computed when the lower bound of S is above 2√2', () => {
    const key = { ...accepted.key!, finiteKeyBits: 0, minEntropyPerRound: null, finiteKeyReason: 'The lower bound S = 2.9000 is above 2√2.' };
    const mail = mailOf({ ...accepted, key });
    expect(mail.text).toContain('no finite key estimate (collective attacks): the lower bound of S is above 2√2');
  });

  it('names the general-attack key figure and gives each model’s caution under a general-attack profile', async () => {
    const general = await analysed('accepted-run.csv', GENERAL_PROFILE);
    const mail = mailOf(general);
    expect(mail.text).toContain(
      `Key figure that counts: the key length against general attacks (entropy accumulation); total ε_key = ${formatScientific(general.security!.keyEpsilon)}`,
    );
    for (const caution of [KEY_CAUTION.collective, KEY_CAUTION.general]) {
      expect(mail.text).toContain(caution);
      expect(decoded(mail.html)).toContain(`<p><em>${caution}</em></p>`);
    }
  });

  it('keeps the text and the HTML in step: the same reasons and figures in each', async () => {
    const aborted = await analysed('aborted-low-chsh.csv');
    expect(aborted.verdict).toBe('ABORT');
    for (const result of [accepted, aborted]) {
      const mail = mailOf(result);
      const html = decoded(mail.html);
      for (const reason of result.reasons) {
        expect(mail.text).toContain(`  - ${reason}`);
        expect(html).toContain(`<li>${reason}</li>`);
      }
      const figures = figureLines(mail.text);
      expect(figures.length).toBeGreaterThan(4);
      for (const line of figures) expect(html).toContain(`<li>${line}</li>`);
    }
  });

  it('gives an unreadable log its problems, in both parts, and no figures and no caution', async () => {
    const invalid = await analysed('malformed-rows.csv');
    const mail = mailOf(invalid);
    expect(mail.subject).toBe('Run 418 of Fen link (unbooked) is analysed: no verdict was possible; it awaits sign-off');
    expect(mail.text).not.toContain('Figures:');
    expect(mail.text).not.toContain(COLLECTIVE_ATTACK_CAUTION);
    const problems = `The log has ${formatCount(invalid.errorCount)} problem(s); the first: ${invalid.errors[0].message}`;
    expect(mail.text).toContain(problems);
    expect(decoded(mail.html)).toContain(`<p>${problems}</p>`);
  });

  it('says a run is unbooked, with the caution that its seed came after the data, and flags a replay', () => {
    const mail = composeVerdictMail({ ...finishedRun(accepted), replayOf: 12 }, 'https://bellkeep.example', ['night-desk@kestrelfen.example']);
    expect(mail.text).toContain(`Unbooked:\n  - ${UNBOOKED_CAUTION}\n  - Replay: these bytes were uploaded before as run 12`);
  });

  it('names a replacement as attempt k of its booking, with its reason, the other attempts, the notes and a link to the sign-off', () => {
    const booking: RunBookingDto = {
      bookingId: 31,
      night: '2025-03-13',
      seedCommitment: 'ab'.repeat(32),
      attempt: 2,
      replacementReason: 'The first copy was cut short.',
      attempts: [
        { runId: 417, attempt: 1, state: 'aborted', verdict: 'ABORT', replacementReason: '', createdAt: '2025-03-14T05:00:00.000Z' },
        { runId: 418, attempt: 2, state: 'accepted', verdict: 'ACCEPT', replacementReason: 'The first copy was cut short.', createdAt: '2025-03-14T05:02:11.000Z' },
      ],
    };
    const mail = composeVerdictMail({ ...finishedRun(accepted), bookingId: 31, attempt: 2, booking, notes: 'Detector B re-cooled at 23:10.' }, 'https://bellkeep.example', [
      'night-desk@kestrelfen.example',
    ]);
    expect(mail.subject).toBe('Run 418 of Fen link (attempt 2) is analysed: ACCEPT; it awaits sign-off');
    expect(mail.text).toContain('Booked night 2025-03-13 (booking 31): attempt 2 of 2.');
    expect(mail.text).toContain(`Seed committed at booking, before acquisition: SHA-256 ${'ab'.repeat(32)}.`);
    expect(mail.text).toContain('Replaces the earlier log: The first copy was cut short.');
    expect(mail.text).toContain(REVEALED_SEED_CAUTION);
    expect(mail.text).toContain('Other attempts: 1 — run 417, ABORT.');
    expect(mail.text).toContain('Uploader’s notes: Detector B re-cooled at 23:10.');
    expect(mail.text).toContain('Sign it off: https://bellkeep.example/runs/418#sign-off');
    expect(decoded(mail.html)).toContain('<li>Booked night 2025-03-13 (booking 31): attempt 2 of 2.</li>');
  });
});
