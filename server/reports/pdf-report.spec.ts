import crypto from 'node:crypto';
import PDFDocument from 'pdfkit';
import { DEMO_SETUPS } from '@seeders/data/demo-lab';
import { formatPValue } from '@shared/format/numbers';
import { type AnalysisResult, QUANTUM_WIN_FRACTION } from '@shared/analysis';
import { RUN_REPORT_FORMAT, type RunReportDto } from '@shared/api';
import { formatCount, formatScientific } from '@shared/format/numbers';
import { CHECK_FAMILY_LABELS, checkLabel } from '@shared/format/check-labels';
import { FIELD_MEANINGS } from '@shared/format/profile-field-labels';
import { SEED } from '@tests/cli/run-analyse';
import { analysedFixture, GENERAL_PROFILE, NIGHTLY } from '@tests/support/fixture-results';
import { signStatement } from '../integrity/signed-statement';
import { signingKeyFromPem } from '../integrity/signing-key';
import { pdfFonts, pdfFontsEmbedded, pdfText } from '@tests/support/pdf-text';
import { COLLECTIVE_ATTACK_CAUTION, KEY_CAUTION } from './attack-model-words';
import { missingRoundsWords } from './missing-rounds-words';
import { createPdfReport } from './pdf-report';
import { TIMING_CAUTION } from './station-words';
import { OFFSET_REASON, REALIGNED_FROM, STATION_FILE_NAMES, stationPairRun, type StationPairNight } from './testing/station-pair-runs';

jest.setTimeout(60_000);

const FEN_LINK = DEMO_SETUPS[0];
const RUN_ID = 418;
const SIGNED_OFF_AT = '2025-03-14T07:10:00.000Z';
const SIGN_OFF_COMMENT = 'Steady night after the realignment; key kept for the relay test.';

const analysed = analysedFixture;

/** A report of the Fen link's night run, signed with a fresh Ed25519 key and signed off. */
function signedReport(result: AnalysisResult): RunReportDto {
  const key = signingKeyFromPem(crypto.generateKeyPairSync('ed25519').privateKey.export({ format: 'pem', type: 'pkcs8' }).toString());
  const signature = signStatement({ runId: RUN_ID, fileSha256: result.input.sha256, fingerprint: result.fingerprint, signedAt: '2025-03-14T05:03:40.000Z' }, key);
  return {
    format: RUN_REPORT_FORMAT,
    formatVersion: 1,
    exportedAt: '2025-04-02T09:15:00.000Z',
    exportedBy: 'Sami Virtanen',
    run: {
      id: RUN_ID,
      setupName: FEN_LINK.name,
      stationA: FEN_LINK.stationALabel,
      stationB: FEN_LINK.stationBLabel,
      originalName: 'fen-link-2025-03-13.csv',
      uploadedBy: 'Dev Okafor',
      acquiredOn: '2025-03-13',
      notes: 'First night after the polariser realignment.',
      createdAt: '2025-03-14T05:02:11.000Z',
      finishedAt: '2025-03-14T05:03:40.000Z',
      state: result.verdict === 'ACCEPT' ? 'accepted' : result.verdict === 'ABORT' ? 'aborted' : 'invalid',
      verdict: result.verdict,
      duplicateOf: null,
    },
    profile: { profileId: 1, versionId: 1, name: NIGHTLY.name, version: 1, parameters: { ...NIGHTLY.parameters } },
    mapping: null,
    seed: SEED,
    result,
    signature,
    publicKey: { keyId: key.keyId, algorithm: 'Ed25519', publicKeyPem: key.publicKeyPem, createdAt: '2025-01-06T08:00:00.000Z', retiredAt: null },
    signOff: { userId: 3, userName: 'Lucia Brandt', decision: 'key-kept', comment: SIGN_OFF_COMMENT, createdAt: SIGNED_OFF_AT },
    reverifications: [],
  };
}

/** The signed report of run 418 made of two station logs, station A's file the run's. */
async function pairReport(night: StationPairNight): Promise<{ report: RunReportDto; text: string }> {
  const { result, stations } = await stationPairRun(night);
  const signed = signedReport(result);
  const report: RunReportDto = { ...signed, run: { ...signed.run, originalName: STATION_FILE_NAMES.A }, stations };
  return { report, text: await flatText(await pdfBytes(report)) };
}

