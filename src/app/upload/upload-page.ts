import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, effect, inject, signal, untracked } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { DateTime } from 'luxon';
import { catchError, map, type Observable, of, switchMap, tap } from 'rxjs';

import { FINISHED_STATES, type BookingDto, type RunDto } from '@shared/api';
import { type ColumnMapping, FIELD_MEANING, OUTCOME_ENCODINGS, type OutcomeEncoding, ROUND_FIELDS, type RoundField } from '@shared/analysis';
import { formatCount } from '@shared/format/numbers';
import { apiErrorMessage } from '../api/api-error-message';
import { failureMessage, loaded, readyValue, type Loaded } from '../api/loaded';
import { BookingsApi } from '../bookings/bookings-api';
import { DayField } from '../dates/day-field';
import { isoDay, type PickedDay } from '../dates/local-dates';
import { profileVersionOptions, takesTestRoundsFromLog } from '../planner/profile-versions';
import { ProfilesApi } from '../profiles/profiles-api';
import { RunsApi } from '../runs/runs-api';
import { VerdictBanner } from '../runs/verdict-banner';
import { SetupsApi } from '../setups/setups-api';
import { openBookings, replacementIn } from './booking-choice';
import { headerNames, previewLog, readLogSample, sameMapping, startingMapping, type LogSample } from './log-preview';
import { ResumableUploads } from './resumable-uploads';

/** Where the upload is. */
type UploadPhase = 'choosing' | 'uploading' | 'analysing' | 'finished';

/** The mapping's controls: a header name per round field (null: not in the log), and the outcome encoding. */
type MappingControls = Record<RoundField, FormControl<string | null>> & { outcomes: FormControl<OutcomeEncoding> };

/**
 * Uploading a night's log: setup, the booking it joins (and why it replaces the night's earlier log),
 * the file (dropped or picked, plain or gzip), its first rows read in the browser under an editable
 * column mapping, then the resumable upload's progress and the analysis's progress up to the verdict.
 */
