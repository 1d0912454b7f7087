import type { AnalysisResult } from '@shared/analysis';
import { STATE_OF_VERDICT, type RunBookingDto, type RunDto } from '@shared/api';
import { REVEALED_SEED_CAUTION, UNBOOKED_CAUTION } from '@shared/format/booking-words';
import { formatCount, formatScientific } from '@shared/format/numbers';
import { SEED } from '@tests/cli/run-analyse';
import { analysedFixture, GENERAL_PROFILE, NIGHTLY } from '@tests/support/fixture-results';
import { COLLECTIVE_ATTACK_CAUTION, KEY_CAUTION } from '../reports/attack-model-words';
import { SHIFT_REMEDY, TIMING_CAUTION } from '../reports/station-words';
import { OFFSET_REASON, REALIGNED_FROM, STATION_FILE_NAMES, stationPairRun, type StationPairNight } from '../reports/testing/station-pair-runs';
import { createAppMail } from './app-mail';
import type { OutgoingMail } from './mailer';
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
    stationPair: false,
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
    stations: null,
  };
}

/** Run 418 made of two station logs: the night's result and the run's record of the pair. */
async function pairMail(night: StationPairNight) {
  const { result, stations } = await stationPairRun(night);
  const run: RunDto = {
    ...finishedRun(result),
    stationPair: true,
    stations,
    file: { sha256: result.stations!.files[0].sha256, bytes: result.stations!.files[0].bytes, originalName: STATION_FILE_NAMES.A },
  };
  return { result, mail: composeVerdictMail(run, 'https://bellkeep.example', ['night-desk@kestrelfen.example']) };
}

/** The items of a list of the text part, by its heading. */
function listItems(text: string, heading: string): string[] {
  const lines = text.split('\n');
  const start = lines.indexOf(heading) + 1;
  if (start === 0) return [];
  const end = lines.indexOf('', start);
  return lines.slice(start, end === -1 ? undefined : end).map((line) => line.replace(/^ {2}- /, ''));
}

