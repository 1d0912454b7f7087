import { DOCUMENT } from '@angular/common';
import { afterNextRender, ChangeDetectionStrategy, Component, computed, effect, inject, Injector, input, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { ActivatedRoute, RouterLink } from '@angular/router';
import { catchError, distinctUntilChanged, filter, of, switchMap } from 'rxjs';

import type { RunDto, SetupDto, SignOffDto, WithdrawalDto } from '@shared/api';
import { formatCount, formatFixed, formatScientific } from '@shared/format/numbers';
import { loaded, type Loaded } from '../api/loaded';
import { SetupsApi } from '../setups/setups-api';
import { CorrelatorChart } from './correlator-chart';
import { DriftChart } from './drift-chart';
import { criteriaTable, winThresholdOf } from '@shared/analysis';
import { missingRoundsFigures } from './missing-rounds-figures';
import { RunBooking } from './run-booking';
import { RunChecks } from './run-checks';
import { RunExportMenu } from './run-export-menu';
import { RunFigures } from './run-figures';
import { RunIntegrity } from './run-integrity';
import { RunReverifications } from './run-reverifications';
import { RunWithdrawal } from './run-withdrawal';
import { RunsApi } from './runs-api';
import { SecurityParameters } from './security-parameters';
import { SettingPairsTable } from './setting-pairs-table';
import { SettingsTable } from './settings-table';
import { SignOffPanel } from './sign-off-panel';
import { StationPairPanel } from './station-pair-panel';
import { TextWithAddresses } from '../users/text-with-addresses';
import { trailDetail, trailWords } from './trail-words';
import { VerdictBanner } from './verdict-banner';
import { ShownDatePipe } from '../dates/shown-dates';

/** The id of the sign-off panel, and the fragment the verdict mail's link ends in. */
const SIGN_OFF_ANCHOR = 'sign-off';

/**
 * One run: verdict and why, booking, (for two station logs) the pair's files, alignment and timing,
 * criteria, setting pairs, figures, charts, security parameters, checks, provenance, integrity,
 * re-verifications, sign-off and trail.
 */
@Component({
  selector: 'bk-run-page',
  imports: [
    CorrelatorChart,
    ShownDatePipe,
    DriftChart,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    RouterLink,
    RunBooking,
    RunChecks,
    RunExportMenu,
    RunFigures,
    RunIntegrity,
    RunReverifications,
    RunWithdrawal,
    SecurityParameters,
    SettingPairsTable,
    SettingsTable,
    SignOffPanel,
    StationPairPanel,
    TextWithAddresses,
    VerdictBanner,
  ],
  templateUrl: './run-page.html',
  styleUrl: './run-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RunPage {
  private readonly runsApi = inject(RunsApi);
  private readonly setupsApi = inject(SetupsApi);

  /** The run's id, from the route. */
  readonly id = input.required<string>();

  private readonly reload = signal(0);
  private readonly recordedSignOff = signal<SignOffDto | null>(null);

  private readonly live = toSignal(
    toObservable(computed(() => ({ id: Number(this.id()), attempt: this.reload() }))).pipe(
      switchMap(({ id }) =>
        Number.isInteger(id) && id > 0 ? loaded(this.runsApi.watch(id)) : of<Loaded<RunDto>>({ status: 'failed', message: 'There is no run with this number.' }),
      ),
    ),
    { initialValue: { status: 'loading' } },
  );

  private readonly recordedWithdrawal = signal<WithdrawalDto | null>(null);
  /** The run, with a sign-off or withdrawal made on this page. */
  protected readonly run = computed<RunDto | null>(() => {
    const live = this.live();
    if (live.status !== 'ready') return null;
    const signOff = this.recordedSignOff();
    const withdrawal = this.recordedWithdrawal();
    return {
      ...live.value,
      ...(signOff && { signOff, signedOff: true }),
      ...(withdrawal && { withdrawal, withdrawn: true }),
    };
  });
  protected readonly failure = computed(() => {
    const live = this.live();
    return live.status === 'failed' ? live.message : '';
  });
  protected readonly result = computed(() => this.run()?.result ?? null);
  protected readonly analysed = computed(() => {
    const result = this.result();
    return result !== null && result.chsh !== null && result.qber !== null && result.key !== null && result.counts !== null ? result : null;
  });
  protected readonly criteria = computed(() => (this.analysed() ? criteriaTable(this.analysed()!) : []));
  protected readonly epsilon = computed(() => formatScientific(this.result()?.profile.epsilon));
  protected readonly missingRounds = computed(() => missingRoundsFigures(this.result()?.missingRounds));
  protected readonly winThreshold = computed(() => (this.analysed() ? winThresholdOf(this.analysed()!) : 0));

  protected readonly setup = toSignal(
    toObservable(computed(() => this.run()?.setupId ?? null)).pipe(
      distinctUntilChanged(),
      filter((setupId) => setupId !== null),
      switchMap((setupId) => this.setupsApi.get(setupId).pipe(catchError(() => of(null)))),
    ),
    { initialValue: null as SetupDto | null },
  );

  protected readonly trail = toSignal(
    toObservable(
      computed(() => {
        const run = this.run();
        return run === null ? null : `${run.id}:${run.state}:${run.signedOff}:${run.withdrawn}:${run.deliveries.length}`;
      }),
    ).pipe(
      distinctUntilChanged(),
      filter((key) => key !== null),
      switchMap((key) => loaded(this.runsApi.trail(Number(key.split(':')[0])))),
    ),
    { initialValue: { status: 'loading' } },
  );

  protected readonly signOffAnchor = SIGN_OFF_ANCHOR;
  protected readonly trailWords = trailWords;
  protected readonly trailDetail = trailDetail;
  protected readonly count = formatCount;
  protected readonly fixed = formatFixed;

  constructor() {
    // The verdict mail links to /runs/N#sign-off: once the run is on screen, its sign-off is shown.
    const fragment = toSignal(inject(ActivatedRoute).fragment, { initialValue: null });
    const document = inject(DOCUMENT);
    const injector = inject(Injector);
    const scrolled = effect(() => {
      if (this.run() === null || fragment() !== SIGN_OFF_ANCHOR) return;
      scrolled.destroy();
      afterNextRender(() => document.getElementById(SIGN_OFF_ANCHOR)?.scrollIntoView({ block: 'start' }), { injector });
    });
  }

  protected retry(): void {
    this.reload.update((attempt) => attempt + 1);
  }

  protected keepSignOff(signOff: SignOffDto): void {
    this.recordedSignOff.set(signOff);
  }

  protected keepWithdrawal(withdrawal: WithdrawalDto): void {
    this.recordedWithdrawal.set(withdrawal);
  }
}
