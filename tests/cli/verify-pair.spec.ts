import { spawnSync } from 'node:child_process';
import crypto from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import * as path from 'node:path';
import { writeStationCsv } from '@fixtures/stations/station-csv';
import { KESTREL_FEN_TIMING, STATION_PAIR_SEED, type StationPairOptions, stationRecord } from '@fixtures/stations/station-pair';
import { ENGINE_VERSION } from '@shared/analysis/engine-version';
import { parseProfile } from '@shared/analysis/profile';
import { analyseStationPair } from '@shared/analysis/node';
import { RUN_REPORT_FORMAT, type RunReportDto, type RunStationsDto } from '@shared/api';
import { signStatement } from '@server/integrity/signed-statement';
import { signingKeyFromPem } from '@server/integrity/signing-key';
import { stationPairOptions } from '@server/runs/station-pair-record';
import { ROOT, SEED } from './run-analyse';

// `verify report.json A.csv B.csv`: the offline check of a run of two station logs, on reports made
// here as the server makes them (the worker's options, an Ed25519 signature over the pair's digest).

/** Runs `npm run --silent verify -- ...` as a user would (tsx on server/cli/verify.ts). */
function runVerify(...args: string[]) {
  const run = spawnSync(path.join(ROOT, 'node_modules/.bin/tsx'), [path.join(ROOT, 'server/cli/verify.ts'), ...args], { cwd: ROOT, encoding: 'utf8' });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

const ROUNDS = 24_000;
const RUN_ID = 7;
const KEY = signingKeyFromPem(crypto.generateKeyPairSync('ed25519').privateKey.export({ format: 'pem', type: 'pkcs8' }).toString());
const PARAMETERS = (() => {
  const parsed = parseProfile({ criterion: 'observed', spaceLikeSeparation: 'required' });
  if (!parsed.ok) throw new Error(parsed.message);
  return parsed.profile as Record<string, unknown>;
})();
const sha256 = (file: string) => crypto.createHash('sha256').update(readFileSync(file)).digest('hex');

/** The exported report of a run of the pair at `a` and `b`, analysed and signed as the server does. */
async function signedReport(a: string, b: string, stated: Pick<RunStationsDto, 'offset' | 'offsetReason'>): Promise<RunReportDto> {
  const stations: RunStationsDto = {
    stationB: { sha256: sha256(b), bytes: statSync(b).size, originalName: 'mill-lane.csv.gz' },
    ...stated,
    realignedFrom: null,
    geometry: KESTREL_FEN_TIMING.geometry,
  };
  const options = stationPairOptions({ fileSha256: sha256(a), mapping: null, seed: SEED, stations }, PARAMETERS);
  const result = await analyseStationPair({ path: a }, { path: b }, options);
  const statement = { runId: RUN_ID, fileSha256: result.input.sha256, fingerprint: result.fingerprint, signedAt: '2026-12-05T06:00:00.000Z' };
  return {
    format: RUN_REPORT_FORMAT,
    formatVersion: 1,
    exportedAt: '2026-12-05T07:00:00.000Z',
    exportedBy: 'Sami Virtanen',
    run: {
      id: RUN_ID,
      setupName: 'Fen link',
      stationA: 'North Hall',
      stationB: 'Mill Lane',
      originalName: 'north-hall.csv',
      uploadedBy: 'Dev Okafor',
      acquiredOn: '2026-12-04',
      notes: '',
      createdAt: '2026-12-05T05:00:00.000Z',
      finishedAt: '2026-12-05T06:00:00.000Z',
      state: 'accepted',
      verdict: result.verdict,
      duplicateOf: null,
      booking: null,
      replayOf: null,
    },
    profile: { profileId: 1, versionId: 1, name: 'Nightly standard', version: 1, parameters: PARAMETERS },
    mapping: null,
    seed: SEED,
    result,
    signature: signStatement(statement, KEY),
    publicKey: { keyId: KEY.keyId, algorithm: 'Ed25519', publicKeyPem: KEY.publicKeyPem, createdAt: '2026-12-01T00:00:00.000Z', retiredAt: null },
    signOff: null,
    withdrawal: null,
    stations,
    reverifications: [],
  };
}

describe('verify command on a report of two station logs', () => {
  let scratch: string;
  /** Writes a generated pair (A plain, B gzip); returns station A's and B's paths. */
  const writePair = async (name: string, options: Omit<StationPairOptions, 'rounds'>): Promise<[string, string]> => {
    const paths: [string, string] = [path.join(scratch, `${name}-a.csv`), path.join(scratch, `${name}-b.csv.gz`)];
    await writeStationCsv(paths[0], 'A', stationRecord('A', { rounds: ROUNDS, ...options }, STATION_PAIR_SEED));
    await writeStationCsv(paths[1], 'B', stationRecord('B', { rounds: ROUNDS, ...options }, STATION_PAIR_SEED), { gzip: true });
    return paths;
  };
  const writeReport = (name: string, report: RunReportDto) => {
    const file = path.join(scratch, `${name}.json`);
    writeFileSync(file, JSON.stringify(report, null, 2));
    return file;
  };
  let aligned: [string, string];
  let alignedReport: string;

  beforeAll(async () => {
    scratch = mkdtempSync(path.join(tmpdir(), 'bellkeep-cli-verify-pair-'));
    aligned = await writePair('aligned', {});
    alignedReport = writeReport('aligned', await signedReport(...aligned, { offset: null, offsetReason: null }));
  });
  afterAll(() => rmSync(scratch, { recursive: true, force: true }));

  it('checks both files, the pair the signature names and the re-derived result: exit 0', () => {
    const run = runVerify(alignedReport, ...aligned);
    expect(run.stderr).toBe('');
    expect(run.status).toBe(0);
    const report = JSON.parse(readFileSync(alignedReport, 'utf8')) as RunReportDto;
    // Under a profile requiring space-like separation: the timing check ran with the recorded geometry, and passed.
    expect(report.result.verdict).toBe('ACCEPT');
    expect(report.result.checks.find((check) => check.id === 'space-like-separation')?.status).toBe('pass');
    expect(run.stdout).toContain(`✓ Station A's log hashes to the recorded SHA-256 ${sha256(aligned[0])}.`);
    expect(run.stdout).toContain(`✓ Station B's log hashes to the recorded SHA-256 ${sha256(aligned[1])}.`);
    expect(run.stdout).toContain(`✓ Together they hash to the recorded SHA-256 of the pair ${report.result.input.sha256}, the input the signature names.`);
    expect(run.stdout).toContain(`✓ Re-derived from the two station logs, the result reproduces the fingerprint ${report.result.fingerprint} (verdict ACCEPT).`);
    expect(run.stdout).toContain(`Run ${RUN_ID}: everything matches.`);
  });

  it('fails a changed station B log, naming it, and swapped logs, saying they look swapped: exit 1', () => {
    const changed = path.join(scratch, 'changed-b.csv');
    const text = readFileSync(path.join(scratch, 'aligned-b.csv.gz'));
    writeFileSync(changed, text.subarray(0, text.length - 1));
    const wrongB = runVerify(alignedReport, aligned[0], changed);
    expect(wrongB.status).toBe(1);
    expect(wrongB.stdout).toContain(`✓ Station A's log hashes to the recorded SHA-256`);
    expect(wrongB.stdout).toContain(`✗ Station B's log hashes to ${sha256(changed)}, not to the recorded SHA-256 ${sha256(aligned[1])}: it is not the analysed file.`);
    expect(wrongB.stdout).toContain('✗ Together they hash to');

    const swapped = runVerify(alignedReport, aligned[1], aligned[0]);
    expect(swapped.status).toBe(1);
    expect(swapped.stdout).toMatch(/✗ Station A's log hashes to [0-9a-f]{64}, not to the recorded SHA-256 [0-9a-f]{64}: it is not the analysed file\. The two logs look swapped/);
  });

  it("re-derives a shifted pair at the run's stated offset, which a check without it would not reproduce", async () => {
    const shifted = await writePair('shifted', { shiftB: 2 });
    const stated = writeReport('stated', await signedReport(...shifted, { offset: 2, offsetReason: "B's counter counted two test triggers before the run" }));
    const run = runVerify(stated, ...shifted);
    expect(run.status).toBe(0);
    expect(run.stdout).toContain('reproduces the fingerprint');
    const report = JSON.parse(readFileSync(stated, 'utf8')) as RunReportDto;
    expect(report.result.stations?.join?.statedOffset).toEqual({ rounds: 2, reason: "B's counter counted two test triggers before the run" });

    // The same report without its offset: the logs are re-derived as written, and the shift found makes another result.
    const unstated = writeReport('unstated', { ...report, stations: { ...report.stations!, offset: null, offsetReason: null } });
    const without = runVerify(unstated, ...shifted);
    expect(without.status).toBe(1);
    expect(without.stdout).toContain('✗ Re-derived from the two station logs, the result has fingerprint');
    expect(without.stdout).toMatch(new RegExp(`\\d+ field\\(s\\) differ \\(engine ${ENGINE_VERSION} then, ${ENGINE_VERSION} now\\)`));
  });

  it('refuses a report of two station logs with one log, and a report of one joined log with two: exit 2, naming what is wrong', () => {
    const one = runVerify(alignedReport, aligned[0]);
    expect(one.status).toBe(2);
    expect(one.stdout).toBe('');
    expect(one.stderr).toContain(`verify: run ${RUN_ID} was analysed from two station logs: give station A's log and then station B's log (station B's log is missing)`);
    expect(one.stderr).toContain('<station A log> <station B log>');

    const report = JSON.parse(readFileSync(alignedReport, 'utf8')) as RunReportDto;
    const joined = writeReport('joined', { ...report, stations: null });
    const two = runVerify(joined, ...aligned);
    expect(two.status).toBe(2);
    expect(two.stderr).toContain(`verify: run ${RUN_ID} was analysed from one joined log: give that log alone, not two`);

    expect(runVerify(alignedReport, ...aligned, aligned[0]).stderr).toContain("give the exported report and its log, or its two station logs (station A's, then station B's)");
  });
});
