import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { provideRouter } from '@angular/router';

import type { PlanPrefillDto, ProfileDto, SetupDto } from '@shared/api';
import { chshValueFromWinFraction, expectedSiftedProtocol, generalAttackKeyLength, parseProfile } from '@shared/analysis';
import { formatCount } from '@shared/format/numbers';
import { planRounds } from '@shared/planner/plan-rounds';
import { CHART_PROVIDERS } from '../charts/chart-providers';
import { formatDuration } from './duration';
import { GENERAL_PLAN_WORKER, GeneralPlanRunner, type GeneralPlanWorker, type WorkerReply } from './general-plan-runner';
import { generalPlanSteps, type GeneralPlanTask } from './general-plan-steps';
import { PlannerPage } from './planner-page';
import { specSetup } from '../../testing/spec-setup';

/**
 * A planner worker in the test's own thread: it keeps the task it is given and answers only when
 * the test asks, with the real steps (each is a full key-length optimisation).
 */
class HeldWorker implements GeneralPlanWorker {
  onmessage: ((event: MessageEvent<WorkerReply>) => void) | null = null;
  task: GeneralPlanTask | null = null;
  terminated = false;
  private steps: Generator | null = null;

  postMessage(task: GeneralPlanTask): void {
    this.task = task;
    this.steps = generalPlanSteps(task);
  }

  /** Computes and delivers the task's next step. */
  answerNextStep(): void {
    const next = this.steps!.next();
    this.onmessage!({ data: next.done ? { done: true } : { step: next.value } } as MessageEvent<WorkerReply>);
  }

  terminate(): void {
    this.terminated = true;
  }
}

/** A profile version's parameters as the API sends them: complete, defaults filled in. */
function storedParameters(input: object): Record<string, unknown> {
  const parsed = parseProfile(input);
  if (!parsed.ok) throw new Error(parsed.message);
  return parsed.profile;
}

const nightly = storedParameters({ testSelection: { mode: 'fixed-fraction', fraction: 0.5 }, chshTolerance: 0.03, qberTolerance: 0.05, epsilon: 1e-9 });
const labMarked = storedParameters({ testSelection: { mode: 'from-log' }, chshTolerance: 0.03, qberTolerance: 0.05 });

const version = (id: number, profileId: number, number: number, parameters: Record<string, unknown>) => ({
  id,
  profileId,
  version: number,
  parameters,
  note: '',
  createdBy: 'Maren Holt',
  createdAt: '2026-11-20T08:00:00Z',
  usedByRuns: 0,
});

const profiles: ProfileDto[] = [
  {
    id: 1,
    name: 'Nightly standard',
    description: 'Fen link nights',
    latestVersionId: 12,
    createdAt: '2026-11-01T08:00:00Z',
    versions: [version(12, 1, 2, nightly), version(11, 1, 1, storedParameters({ chshTolerance: 0.04 }))],
  },
  {
    id: 2,
    name: 'Bench marking',
    description: 'The bench lab marks its own test rounds',
    latestVersionId: 21,
    createdAt: '2026-11-02T08:00:00Z',
    versions: [version(21, 2, 1, labMarked)],
  },
];

const setups: SetupDto[] = [specSetup({ description: 'North Hall to Mill Lane over 2.4 km of campus fibre.' })];

/** Past the pause the planner waits for while someone types. */
const pause = () => new Promise((resolve) => setTimeout(resolve, 350));