@Component({
  selector: 'bk-upload-page',
  imports: [
    DatePipe,
    DayField,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    ReactiveFormsModule,
    RouterLink,
    VerdictBanner,
  ],
  templateUrl: './upload-page.html',
  styleUrl: './upload-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class UploadPage {
  private readonly runsApi = inject(RunsApi);
  private readonly bookingsApi = inject(BookingsApi);
  private readonly uploads = inject(ResumableUploads);
  private readonly destroyRef = inject(DestroyRef);
  private readonly router = inject(Router);
  private readonly setupsApi = inject(SetupsApi);

  protected readonly fields = ROUND_FIELDS.map((field) => ({ field, meaning: FIELD_MEANING[field] }));
  protected readonly encodings = OUTCOME_ENCODINGS;

  protected readonly form = new FormGroup({
    setupId: new FormControl<number | null>(null, Validators.required),
    // The booking the log joins; null only when the setup has none open (the run is then unbooked).
    bookingId: new FormControl<number | null>(null),
    // Asked for, and required, when the chosen booking has a log already.
    replacementReason: new FormControl('', { nonNullable: true, validators: Validators.maxLength(2000) }),
    // Shown, never chosen: a run is judged under its booking's profile, or its setup's (the server refuses another).
    profileVersionId: new FormControl<number | null>({ value: null, disabled: true }),
    acquiredOn: new FormControl<PickedDay>(null),
    notes: new FormControl('', { nonNullable: true, validators: Validators.maxLength(4000) }),
  });
  protected readonly mapping = new FormGroup<MappingControls>({
    ...(Object.fromEntries(ROUND_FIELDS.map((field) => [field, new FormControl<string | null>(null)])) as Record<RoundField, FormControl<string | null>>),
    outcomes: new FormControl<OutcomeEncoding>('0/1', { nonNullable: true }),
  });

  protected readonly setups = toSignal(loaded(this.setupsApi.list()), { initialValue: { status: 'loading' } });
  protected readonly profiles = toSignal(loaded(inject(ProfilesApi).list()), { initialValue: { status: 'loading' } });
  protected readonly setupList = computed(() => readyValue(this.setups()) ?? []);
  protected readonly versions = computed(() => profileVersionOptions(readyValue(this.profiles()) ?? []));

  protected readonly setupId = toSignal(this.form.controls.setupId.valueChanges, { initialValue: null });
  private readonly bookingId = toSignal(this.form.controls.bookingId.valueChanges, { initialValue: null });
  /** Asks for the setup's bookings again after an upload, which added an attempt to one. */
  private readonly reloadBookings = signal(0);
  /** The chosen setup's bookings (none before a setup is chosen). */
  private readonly bookings = toSignal(
    toObservable(computed(() => ({ setupId: this.setupId(), attempt: this.reloadBookings() }))).pipe(
      switchMap(({ setupId }) => (setupId === null ? of<Loaded<BookingDto[]>>({ status: 'ready', value: [] }) : loaded(this.bookingsApi.list(setupId)))),
    ),
    { initialValue: { status: 'ready', value: [] } },
  );
  protected readonly bookingsLoading = computed(() => this.bookings().status === 'loading');
  protected readonly bookingsFailure = computed(() => failureMessage(this.bookings()));
  /** The bookings the log can join now, latest window first. */
  protected readonly openBookingList = computed(() => openBookings(readyValue(this.bookings()) ?? [], new Date()));
  protected readonly chosenBooking = computed(() => this.openBookingList().find((booking) => booking.id === this.bookingId()) ?? null);
  /** The night's log this upload would replace, if the chosen booking has one. */
  protected readonly replacement = computed(() => replacementIn(this.chosenBooking()));

  /** The profile version that judges the run: the booking's, or the setup's latest. */
  private readonly judgingVersionId = computed(() => {
    const setup = this.setupList().find((candidate) => candidate.id === this.setupId());
    const setupProfile = readyValue(this.profiles())?.find((profile) => profile.id === setup?.defaultProfileId);
    return this.chosenBooking()?.profileVersionId ?? setupProfile?.latestVersionId ?? null;
  });
  /** Whether that version takes its test rounds from the log's own `test` column. */
  protected readonly needsTestColumn = computed(() => takesTestRoundsFromLog(this.versions().find((version) => version.id === this.judgingVersionId())));

  protected readonly file = signal<File | null>(null);
  protected readonly sample = signal<LogSample | null>(null);
  protected readonly sampleFailure = signal('');
  protected readonly dragging = signal(false);
  protected readonly headers = computed(() => (this.sample() === null ? [] : headerNames(this.sample()!)));

  private readonly mappingValue = toSignal(this.mapping.valueChanges.pipe(map(() => this.mapping.getRawValue())), {
    initialValue: this.mapping.getRawValue(),
  });
  /** The mapping as the API takes it. */
  protected readonly columnMapping = computed<ColumnMapping>(() => {
    const value = this.mappingValue();
    const columns = Object.fromEntries(ROUND_FIELDS.flatMap((field) => (value[field] ? [[field, value[field]]] : [])));
    return { columns, outcomes: value.outcomes };
  });
  protected readonly chosenSetup = computed(() => this.setupList().find((setup) => setup.id === this.setupId()) ?? null);
  /** Mappings saved on this page, by setup: they replace what the setup list said when it loaded. */
  private readonly savedHere = signal<ReadonlyMap<number, ColumnMapping | null>>(new Map());
  /** The chosen setup's saved column mapping, or null. */
  protected readonly savedMapping = computed(() => {
    const setup = this.chosenSetup();
    if (setup === null) return null;
    return this.savedHere().has(setup.id) ? this.savedHere().get(setup.id)! : setup.columnMapping;
  });
  /** Where the mapping on screen started from, in a sentence. */
  protected readonly mappingNote = signal('');
  /** Whether the mapping on screen is the one saved for the setup. */
  protected readonly mappingIsSaved = computed(() => {
    const saved = this.savedMapping();
    return saved !== null && sameMapping(saved, this.columnMapping());
  });
  protected readonly mappingSaving = signal(false);
  protected readonly mappingSaveFailure = signal('');

  protected readonly preview = computed(() => {
    const sample = this.sample();
    return sample === null ? null : previewLog(sample, this.columnMapping(), this.needsTestColumn());
  });
  protected readonly badRows = computed(() => {
    const preview = this.preview();
    return preview?.ok ? preview.rows.filter((row) => row.round === null).length : 0;
  });

  /** Whether the preview already shows the run would be INVALID: no header fit, no rounds, or rows breaking the rules. */
  protected readonly previewRefuses = computed(() => !this.preview()?.ok || this.badRows() > 0);

  protected readonly phase = signal<UploadPhase>('choosing');
  protected readonly uploaded = signal(0);
  protected readonly run = signal<RunDto | null>(null);
  protected readonly failure = signal('');
  protected readonly uploadPercent = computed(() => Math.round(this.uploaded() * 100));
  protected readonly count = formatCount;

  constructor() {
    const shownRun = Number(inject(ActivatedRoute).snapshot.queryParamMap.get('run'));
    if (Number.isSafeInteger(shownRun) && shownRun > 0) {
      this.uploaded.set(1);
      this.watchRun(shownRun)
        .pipe(
          catchError((error: unknown) => {
            this.failure.set(apiErrorMessage(error));
            this.phase.set('choosing');
            return of(null);
          }),
          takeUntilDestroyed(this.destroyRef),
        )
        .subscribe();
    }
    // A new file or another setup starts the mapping again: from the setup's saved one when the header fits it.
    effect(() => {
      const sample = this.sample();
      const saved = this.savedMapping();
      const setupName = this.chosenSetup()?.name ?? '';
      if (sample === null) return;
      untracked(() => {
        const { mapping, note } = startingMapping(sample, saved, setupName, this.needsTestColumn());
        this.mapping.setValue({
          ...(Object.fromEntries(ROUND_FIELDS.map((field) => [field, mapping.columns[field] ?? null])) as Record<RoundField, string | null>),
          outcomes: mapping.outcomes,
        });
        this.mappingNote.set(note);
      });
    });
    const { bookingId, replacementReason, profileVersionId, acquiredOn } = this.form.controls;
    // The booking the server would pick is chosen; "unbooked" is there only when none is open.
    effect(() => {
      const first = this.openBookingList()[0]?.id ?? null;
      untracked(() => bookingId.setValue(first));
    });
    effect(() => {
      const booking = this.chosenBooking();
      const replacing = this.replacement() !== null;
      const versionId = this.judgingVersionId();
      untracked(() => {
        profileVersionId.setValue(versionId);
        replacementReason.setValidators(replacing ? [Validators.required, Validators.maxLength(2000)] : Validators.maxLength(2000));
        replacementReason.updateValueAndValidity();
        // A booked log is of its booking's night: the server refuses another date.
        if (booking) {
          acquiredOn.setValue(DateTime.fromISO(booking.night));
          acquiredOn.disable();
        } else if (acquiredOn.disabled) {
          acquiredOn.reset(null);
          acquiredOn.enable();
        }
      });
    });
  }

  protected dropLog(event: DragEvent): void {
    event.preventDefault();
    this.dragging.set(false);
    const file = event.dataTransfer?.files.item(0);
    if (file) void this.chooseLog(file);
  }

  protected pickLog(input: HTMLInputElement): void {
    const file = input.files?.item(0);
    if (file) void this.chooseLog(file);
  }

  /** Reads the start of the file; the mapping is then filled in (see the constructor). */
  async chooseLog(file: File): Promise<void> {
    this.file.set(file);
    this.sample.set(null);
    this.sampleFailure.set('');
    try {
      this.sample.set(await readLogSample(file));
    } catch {
      this.sampleFailure.set('The file could not be read: it may be damaged gzip. Choose another file.');
    }
  }

  /** Saves the mapping on screen for the chosen setup: its later uploads start from it. */
  protected saveMapping(): void {
    const setup = this.chosenSetup();
    if (setup === null || this.mappingSaving()) return;
    const mapping = this.columnMapping();
    this.mappingSaving.set(true);
    this.mappingSaveFailure.set('');
    this.setupsApi.saveColumnMapping(setup.id, mapping).subscribe({
      next: (saved) => {
        this.mappingSaving.set(false);
        this.savedHere.update((map) => new Map(map).set(setup.id, saved.columnMapping));
      },
      error: (error: unknown) => {
        this.mappingSaving.set(false);
        this.mappingSaveFailure.set(apiErrorMessage(error));
      },
    });
  }

  protected upload(): void {
    const file = this.file();
    // A second click before the page shows the upload must not send the log again.
    if (this.phase() !== 'choosing') return;
    const { setupId, bookingId, replacementReason, acquiredOn, notes } = this.form.getRawValue();
    if (this.form.invalid || file === null || setupId === null || this.previewRefuses() || this.bookingsLoading()) {
      this.form.markAllAsTouched();
      return;
    }
    this.phase.set('uploading');
    this.uploaded.set(0);
    this.failure.set('');
    this.uploads
      .send({
        log: file,
        setupId,
        mapping: this.columnMapping(),
        bookingId,
        replacementReason,
        acquiredOn: bookingId === null ? (isoDay(acquiredOn) ?? '') : '',
        notes,
      })
      .pipe(
        switchMap((progress) => {
          if (progress.kind === 'sending') {
            this.uploaded.set(progress.fraction);
            return of(null);
          }
          this.uploaded.set(1);
          this.run.set(progress.run);
          // The address names the run: a reload while it is analysed comes back to it.
          void this.router.navigate([], { queryParams: { run: progress.run.id }, replaceUrl: true });
          return this.watchRun(progress.run.id);
        }),
        catchError((error: unknown) => {
          this.failure.set(apiErrorMessage(error));
          this.phase.set('choosing');
          return of(null);
        }),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe();
  }

  /** Follows the run until its analysis ends, keeping the page's run up to date. */
  private watchRun(runId: number): Observable<RunDto> {
    this.phase.set('analysing');
    return this.runsApi.watch(runId).pipe(
      tap((run) => {
        this.run.set(run);
        if (FINISHED_STATES.includes(run.state)) this.phase.set('finished');
      }),
    );
  }

  protected startAgain(): void {
    void this.router.navigate([], { queryParams: { run: null }, replaceUrl: true });
    this.phase.set('choosing');
    this.run.set(null);
    this.file.set(null);
    this.sample.set(null);
    this.form.controls.notes.reset('');
    this.form.controls.replacementReason.reset('');
    if (this.form.controls.acquiredOn.enabled) this.form.controls.acquiredOn.reset(null);
    this.reloadBookings.update((attempt) => attempt + 1);
  }
}
