import { ChangeDetectionStrategy, Component, computed, effect, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { debounceTime, distinctUntilChanged, map, of, switchMap } from 'rxjs';

import type { PlanDto, PlanPrefillDto } from '@shared/api';
import { chshValueFromWinFraction, QUANTUM_CHSH_VALUE, QUANTUM_WIN_FRACTION, winFractionFromChshValue } from '@shared/analysis';
import { formatCount, formatFixed, formatPercent, formatScientific } from '@shared/format/numbers';
import { LIKELY_PASS } from '@shared/planner/plan-rounds';
import { loaded, type Loaded } from '../api/loaded';
import { BookNightDialog, type BookNightData } from '../bookings/book-night-dialog';
import { ProfilesApi } from '../profiles/profiles-api';
import { SetupsApi } from '../setups/setups-api';
import { GeneralPlanRunner } from './general-plan-runner';
import { PlanFigures } from './plan-figures';
import { PlanGeneralFigures } from './plan-general-figures';
import { PlanFractionChart } from './plan-fraction-chart';
import { planOutcome } from './plan-outcome';
import { PlanPassTable } from './plan-pass-table';
import { PlanRoundsChart } from './plan-rounds-chart';
import { PlannerApi } from './planner-api';
import { applyPrefill, createPlannerForm, type DeviceMeasure, FIELD_LABELS, fieldsNeedingAttention, showDeviceAs } from './planner-form';
import { profileVersionOptions, takesTestRoundsFromLog } from './profile-versions';
import { parseRoundCount } from './round-count';

/** How long typing may pause before the plan is computed again. */
const TYPING_PAUSE_MILLISECONDS = 250;

/** The inputs a setup's pooled runs fill in. */
const PREFILLED_LABELS = [FIELD_LABELS.winFraction, FIELD_LABELS.chshValue, FIELD_LABELS.qberPercent, FIELD_LABELS.profileVersionId, FIELD_LABELS.rounds];

/**
 * The round-budget planner: tonight's expected device, a profile version and a round budget in;
 * out, the pass probability of each criterion, the expected key, the smallest budgets worth taking
 * and the best test fraction, with two charts. Computed in the browser by the shared engine.
 */
@Component({
  selector: 'bk-planner-page',
  imports: [
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    PlanFigures,
    PlanFractionChart,
    PlanGeneralFigures,
    PlanPassTable,
    PlanRoundsChart,
    ReactiveFormsModule,
    RouterLink,
  ],
  templateUrl: './planner-page.html',
  styleUrl: './planner-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PlannerPage {
  private readonly plannerApi = inject(PlannerApi);
  private readonly profilesApi = inject(ProfilesApi);
  private readonly generalPlans = inject(GeneralPlanRunner);
  private readonly dialog = inject(MatDialog);

  protected readonly form = createPlannerForm();
  protected readonly labels = FIELD_LABELS;
  protected readonly quantumWinFraction = formatFixed(QUANTUM_WIN_FRACTION);
  protected readonly quantumChshValue = formatFixed(QUANTUM_CHSH_VALUE, 3);
  private readonly likelyPass = formatPercent(LIKELY_PASS, 0);

  protected readonly setups = toSignal(loaded(inject(SetupsApi).list()), { initialValue: { status: 'loading' } });
  private readonly reloadProfiles = signal(0);
  protected readonly profiles = toSignal(toObservable(this.reloadProfiles).pipe(switchMap(() => loaded(this.profilesApi.list()))), {
    initialValue: { status: 'loading' },
  });
  protected readonly setupList = computed(() => {
    const setups = this.setups();
    return setups.status === 'ready' ? setups.value : [];
  });
  protected readonly versions = computed(() => {
    const profiles = this.profiles();
    return profiles.status === 'ready' ? profileVersionOptions(profiles.value) : [];
  });

  /** The form as typed, for the hints beside the inputs. */
  protected readonly typed = toSignal(this.form.valueChanges.pipe(map(() => this.form.getRawValue())), { initialValue: this.form.getRawValue() });
  /** The form once typing pauses, with the inputs still needing attention: what the plan is computed from. */
  private readonly settled = toSignal(
    this.form.valueChanges.pipe(
      debounceTime(TYPING_PAUSE_MILLISECONDS),
      map(() => ({ value: this.form.getRawValue(), missing: fieldsNeedingAttention(this.form) })),
    ),
    { initialValue: { value: this.form.getRawValue(), missing: fieldsNeedingAttention(this.form) } },
  );

  private readonly chosenVersion = computed(() => this.versions().find((version) => version.id === this.typed().profileVersionId));
  /** Whether the chosen profile version leaves the test fraction to the lab: then it is asked for. */
  protected readonly needsTestFraction = computed(() => takesTestRoundsFromLog(this.chosenVersion()));

  protected readonly outcome = computed(() => {
    const { value, missing } = this.settled();
    return planOutcome(
      value,
      missing,
      this.versions().find((version) => version.id === value.profileVersionId),
    );
  });

  /** The general-attack plan of the same input, computed in workers and shown as its parts arrive. */
  protected readonly general = toSignal(
    toObservable(this.outcome).pipe(switchMap((outcome) => (outcome.status === 'ready' ? this.generalPlans.run({ input: outcome.input, recommended: outcome.plan }) : of(null)))),
    { initialValue: null },
  );
  protected readonly generalCurve = computed(() => {
    const general = this.general();
    return general && 'plan' in general ? general.plan.curve : undefined;
  });

  /** The other measure of the device, converted: S under an ω, ω under an S (the bounds while empty). */
  protected readonly convertedDevice = computed(() => {
    const { measure, winFraction, chshValue } = this.typed();
    if (measure === 'winFraction') {
      return winFraction === null ? 'The share of CHSH rounds won; local models reach 3/4 at most.' : `S = ${formatFixed(chshValueFromWinFraction(winFraction), 3)}`;
    }
    return chshValue === null ? `Local bound 2, quantum bound 2√2 ≈ ${this.quantumChshValue}.` : `ω = ${formatFixed(winFractionFromChshValue(chshValue))}`;
  });
  /** The round budget as read, so "2e6" shows what it means. */
  protected readonly roundsRead = computed(() => {
    const typed = this.typed().rounds;
    if (typed.trim() === '') return `Left empty: the smallest budget for a key and a ${this.likelyPass} pass. Or type e.g. 2e6.`;
    const rounds = parseRoundCount(typed);
    return rounds === null ? 'For example 2e6 or 2 000 000.' : `${formatCount(rounds)} rounds`;
  });

  /** The chosen setup's pooled runs, once asked for; null without a setup. */
  protected readonly prefill = signal<Loaded<PlanPrefillDto> | null>(null);
  /** The chosen setup, whose night "Book this night" books; null while none is chosen. */
  protected readonly chosenSetup = computed(() => this.setupList().find((setup) => setup.id === this.typed().setupId) ?? null);
  protected readonly prefillSetupName = computed(() => this.chosenSetup()?.name ?? 'The setup');

  constructor() {
    const { controls } = this.form;
    controls.setupId.valueChanges
      .pipe(
        distinctUntilChanged(),
        switchMap((setupId) => (setupId === null ? of(null) : loaded(this.plannerApi.prefill(setupId)))),
        takeUntilDestroyed(),
      )
      .subscribe((prefill) => {
        this.prefill.set(prefill);
        // The x = 0 share is never typed: it is the chosen setup's, or fair settings.
        if (prefill?.status === 'ready') applyPrefill(this.form, prefill.value);
        else controls.xZeroProbability.setValue(null);
      });
    // The test fraction is asked for, and checked, only when the profile leaves it open.
    effect(() => {
      if (this.needsTestFraction()) controls.testFractionPercent.enable();
      else controls.testFractionPercent.disable();
    });
  }

  /** Opens the booking of tonight on the chosen setup, with the rounds of the plan (or as typed). */
  protected bookNight(): void {
    const setup = this.chosenSetup();
    if (setup === null) return;
    const outcome = this.outcome();
    const plannedRounds = outcome.status === 'ready' ? outcome.plan.at.rounds : parseRoundCount(this.typed().rounds);
    this.dialog.open<BookNightDialog, BookNightData>(BookNightDialog, { data: { setup, plannedRounds }, maxWidth: '96vw' });
  }

  protected showDeviceAs(measure: DeviceMeasure): void {
    showDeviceAs(this.form, measure);
  }

  /** Why the plan is at this N when the planner chose it. */
  protected chosenRoundsNote(plan: PlanDto): string {
    return plan.roundsForPositiveKey === null || plan.roundsForLikelyPass === null
      ? `No N was given, and no budget up to ${formatScientific(plan.searchLimit)} rounds gives both a key and a ${this.likelyPass} pass: shown at the largest.`
      : `No N was given: this is the smallest budget that gives both a positive key and a ${this.likelyPass} pass.`;
  }

  protected retryProfiles(): void {
    this.reloadProfiles.update((attempt) => attempt + 1);
  }

  /** What the plan still waits for, in a sentence with the action that fixes it. */
  protected waitingFor(missing: string[]): string {
    if (missing.length === 0) {
      return this.profiles().status === 'loading' ? 'Loading the profile versions…' : `Choose the ${FIELD_LABELS.profileVersionId.toLowerCase()} the run will be judged by.`;
    }
    const named = missing.length === 1 ? missing[0] : `${missing.slice(0, -1).join(', ')} and ${missing[missing.length - 1]}`;
    const needs = `${named} ${missing.length === 1 ? 'needs' : 'need'} a valid value before the plan can be computed.`;
    const setupWouldFill = this.typed().setupId === null && missing.some((label) => PREFILLED_LABELS.includes(label));
    return setupWouldFill ? `${needs} Choose a setup to fill in what its latest accepted runs did, or type the values.` : needs;
  }

  protected readonly count = formatCount;
  protected readonly fixed = formatFixed;
  protected readonly percent = formatPercent;
}