async function pdfBytes(report: RunReportDto): Promise<Buffer> {
  const chunks: Buffer[] = [];
  for await (const chunk of createPdfReport(report)) chunks.push(chunk as Buffer);
  return Buffer.concat(chunks);
}

/** The PDF's text as one line (see `flatten`). */
async function flatText(pdf: Buffer): Promise<string> {
  return flatten(await pdfText(pdf));
}

/** Text as one line: a line ending in a hyphen was wrapped there, every other run of whitespace is one space. */
function flatten(text: string): string {
  return text.replace(/-\n/g, '-').replace(/\s+/g, ' ');
}

describe('the PDF report of a run', () => {
  let accepted: AnalysisResult;
  let aborted: AnalysisResult;

  beforeAll(async () => {
    [accepted, aborted] = await Promise.all([analysed('accepted-run.csv'), analysed('aborted-low-chsh.csv')]);
  });

  describe('of an accepted, signed and signed-off run', () => {
    let report: RunReportDto;
    let pdf: Buffer;
    let text: string;

    beforeAll(async () => {
      expect(accepted.verdict).toBe('ACCEPT');
      report = signedReport(accepted);
      pdf = await pdfBytes(report);
      text = await flatText(pdf);
    });

    it('is a PDF whose every font is embedded DejaVu', () => {
      expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
      expect(pdfFontsEmbedded(pdf)).toBe(true);
      expect(pdfFonts(pdf).map((font) => font.baseFont)).toEqual(expect.arrayContaining([expect.stringMatching(/\+DejaVuSans$/), expect.stringMatching(/\+DejaVuSansMono$/)]));
      expect(pdfFonts(pdf).every((font) => /DejaVu/.test(font.baseFont))).toBe(true);
    });

    it('draws the drift chart in vector lines, with no image', () => {
      expect(pdf.includes('/Subtype /Image')).toBe(false);
    });

    it('names the run, its setup, stations and file', () => {
      expect(text).not.toContain('Two station logs');
      expect(text).toContain('Bellkeep run report');
      expect(text).toContain(`Run ${RUN_ID}`);
      expect(text).toContain(FEN_LINK.name);
      expect(text).toContain(`A: ${FEN_LINK.stationALabel} · B: ${FEN_LINK.stationBLabel}`);
      expect(text).toContain('fen-link-2025-03-13.csv');
      expect(text).toContain('Dev Okafor');
    });

    it('gives the verdict as a word', () => {
      expect(text).toContain('ACCEPT');
      expect(text).not.toContain('ABORT');
    });

    it('prints the CHSH win fraction of the result to the digits it shows', () => {
      const printed = /CHSH win fraction (\d\.(\d+))/.exec(text);
      expect(printed).not.toBeNull();
      const decimals = printed![2].length;
      expect(decimals).toBeGreaterThanOrEqual(4);
      expect(Math.abs(Number(printed![1]) - accepted.chsh!.winFraction!)).toBeLessThanOrEqual(0.5 * 10 ** -decimals);
      const threshold = (QUANTUM_WIN_FRACTION - accepted.profile.chshTolerance).toFixed(decimals);
      expect(text).toContain(`≥ ${threshold}`);
    });

    it('names the columns read, leaving out a test column the profile does not read', () => {
      expect(accepted.profile.testSelection.mode).not.toBe('from-log');
      expect(text).toContain('round ← “round”, x ← “x”, y ← “y”, a ← “a”, b ← “b”; outcomes written 0/1');
      expect(text).not.toContain('test ←');
    });

    it('records the file hash, the fingerprint and the seed', () => {
      expect(text).toContain(accepted.input.sha256);
      expect(text).toContain(accepted.fingerprint);
      expect(text).toContain(SEED);
      expect(text).toContain(accepted.engineVersion);
    });

    it('carries the signature, its key id and the public key', () => {
      expect(text).toContain(`Key id ${report.signature!.keyId}`);
      expect(text).toContain(report.signature!.signature);
      expect(text).toContain('-----BEGIN PUBLIC KEY-----');
      expect(text).toContain(report.publicKey!.publicKeyPem.split('\n')[1]);
    });

    it('says who signed the run off, when, and with which comment', () => {
      expect(text).toContain(`Signed off by Lucia Brandt on 2025-03-14 07:10:00 UTC. Key kept: ${SIGN_OFF_COMMENT}`);
    });

    it('puts the collective-attack caution beside the key figures', () => {
      expect(text).toContain(COLLECTIVE_ATTACK_CAUTION);
      const caution = text.indexOf(COLLECTIVE_ATTACK_CAUTION);
      expect(text.lastIndexOf('Finite key estimate', caution)).toBeGreaterThan(-1);
      expect(caution - text.lastIndexOf('Finite key estimate', caution)).toBeLessThan(400);
    });

    it('lists every statistical test of the log by its label, never its id, with its sentence', () => {
      expect(accepted.checks.length).toBeGreaterThan(0);
      expect(text).toContain('Statistical tests of the log Test Outcome p-value What was found');
      for (const check of accepted.checks) {
        expect(text).toContain(checkLabel(check.id));
        expect(text).not.toContain(check.id);
        expect(text).toContain(flatten(check.message));
      }
    });

    it('lists the profile as applied by the app’s labels, and the tests that abort a run in words', () => {
      const { profile } = accepted;
      expect(text).toContain(`${FIELD_MEANINGS.epsilonEC.label} ${formatScientific(profile.epsilonEC)}`);
      expect(text).toContain(`${FIELD_MEANINGS.chshTolerance.label} ${profile.chshTolerance}`);
      expect(text).toContain(`${FIELD_MEANINGS.blockingChecks.label} ${profile.blockingChecks.map((family) => CHECK_FAMILY_LABELS[family]).join(', ')}`);
      for (const key of ['epsilonEC', 'chshTolerance', 'blockingChecks', 'reconciliationEfficiency']) expect(text).not.toContain(key);
    });

    it('tabulates CHSH by setting pair, then gives the balanced win fraction and the pooled one for reference', () => {
      const chsh = accepted.chsh!;
      expect(text).toContain('CHSH by setting pair x y Rounds Test rounds Wins Win fraction Lower bound');
      expect(chsh.pairs).toHaveLength(4);
      for (const pair of chsh.pairs) {
        const figures = [
          pair.x,
          pair.y,
          formatCount(pair.rounds),
          formatCount(pair.testRounds),
          formatCount(pair.wins),
          pair.winFraction!.toFixed(6),
          `≥ ${pair.winFractionLower!.toFixed(6)}`,
        ];
        expect(text).toContain(flatten(figures.join(' ')));
      }
      expect(text).toContain(`The win fraction judged weighs the four pairs equally: ${chsh.winFraction!.toFixed(6)}, lower bound ${chsh.winFractionLower!.toFixed(6)}`);
      expect(text).toContain(
        flatten(`Pooled over all ${formatCount(chsh.rounds)} test rounds it is ${chsh.pooledWinFraction!.toFixed(6)} (${formatCount(chsh.wins)} won), for reference only`),
      );
    });

    it('says that no round is missing, with the span and the tolerance', () => {
      expect(accepted.missingRounds!.missing).toBe(0);
      expect(text).toContain(`Missing rounds None missing ${flatten(missingRoundsWords(accepted.missingRounds!).sentence)}`);
    });

    it('lists the security parameters: the key figure’s attack model, its total ε and terms, the rule and how the checks share α', () => {
      const security = accepted.security!;
      expect(text).toContain('Security parameters Key figure that counts the finite key estimate, against collective (i.i.d.) attacks');
      expect(text).toContain(`ε_key = ${formatScientific(security.keyEpsilon)}, from the 4 terms below`);
      for (const term of security.terms) expect(text).toContain(flatten(`${term.symbol} ${formatScientific(term.value)} ${term.usedFor}`));
      expect(text).toContain(`How they add up ${security.rule}`);
      expect(text).toContain(flatten(security.checks.correction));
      // The section ends with the caution of its attack model.
      const section = text.indexOf('Security parameters Key figure');
      expect(text.indexOf(COLLECTIVE_ATTACK_CAUTION, section)).toBeGreaterThan(section);
    });

    it('gives each statistical check its p-value from its log10, and a dash to the counting checks', () => {
      const word = { pass: 'pass', warn: 'warning', fail: 'FAIL' } as const;
      const statistical = accepted.checks.filter((check) => check.log10PValue !== null);
      expect(statistical.length).toBe(accepted.security!.checks.count);
      for (const check of accepted.checks) {
        const pValue = check.log10PValue === null ? '–' : formatPValue(check.log10PValue);
        expect(text).toContain(`${checkLabel(check.id)} ${word[check.status]} ${pValue}`);
      }
      const sharing = accepted.security!.checks;
      expect(text).toContain(
        flatten(`Each statistical test passes at p ≥ α/k = ${formatScientific(sharing.significance)}/${sharing.count} = ${formatScientific(sharing.perCheck)}`),
      );
    });

    it('has a footer with the page count and the exporter on every page', async () => {
      const pages = (await pdfText(pdf)).split('\f');
      expect(pages.length).toBeGreaterThan(1);
      pages.forEach((page, index) => {
        expect(flatten(page)).toContain(`Bellkeep run report · run ${RUN_ID} · page ${index + 1} of ${pages.length}`);
        expect(flatten(page)).toContain('Exported 2025-04-02 09:15:00 UTC by Sami Virtanen');
      });
    });
  });

  it('names the reasons of an aborted run and the criterion that failed', async () => {
    expect(aborted.verdict).toBe('ABORT');
    expect(aborted.reasons.length).toBeGreaterThan(0);
    const text = await flatText(await pdfBytes(signedReport(aborted)));
    expect(text).toContain('ABORT');
    for (const reason of aborted.reasons) expect(text).toContain(flatten(reason));
    // The rule's name wraps in its column, so its first line stands before the figures of its row.
    expect(text).toMatch(/CHSH win fraction \(setting \d\.\d+ ≥ \d\.\d+ ≥ \d\.\d+ \(ω_Q − [\d.]+\) observed FAIL/);
  });

  it('warns of missing rounds over the tolerance, counted as lost games in the balanced win fraction', async () => {
    const missingRounds = { ...accepted.missingRounds!, missing: 40, drawnForTesting: 19 };
    const result: AnalysisResult = { ...accepted, missingRounds, chsh: { ...accepted.chsh!, missingTestRounds: 19 } };
    const text = await flatText(await pdfBytes(signedReport(result)));
    expect(text).toContain(`Missing rounds Over tolerance ${flatten(missingRoundsWords(missingRounds).sentence)}`);
    expect(text).toContain(flatten(`${formatCount(40)} of ${formatCount(missingRounds.triggers)} triggers missing`));
    expect(text).toContain('19 of them drawn for testing, each counted as a lost CHSH game');
    expect(text).toContain('It counts 19 missing rounds drawn for testing as lost, where they lower it most.');
  });

  it('says why no finite key was computed, and shows the missing min-entropy as a dash', async () => {
    const finiteKeyReason = 'The lower bound S = 2.9000 is above 2√2, which no quantum device reaches: no min-entropy and no key are computed from it.';
    const result: AnalysisResult = { ...aborted, key: { ...aborted.key!, finiteKeyBits: 0, minEntropyPerRound: null, finiteKeyReason } };
    const text = await flatText(await pdfBytes(signedReport(result)));
    expect(text).toContain(`Finite key estimate none computed (collective attacks; f = ${aborted.profile.reconciliationEfficiency}`);
    expect(text).toContain(finiteKeyReason);
    expect(text).toContain('min-entropy per round – (none above 2√2)');
    expect(text).toContain(COLLECTIVE_ATTACK_CAUTION);
  });

  it('names the general-attack key figure and both cautions under a general-attack profile', async () => {
    const general = await analysed('accepted-run.csv', GENERAL_PROFILE);
    expect(general.security!.model).toBe('general');
    const text = await flatText(await pdfBytes(signedReport(general)));
    expect(text).toContain('Key figure that counts the key length against general attacks (entropy accumulation)');
    expect(text).toContain(flatten(general.security!.rule));
    expect(text).toContain(COLLECTIVE_ATTACK_CAUTION);
    expect(text).toContain(KEY_CAUTION.general);
  });

  it('reads a result stored before engine 2.0, saying what that engine did not record', async () => {
    const { missingRounds: _missing, security: _security, ...older } = accepted;
    const { pairs: _pairs, ...olderChsh } = accepted.chsh!;
    const stored = { ...older, engineVersion: '1.4.0', chsh: olderChsh, checks: accepted.checks.map(({ log10PValue: _p, ...check }) => check) } as unknown as AnalysisResult;
    const text = await flatText(await pdfBytes(signedReport(stored)));
    expect(text).toContain('No figures per setting pair: not recorded by the engine that stored this result (version 1.4.0).');
    expect(text).toContain('No missing-rounds count: not recorded by the engine that stored this result (version 1.4.0).');
    expect(text).toContain('No security parameters: not recorded by the engine that stored this result (version 1.4.0).');
    expect(text).toContain(`${checkLabel(accepted.checks[0].id)} pass –`);
    expect(text).toContain('This result was stored before engine 2.0, which kept no p-values apart');
  });

  it('lists the blocks of the drift chart that fall below the threshold', async () => {
    const threshold = QUANTUM_WIN_FRACTION - aborted.profile.chshTolerance;
    const failing = aborted.blocks.flatMap((block) => (block.chsh.fraction !== null && block.chsh.fraction < threshold ? [block.index + 1] : []));
    expect(failing.length).toBeGreaterThan(0);
    const text = await flatText(await pdfBytes(signedReport(aborted)));
    expect(text).toContain(`block${failing.length === 1 ? '' : 's'} ${failing.join(', ')} on the failing side of the threshold`);
  });

  it('marks a withdrawn upload under its verdict and in its sign-off section', async () => {
    const withdrawal = { userId: 2, userName: 'Dev Okafor', reason: 'Wrong setup: the Reed bench log.', createdAt: '2025-03-14T07:00:00.000Z' };
    const text = await flatText(await pdfBytes({ ...signedReport(accepted), signOff: null, withdrawal }));
    expect(text).toContain('UPLOAD WITHDRAWN by Dev Okafor on');
    expect(text).toContain('no key is kept and no sign-off is made on this run.');
    expect(text).toContain('as a mistake: Wrong setup: the Reed bench log. It awaits no sign-off.');
    expect(text).not.toContain('Not signed off yet.');
  });

  it('says plainly that a result has no signature and no sign-off', async () => {
    const report: RunReportDto = { ...signedReport(accepted), signature: null, publicKey: null, signOff: null };
    const text = await flatText(await pdfBytes(report));
    expect(text).toContain('This result carries no signature.');
    expect(text).toContain('Not signed off yet.');
  });

  it('lists a re-verification that differs, with its engine versions and fields', async () => {
    const report: RunReportDto = {
      ...signedReport(accepted),
      reverifications: [
        {
          id: 7,
          runId: RUN_ID,
          requestedBy: 'Sami Virtanen',
          seed: null,
          state: 'differs',
          storedFingerprint: accepted.fingerprint,
          storedEngineVersion: accepted.engineVersion,
          newFingerprint: 'f'.repeat(64),
          newEngineVersion: '9.9.9',
          differences: [{ path: 'qber.errors', stored: accepted.qber!.errors, recomputed: accepted.qber!.errors + 1 }],
          differenceCount: 1,
          error: null,
          createdAt: '2025-04-01T10:00:00.000Z',
          finishedAt: '2025-04-01T10:01:30.000Z',
        },
      ],
    };
    const text = await flatText(await pdfBytes(report));
    expect(text).toContain('DIFFERS from the stored result');
    expect(text).toContain(`stored ${accepted.engineVersion}, re-analysed 9.9.9`);
    expect(text).toContain(`qber.errors: stored ${accepted.qber!.errors}, re-analysed ${accepted.qber!.errors + 1}`);
  });

  it('reports an unreadable log with its problems instead of figures', async () => {
    const invalid = await analysed('malformed-rows.csv');
    expect(invalid.verdict).toBe('INVALID');
    const text = await flatText(await pdfBytes(signedReport(invalid)));
    expect(text).toContain('INVALID');
    expect(text).toContain(flatten(invalid.reasons[0]));
    expect(text).toContain(`Line ${invalid.errors[0].line}`);
    expect(text).toContain(invalid.input.sha256);
  });
});

describe('the PDF report of a run of two station logs', () => {
  describe('with both logs timed and the setup’s geometry, station B’s clock slipping', () => {
    let report: RunReportDto;
    let text: string;

    beforeAll(async () => {
      ({ report, text } = await pairReport('clock-slips'));
    });

    it('names both logs in the header and the provenance, the pair by its one digest', () => {
      expect(text).toContain(`Station logs A: ${STATION_FILE_NAMES.A} · B: ${STATION_FILE_NAMES.B}`);
      expect(text).toContain(`SHA-256 of the pair ${report.result.input.sha256}`);
      expect(text).not.toContain('File SHA-256');
    });

    it('gives each station’s file under its label: name, SHA-256, size, records and rounds, and what its record lacks', () => {
      const [a, b] = report.result.stations!.files;
      expect(text).toContain(`Two station logs Station A, ${FEN_LINK.stationALabel} ${STATION_FILE_NAMES.A} SHA-256 ${a.sha256}`);
      expect(text).toContain(`Station B, ${FEN_LINK.stationBLabel} ${STATION_FILE_NAMES.B} SHA-256 ${b.sha256}`);
      for (const file of [a, b]) {
        expect(text).toContain(flatten(`${formatCount(file.bytes)} bytes, not compressed; 16 000 records, round indices 0–15 999 as written; with the time columns`));
      }
      expect(text).toContain('Lacks None of the rounds station B recorded.');
      expect(text).toContain('Lacks None of the rounds station A recorded.');
      expect(text).toContain(flatten('Joined 16 000 rounds both records hold, in round indices 0–15 999 (16 000 triggers), numbered as station A numbers them; 0 missing'));
      expect(text).toContain('Stated offset None: the records are joined as written.');
    });

    it('tabulates S and the interval of |S| at each offset, the centre and the best other marked', () => {
      const alignment = report.result.stations!.alignment!;
      expect(alignment.shifted).toBe(false);
      expect(text).toContain(flatten(`Alignment check No shift found ${alignment.sentence}`));
      expect(text).toContain('Offset S |S| lies in Offset S |S| lies in Offset S |S| lies in');
      const centre = alignment.series.find((point) => point.offset === 0)!;
      expect(text).toMatch(new RegExp(`0 \\(centre\\) 2\\.\\d\\d ${centre.lower.toFixed(2)}–${centre.upper.toFixed(2)}`));
      const best = alignment.series.find((point) => point.offset === alignment.bestOffset)!;
      expect(text).toContain(`${alignment.bestOffset > 0 ? '+' : '−'}${Math.abs(alignment.bestOffset)} (best other)`);
      expect(text).toContain(`${best.lower.toFixed(2)}–${best.upper.toFixed(2)}`);
      for (const offset of [-16, 16]) expect(text).toMatch(new RegExp(`${offset < 0 ? '−' : '\\+'}16 −?\\d\\.\\d\\d 0\\.00–0\\.\\d\\d`));
    });

    it('gives the geometry, the smallest margin and the rounds that are not space-like, with the caution', () => {
      const timing = report.result.stations!.timing!;
      // d/c = 1 300 m / 299 792 458 m/s = 4 336.333… ns (hand-computed); the setup's clock figures as typed.
      expect(text).toContain('Distance 1 300 m: light takes 4 336.333 ns');
      expect(text).toContain("Clock offset station B's clock minus station A's, −123 456.789 ns ± 1.500 ns");
      // About 2.73 µs less the 5 µs slip: −2.27 µs, at station B's outcome.
      expect(text).toMatch(new RegExp(`Smallest margin −2 2\\d\\d\\.\\d{3} ns \\(round ${flatten(formatCount(timing.smallestMargin!.round))}, at station B's outcome\\)`));
      expect(timing.notSpaceLike).toBeGreaterThan(0.007 * 16_000);
      expect(timing.notSpaceLike).toBeLessThan(0.013 * 16_000);
      expect(text).toMatch(
        new RegExp(
          `Not space-like ${flatten(formatCount(timing.notSpaceLike))} of 16 000 timed rounds \\((0\\.9\\d|1\\.\\d) %\\); the first: ${flatten(timing.firstNotSpaceLike.slice(0, 3).map(formatCount).join(', '))}`,
        ),
      );
      expect(text).toContain(flatten(TIMING_CAUTION));
      expect(text.indexOf(flatten(TIMING_CAUTION))).toBeGreaterThan(text.indexOf('Not space-like'));
    });

    it('tabulates the margins: the slipped rounds near −0.52 light times, the others near +0.63', () => {
      const timing = report.result.stations!.timing!;
      expect(text).toContain('Margin ÷ light time Not space-like Margin ÷ light time Space-like (−∞, −1] 0 (0, 0.1] 0');
      expect(text).toContain(flatten(`(−0.6, −0.5] ${formatCount(timing.notSpaceLike)} (0.5, 0.6] 0`));
      expect(text).toContain(flatten(`(−0.5, −0.4] 0 (0.6, 0.7] ${formatCount(16_000 - timing.notSpaceLike)}`));
      expect(text).toContain('(−0.1, 0] 0 (1, ∞) 0');
    });
  });

  it('gives the shift found with its table, and says the timing was not checked without the setup’s geometry', async () => {
    const { report, text } = await pairReport('shifted');
    expect(report.result.verdict).toBe('INVALID');
    const alignment = report.result.stations!.alignment!;
    expect(text).toMatch(/Alignment check Shift found Station B's record runs 3 rounds ahead of station A's: at that offset S = 2\.\d\d, at zero/);
    expect(text).toMatch(/\+3 \(best other\) 2\.\d\d 2\.\d\d–2\.\d\d/);
    const centre = alignment.series.find((point) => point.offset === 0)!;
    expect(text).toMatch(new RegExp(`0 \\(centre\\) −?0\\.\\d\\d 0\\.00–${centre.upper.toFixed(2)}`));
    // B's record runs 3 ahead: A lacks B's last three rounds, B lacks A's first three.
    expect(text).toContain(flatten('Lacks 3 rounds station B recorded (the first: 16 000, 16 001, 16 002). Its longest gap: 3 rounds from round 16 000.'));
    expect(text).toContain('Lacks 3 rounds station A recorded (the first: 0, 1, 2). Its longest gap: 3 rounds from round 0.');
    expect(text).toContain('Timing check The timing was not checked: the setup had no distance between the stations or no clock offset when the run was made.');
    expect(text).not.toContain(flatten(TIMING_CAUTION));
  });

  it('shows the offset a re-run stated, with its reason and the run it re-runs, and why a log without times left the timing unchecked', async () => {
    const { report, text } = await pairReport('stated-offset');
    expect(report.result.verdict).toBe('ACCEPT');
    expect(text).toContain(flatten(`Stated offset Paired at offset −4, station A's round r with station B's round r − 4: ${OFFSET_REASON}. A re-run of run ${REALIGNED_FROM}.`));
    expect(text).toMatch(/No shift found No offset from −20 to \+12 fits clearly better than the stated offset \(−4\)/);
    expect(text).toMatch(/−4 \(centre\) 2\.\d\d/);
    expect(text).toContain('without time columns');
    expect(text).toContain("Timing check The timing was not checked: station B's log has no time columns (t_setting, t_outcome).");
  });
});

describe('the embedded-font check', () => {
  it('tells a standard font, which a PDF only names, from an embedded one', async () => {
    const chunks: Buffer[] = [];
    const doc = new PDFDocument({ size: 'A4' });
    doc.font('Helvetica').text('Kestrel Fen');
    doc.end();
    for await (const chunk of doc) chunks.push(chunk as Buffer);
    const pdf = Buffer.concat(chunks);
    expect(pdfFonts(pdf)).toEqual([{ baseFont: 'Helvetica', subtype: 'Type1', embedded: false }]);
    expect(pdfFontsEmbedded(pdf)).toBe(false);
    expect(await pdfText(pdf)).toContain('Kestrel Fen');
  });
});