describe('PlannerPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<PlannerPage>;
  let host: HTMLElement;
  let workers: HeldWorker[];

  beforeAll(() => {
    // jsdom has no canvas (it would log that getContext is not implemented): without a context
    // ng2-charts draws nothing, while the chart's data and its spoken summary are still built.
    jest.spyOn(HTMLCanvasElement.prototype, 'getContext').mockReturnValue(null);
  });

  afterAll(() => jest.restoreAllMocks());

  beforeEach(async () => {
    workers = [];
    const startWorker = () => {
      const worker = new HeldWorker();
      workers.push(worker);
      return worker;
    };
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([]),
        CHART_PROVIDERS,
        { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } },
        GeneralPlanRunner,
        { provide: GENERAL_PLAN_WORKER, useValue: startWorker },
      ],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(PlannerPage);
    host = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    http.expectOne('/api/setups').flush(setups);
    http.expectOne('/api/profiles').flush(profiles);
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  const text = (testId: string) =>
    host
      .querySelector(`[data-testid="${testId}"]`)
      ?.textContent?.replace(/[ \n\t]+/g, ' ')
      .trim() ?? '';
  const inputValue = (testId: string) => host.querySelector<HTMLInputElement>(`[data-testid="${testId}"]`)!.value;

  async function type(testId: string, value: string): Promise<void> {
    const input = host.querySelector<HTMLInputElement>(`[data-testid="${testId}"]`)!;
    input.value = value;
    input.dispatchEvent(new Event('input'));
    await fixture.whenStable();
  }

  async function choose(control: string, option: string): Promise<void> {
    const select = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatSelectHarness.with({ selector: `[formControlName="${control}"]` }));
    await select.open();
    await select.clickOptions({ text: option });
  }

  async function settle(): Promise<void> {
    await pause();
    await fixture.whenStable();
  }

  async function typeDevice(winFraction: string, qberPercent: string, rounds: string): Promise<void> {
    await type('planner-win-fraction', winFraction);
    await type('planner-qber', qberPercent);
    await choose('profileVersionId', 'Nightly standard v2');
    await type('planner-rounds', rounds);
  }

  it('lists every profile version as "name vN" and names what is still missing', async () => {
    const select = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatSelectHarness.with({ selector: '[formControlName="profileVersionId"]' }));
    await select.open();
    const options = await select.getOptions();
    expect(await Promise.all(options.map((option) => option.getText()))).toEqual(['Nightly standard v2', 'Nightly standard v1', 'Bench marking v1']);
    await select.close();

    expect(text('planner-waiting')).toContain('Expected win fraction, Expected QBER (%) and Profile version need a valid value');
    expect(host.querySelector('[data-testid="plan-pass-all"]')).toBeNull();
  });

  it('computes the plan in the browser from the typed device, with 2e6 read as two million rounds', async () => {
    await typeDevice('0.84', '2', '2e6');
    await type('planner-trial-rate', '2000');
    expect(text('planner-form')).toContain('2\u2009000\u2009000 rounds');
    await settle();

    const expected = planRounds({ device: { winFraction: 0.84, qber: 0.02, trialRate: 2000 }, profile: nightly, rounds: 2_000_000 });
    expect(expected.at.expectedFiniteKeyBits).toBeGreaterThan(0);
    expect(text('plan-key-bits')).toContain(`${formatCount(expected.at.expectedFiniteKeyBits)} bits`);
    expect(text('plan-pass-all')).toMatch(/ · likely$/);
    expect(text('plan-pass-chsh')).toMatch(/ · likely$/);
    expect(text('plan-pass-qber')).toMatch(/ · likely$/);
    expect(text('plan-rounds-for-key')).toContain(
      `${formatCount(expected.roundsForPositiveKey!)} rounds · ${formatDuration(expected.roundsForPositiveKey! / 2000)} at 2\u2009000 rounds/s`,
    );
    expect(text('plan-rounds-for-pass')).toContain(`${formatCount(expected.roundsForLikelyPass!)} rounds`);
    expect(text('plan-acquisition')).toContain(formatDuration(2_000_000 / 2000));
    expect(text('plan-best-fraction')).toContain(`${formatCount(expected.bestTestFraction.expectedFiniteKeyBits)} bits`);
    expect(text('planner-cautions')).toContain('final security claims rest on the lab’s own proof, certification and local rules');

    const summary = (testId: string) => host.querySelector(`[data-testid="${testId}"] canvas`)?.getAttribute('aria-label') ?? '';
    expect(summary('planner-chart-rounds')).toContain(`At the chosen N of 2\u2009000\u2009000: ${formatCount(expected.at.expectedFiniteKeyBits)} bits`);
    expect(summary('planner-chart-fraction')).toContain(`${formatCount(expected.bestTestFraction.expectedFiniteKeyBits)} bits`);
  });

  it('plans at the smallest budget for both a key and a likely pass when N is left empty', async () => {
    await typeDevice('0.84', '2', '');
    await settle();

    const expected = planRounds({ device: { winFraction: 0.84, qber: 0.02 }, profile: nightly });
    const smallest = Math.max(expected.roundsForPositiveKey!, expected.roundsForLikelyPass!);
    expect(expected.at.rounds).toBe(smallest);
    expect(text('plan-chosen-rounds')).toBe('No N was given: this is the smallest budget that gives both a positive key and a 99\u2009% pass.');
    expect(host.querySelector('#bk-planner-pass-title')?.textContent).toContain(`N = ${formatCount(smallest)}`);
    expect(text('plan-key-bits')).toContain(`${formatCount(expected.at.expectedFiniteKeyBits)} bits`);
  });

  it('says in words and with an icon that a device below the threshold is unlikely to pass', async () => {
    await typeDevice('0.8', '2', '2 000 000');
    await settle();

    expect(text('plan-pass-chsh')).toMatch(/^cancel.* · unlikely$/);
    expect(text('plan-pass-all')).toMatch(/ · unlikely$/);
    expect(text('plan-pass-qber')).toMatch(/^check_circle.* · likely$/);
    expect(text('plan-rounds-for-pass')).toBe('No N up to 1e10 rounds reaches it.');
  });

  it('takes the device as S, shows it as ω, and carries the value across the toggle', async () => {
    const toggle = (name: string) => TestbedHarnessEnvironment.loader(fixture).getHarness(MatButtonToggleHarness.with({ text: name }));
    await type('planner-win-fraction', '0.84');
    await (await toggle('CHSH value S')).check();
    await fixture.whenStable();
    expect(inputValue('planner-chsh-value')).toBe('2.72');

    await type('planner-chsh-value', '2.6');
    expect(text('planner-form')).toContain('ω = 0.8250');
    await type('planner-qber', '2');
    await choose('profileVersionId', 'Nightly standard v2');
    await type('planner-rounds', '2,000,000');
    await settle();
    const expected = planRounds({ device: { winFraction: 0.825, qber: 0.02 }, profile: nightly, rounds: 2_000_000 });
    expect(text('plan-key-bits')).toContain(`${formatCount(expected.at.expectedFiniteKeyBits)} bits`);

    await (await toggle('Win fraction ω')).check();
    await fixture.whenStable();
    expect(inputValue('planner-win-fraction')).toBe('0.825');
  });

  it('asks for the test fraction only when the profile takes its test rounds from the log', async () => {
    await typeDevice('0.84', '2', '2e6');
    expect(host.querySelector('[data-testid="planner-test-fraction"]')).toBeNull();

    await choose('profileVersionId', 'Bench marking v1');
    await settle();
    expect(text('planner-waiting')).toContain('Test fraction (%) needs a valid value');

    await type('planner-test-fraction', '30');
    await settle();
    const expected = planRounds({ device: { winFraction: 0.84, qber: 0.02 }, profile: labMarked, rounds: 2_000_000, testFraction: 0.3 });
    expect(text('plan-key-bits')).toContain(`${formatCount(expected.at.expectedFiniteKeyBits)} bits`);
    expect(text('plan-key-bits')).toContain('30.0\u2009% of the rounds tested');
  });

  it('fills the form in from a setup’s pooled runs and says which runs they were', async () => {
    await choose('setupId', 'Fen link');
    const prefill: PlanPrefillDto = { setupId: 2, profileVersionId: 12, runIds: [41, 40], winFraction: 0.841234, qber: 0.018345, xZeroProbability: 0.4, rounds: 1_800_000 };
    http.expectOne('/api/planner/prefill?setupId=2').flush(prefill);
    await fixture.whenStable();

    expect(inputValue('planner-win-fraction')).toBe('0.8412');
    expect(inputValue('planner-qber')).toBe('1.83');
    expect(inputValue('planner-rounds')).toBe('1\u2009800\u2009000');
    const profile = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatSelectHarness.with({ selector: '[formControlName="profileVersionId"]' }));
    expect(await profile.getValueText()).toBe('Nightly standard v2');
    expect(text('planner-prefill')).toContain('Filled in from runs 41, 40');
    expect(Array.from(host.querySelectorAll('[data-testid="planner-prefill"] a'), (link) => link.getAttribute('href'))).toEqual(['/runs/41', '/runs/40']);

    await settle();
    const expected = planRounds({ device: { winFraction: 0.8412, qber: 0.0183, xZeroProbability: 0.4 }, profile: nightly, rounds: 1_800_000 });
    const fair = planRounds({ device: { winFraction: 0.8412, qber: 0.0183 }, profile: nightly, rounds: 1_800_000 });
    // The setup's uneven settings change the key, so the plan shows whether they were used.
    expect(expected.at.expectedFiniteKeyBits).not.toBe(fair.at.expectedFiniteKeyBits);
    expect(text('plan-key-bits')).toContain(`${formatCount(expected.at.expectedFiniteKeyBits)} bits`);
  });

  it('books the chosen setup’s night with the plan’s rounds', async () => {
    const bookButton = () => host.querySelector<HTMLButtonElement>('[data-testid="book-night"]')!;
    expect(bookButton().disabled).toBe(true);
    expect(text('planner-book-hint')).toBe('Choose a setup to book its night.');

    await choose('setupId', 'Fen link');
    const prefill: PlanPrefillDto = { setupId: 2, profileVersionId: 12, runIds: [], winFraction: 0.84, qber: 0.02, xZeroProbability: null, rounds: 1_800_000 };
    http.expectOne('/api/planner/prefill?setupId=2').flush(prefill);
    await settle();
    bookButton().click();
    await fixture.whenStable();
    http.expectOne('/api/profiles').flush(profiles);
    await fixture.whenStable();

    const dialog = await TestbedHarnessEnvironment.documentRootLoader(fixture).getHarness(MatDialogHarness);
    expect(await dialog.getTitleText()).toBe('Book a night on Fen link');
    expect(document.querySelector<HTMLInputElement>('[data-testid="book-rounds"]')?.value).toBe(formatCount(1_800_000));
    await dialog.close();
  });

  it('shows the planner’s own sentence when it refuses an input, naming the field', async () => {
    await typeDevice('0.84', '2', '50');
    await settle();

    expect(text('planner-refused')).toMatch(/^Rounds \(N\): The round budget must be a whole number from 100/);
    expect(host.querySelector('[data-testid="plan-pass-all"]')).toBeNull();
  });

  it('computes the key against general attacks in workers, shows it as it arrives, and drops a stale plan', async () => {
    await typeDevice('0.84', '2', '2e6');
    await settle();
    const running = workers.filter((worker) => !worker.terminated);
    expect(running.map((worker) => worker.task!.part).sort()).toEqual(['gamma', 'rounds']);
    expect(text('plan-general-bits')).toBe('Computing…');
    expect(text('plan-general-model')).toContain('This profile judges by collective attacks');

    const rounds = running.find((worker) => worker.task!.part === 'rounds')!;
    rounds.answerNextStep();
    await fixture.whenStable();
    // The profile has no general settings: the protocol is designed for the typed device, ε = 1e-10.
    const expected = generalAttackKeyLength({ ...expectedSiftedProtocol(2_000_000, 0.5), soundness: 1e-10, design: { chshValue: chshValueFromWinFraction(0.84), qber: 0.02 } });
    expect(text('plan-general-bits')).toContain(`${formatCount(expected.bits)} bits`);
    expect(text('plan-general-bits')).toContain(`syndrome ${formatCount(expected.syndromeBits)} bits`);
    expect(text('plan-general-rounds-for-key')).toBe('Computing…');
    expect(text('plan-general-cautions')).toContain('designed for the expected device');

    // A new input stops the workers of the old one.
    await type('planner-rounds', '3e6');
    await settle();
    expect(running.every((worker) => worker.terminated)).toBe(true);
    expect(workers.filter((worker) => !worker.terminated).map((worker) => worker.task!.input.rounds)).toEqual([3_000_000, 3_000_000]);
  });
});