function mailOf(result: AnalysisResult) {
  return composeVerdictMail(finishedRun(result), 'https://bellkeep.example', ['night-desk@kestrelfen.example']);
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
    expect(listItems(mail.text, 'Figures:')).toContain(line);
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
    expect(listItems(mail.text, 'Figures:')).toContain(line);
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
      const figures = listItems(mail.text, 'Figures:');
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

  it('has no station block for one joined log', () => {
    expect(mailOf(accepted).text).not.toContain('Two station logs');
  });

  describe('of two station logs', () => {
    it('names both files and gives the timing figures, in the text and the HTML, with their caution', async () => {
      const { mail } = await pairMail('aligned');
      const items = listItems(mail.text, 'Two station logs:');
      expect(items[0]).toBe(`Files: station A's ${STATION_FILE_NAMES.A} and station B's ${STATION_FILE_NAMES.B}.`);
      // The generator's honest margin is about 2.73 µs: the other station's setting 50 ns after the trigger, plus light's
      // 4 336.33 ns, less the outcome 1.65 µs after the trigger and the clock uncertainty; no round is late.
      expect(items).toContainEqual(
        expect.stringMatching(
          /^Timing check: smallest margin 2\u20097\d\d\.\d{3}\u2009ns \(round [\d\u2009]+, at station [AB]'s outcome\); 0 of 16\u2009000 timed rounds \(0\u2009%\) without space-like separation\.$/,
        ),
      );
      expect(items.some((item) => item.startsWith('Paired at offset'))).toBe(false);
      expect(items.some((item) => item.startsWith('Alignment check'))).toBe(false);
      expect(mail.text).toContain(`\n\n${TIMING_CAUTION}`);
      const html = decoded(mail.html);
      for (const item of items) expect(html).toContain(`<li>${item}</li>`);
      expect(html).toContain(`<p><em>${TIMING_CAUTION}</em></p>`);
    });

    it('counts the rounds of a slipping clock as not space-like, and warns of them', async () => {
      const { mail, result } = await pairMail('clock-slips');
      const timing = result.stations!.timing!;
      // Station B's clock slips 5 µs late in 1 % of the rounds: those margins are about 2.73 − 5 = −2.27 µs.
      expect(timing.notSpaceLike / timing.timedRounds).toBeGreaterThan(0.007);
      expect(timing.notSpaceLike / timing.timedRounds).toBeLessThan(0.013);
      const line = listItems(mail.text, 'Two station logs:').find((item) => item.startsWith('Timing check'));
      expect(line).toMatch(
        new RegExp(
          `^Timing check: smallest margin −2\u20092\\d\\d\\.\\d{3}\u2009ns \\(round [\\d\u2009]+, at station B's outcome\\); ${formatCount(timing.notSpaceLike)} of 16\u2009000 timed rounds \\((0\\.9\\d|1\\.\\d)\u2009%\\) without space-like separation\\.$`,
        ),
      );
      // Each test by its label, not its id.
      expect(listItems(mail.text, 'Tests of the log that warned:')).toContainEqual(expect.stringMatching(/^Space-like separation: .*lack space-like separation/));
      expect(mail.text).not.toContain('space-like-separation');
    });

    it('gives the sentence of a shift found, what a shift lead may do, and why the timing was not checked; no problem count', async () => {
      const { mail, result } = await pairMail('shifted');
      expect(result.verdict).toBe('INVALID');
      const items = listItems(mail.text, 'Two station logs:');
      const shift = items.find((item) => item.startsWith('Alignment check: '));
      expect(shift).toMatch(/^Alignment check: Station B's record runs 3 rounds ahead of station A's: at that offset S = 2\.\d\d, at zero /);
      expect(shift?.endsWith(`. ${SHIFT_REMEDY}`)).toBe(true);
      expect(decoded(mail.html)).toContain(`<li>${shift}</li>`);
      expect(items).toContain('The timing was not checked: the setup had no distance between the stations or no clock offset when the run was made.');
      expect(mail.text).not.toContain(TIMING_CAUTION);
      expect(mail.text).not.toContain('problem(s)');
      expect(mail.subject).toBe('Run 418 of Fen link (unbooked) is analysed: no verdict was possible; it awaits sign-off');
    });

    it('says at which offset a re-run paired the records, and why, and that a log without times left the timing unchecked', async () => {
      const { mail, result } = await pairMail('stated-offset');
      expect(result.verdict).toBe('ACCEPT');
      const items = listItems(mail.text, 'Two station logs:');
      expect(items).toContain(`Paired at offset −4, station A's round r with station B's round r − 4: ${OFFSET_REASON}. A re-run of run ${REALIGNED_FROM}.`);
      expect(items).toContain("The timing was not checked: station B's log has no time columns (t_setting, t_outcome).");
      expect(items.some((item) => item.startsWith('Alignment check'))).toBe(false);
    });
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

  it('offers the uploader, whom the four-eyes rule keeps from signing, the run instead of the sign-off', () => {
    const mail = composeVerdictMail(finishedRun(accepted), 'https://bellkeep.example', ['ada.reyes@kestrelfen.example'], 'uploader');
    expect(mail.subject).toBe('Run 418 of Fen link (unbooked) is analysed: ACCEPT; it awaits sign-off by another shift lead');
    expect(mail.text).toContain('You uploaded this run: under the setup’s four-eyes rule another shift lead signs it off.');
    expect(mail.text).toMatch(/Open the run: https:\/\/bellkeep\.example\/runs\/418$/);
    expect(mail.text).not.toContain('#sign-off');
    expect(mail.html).not.toContain('#sign-off');
  });
});

describe('the withdrawal mail', () => {
  it('names both files of a run of two station logs', async () => {
    const sent: OutgoingMail[] = [];
    const mailer = {
      send: (mail: OutgoingMail) => {
        sent.push(mail);
        return Promise.resolve('<withdrawn@bellkeep.example>');
      },
      close: () => undefined,
    };
    const appMail = createAppMail(mailer, 'https://bellkeep.example');
    const { result, stations } = await stationPairRun('shifted');
    const run: RunDto = { ...finishedRun(result), stationPair: true, stations, file: { ...finishedRun(result).file, originalName: STATION_FILE_NAMES.A } };
    appMail.withdrawn(run, { userId: 2, userName: 'Dev Okafor', reason: 'Wrong night.', createdAt: '2025-03-14T07:00:00.000Z' }, ['night-desk@kestrelfen.example']);
    await appMail.settled();
    expect(sent).toHaveLength(1);
    expect(sent[0].text).toContain(`Dev Okafor withdrew run 418 of Fen link (station A's ${STATION_FILE_NAMES.A} and station B's ${STATION_FILE_NAMES.B}, acquired 2025-03-13)`);
  });
});
