import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { type ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import type { StationPairSummary } from '@shared/analysis';
import type { RunDto } from '@shared/api';
import { CHART_PROVIDERS } from '../charts/chart-providers';
import { settle } from '../../testing/settle';
import { signInAs } from '../../testing/sign-in-as';
import { specSetup } from '../../testing/spec-setup';
import { StationPairPanel } from './station-pair-panel';

const HASH_A = 'a1'.repeat(32);
const HASH_B = 'b2'.repeat(32);

/** The result's station section of a night whose station B record lost 120 rounds and runs 3 rounds behind. */
const PAIR: StationPairSummary = {
  files: [
    { station: 'A', sha256: HASH_A, bytes: 240_112, compression: 'none', records: 12_000, rounds: 12_000, firstRound: 1, lastRound: 12_000, hasTimes: true, problemCount: 0 },
    { station: 'B', sha256: HASH_B, bytes: 61_090, compression: 'gzip', records: 11_880, rounds: 11_880, firstRound: 1, lastRound: 12_000, hasTimes: false, problemCount: 0 },
  ],
  join: {
    statedOffset: null,
    joinedRounds: 11_880,
    firstJoinedRound: 1,
    lastJoinedRound: 12_000,
    span: { firstRound: 1, lastRound: 12_000, triggers: 12_000 },
    missing: 120,
    missingFromBoth: 0,
    stationA: { lacking: 0, firstLacking: [], longestGap: null },
    stationB: { lacking: 120, firstLacking: [4001], longestGap: { firstRound: 4001, rounds: 120 } },
  },
  alignment: {
    centre: 0,
    significance: 1e-6,
    roundsRead: 12_000,
    shifted: true,
    bestOffset: -3,
    sentence: "Station B's record runs 3 rounds behind station A's: at that offset S = 2.71, at zero 0.02.",
    series: [
      { offset: -3, chshValue: 2.71, lower: 2.3, upper: 3.12 },
      { offset: 0, chshValue: 0.02, lower: 0, upper: 0.43 },
    ],
  },
  timing: null,
};

function pairRun(changes: Partial<RunDto> = {}): RunDto {
  return {
    id: 43,
    setupId: 2,
    state: 'invalid',
    verdict: 'INVALID',
    file: { sha256: HASH_A, bytes: 240_112, originalName: 'north-hall-0314.csv' },
    stations: {
      stationB: { sha256: HASH_B, bytes: 61_090, originalName: 'mill-lane-0314.csv.gz' },
      offset: null,
      offsetReason: null,
      realignedFrom: null,
      geometry: { stationDistanceM: 1300, clockOffsetNs: 12, clockUncertaintyNs: 2 },
    },
    result: { stations: PAIR },
    ...changes,
  } as unknown as RunDto;
}

describe('StationPairPanel', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<StationPairPanel>;
  let host: HTMLElement;
  const text = (selector: string) =>
    host
      .querySelector(selector)
      ?.textContent.replace(/[ \n]+/g, ' ')
      .trim() ?? '';

  beforeAll(() => {
    jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null);
  });

  afterAll(() => jest.restoreAllMocks());

  beforeEach(() => {
    jest.useFakeTimers();
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([]), CHART_PROVIDERS] });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => {
    http.verify();
    jest.useRealTimers();
  });

  async function open(run: RunDto): Promise<void> {
    signInAs(['experimentalist']);
    fixture = TestBed.createComponent(StationPairPanel);
    fixture.componentRef.setInput('run', run);
    fixture.componentRef.setInput('setup', specSetup({ shiftLeads: [{ id: 3, name: 'Lucia Brandt', email: 'lucia.brandt@kestrelfen.example' }] }));
    host = fixture.nativeElement as HTMLElement;
    await settle(fixture);
  }

  it('shows each station’s file under the setup’s name for it, and what each side lacks', async () => {
    await open(pairRun());
    const rows = Array.from(host.querySelectorAll('[data-testid="station-files"] tr'), (row) =>
      Array.from(row.children, (cell) =>
        cell.textContent
          .replace(/[ \n]+/g, ' ')
          .replace('content_copy', '')
          .trim(),
      ),
    );
    expect(rows).toEqual([
      ['Fact', 'Station A · North Hall', 'Station B · Mill Lane'],
      ['File', 'north-hall-0314.csv', 'mill-lane-0314.csv.gz'],
      ['SHA-256', HASH_A, HASH_B],
      ['Size', '240\u2009112 bytes', '61\u2009090 bytes (gzip)'],
      ['Records', '12\u2009000', '11\u2009880'],
      ['Rounds', '1 to 12\u2009000', '1 to 12\u2009000'],
      ['Times', 'Setting and outcome times', 'None'],
    ]);
    expect(host.querySelector('bk-copy-button button')?.getAttribute('aria-label')).toBe('Copy the SHA-256 of station A’s log');
    expect(text('[data-testid="lacking"]')).toContain(
      'Station B’s log lacks 120 rounds that station A recorded (4\u2009001, …). Its longest gap: rounds 4\u2009001 to 4\u2009120 (120 rounds).',
    );
  });

  it('says a shift is why the run is INVALID, with the check’s sentence, and who may re-run it', async () => {
    await open(pairRun());
    expect(text('[data-testid="shift-invalid"]')).toContain('This is why the run is INVALID.');
    expect(text('[data-testid="alignment-sentence"]')).toBe("Station B's record runs 3 rounds behind station A's: at that offset S = 2.71, at zero 0.02.");
    expect(host.querySelector('bk-alignment-chart bk-chart-table')).not.toBeNull();
    expect(text('[data-testid="realign-who"]')).toContain('Lucia Brandt');
  });

  it('says why the timing was not checked: station B’s log has no times', async () => {
    await open(pairRun());
    expect(text('[data-testid="timing-missing"]')).toBe('The timing was not checked: station B’s log has no time columns (t_setting, t_outcome).');
  });

  it('shows a re-run’s stated offset with its reason and the run it re-runs, and its timing figures', async () => {
    const timing = {
      lightTimePs: 4_336_333,
      clockOffsetPs: 12_000,
      clockUncertaintyPs: 2_000,
      timedRounds: 11_880,
      untimedRounds: 0,
      notSpaceLike: 0,
      notSpaceLikeShare: 0,
      firstNotSpaceLike: [],
      smallestMargin: { round: 812, station: 'A' as const, picoseconds: 1_204_551 },
      histogram: [{ above: 0.2, upTo: 0.3, rounds: 11_880 }],
    };
    const realigned = pairRun({
      id: 44,
      state: 'accepted',
      verdict: 'ACCEPT',
      stations: { ...pairRun().stations!, offset: -3, offsetReason: 'Station B’s buffer dropped three triggers at start-up.', realignedFrom: 43 },
      result: { stations: { ...PAIR, alignment: { ...PAIR.alignment!, centre: -3, shifted: false }, timing } } as unknown as RunDto['result'],
    });
    await open(realigned);
    expect(text('[data-testid="stated-offset"]')).toBe(
      'tune Paired at the stated offset −3: station A’s round r is paired with station B’s round r − 3. Reason: “Station B’s buffer dropped three triggers at start-up.” · a re-run of run 43',
    );
    expect(host.querySelector('[data-testid="stated-offset"] a')?.getAttribute('href')).toBe('/runs/43');
    expect(host.querySelector('[data-testid="shift-invalid"]')).toBeNull();
    expect(text('[data-testid="smallest-margin"]')).toBe('1\u2009204.551\u2009ns (round 812, at station A’s outcome)');
    expect(text('[data-testid="not-space-like"]')).toBe('check_circle0 of 11\u2009880 (0\u2009%)');
    expect(host.querySelector('bk-margin-histogram-chart bk-chart-table')).not.toBeNull();
  });
});
