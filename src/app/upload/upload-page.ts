import { ChangeDetectionStrategy, Component, computed, DestroyRef, effect, inject, signal, untracked, type WritableSignal } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatButtonToggleModule } from '@angular/material/button-toggle';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { ActivatedRoute, Router, RouterLink } from '@angular/router';
import { DateTime } from 'luxon';
import { catchError, last, map, type Observable, of, switchMap, tap } from 'rxjs';

import { FINISHED_STATES, otherStation, STATIONS, type BookingDto, type RunDto, type StationName } from '@shared/api';
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
import { LogDrop } from './log-drop';
import { headerNames, previewLog, readLogSample, sameMapping, startingMapping, type LogSample } from './log-preview';
import { ResumableUploads, type UploadArrival } from './resumable-uploads';
import { stationLogsRefusal } from './station-log-check';
import { StationLogPicker, type PickedStationLog } from './station-log-picker';
import { arrivalSentence, sendStationLogs, type StationLogUpload } from './station-uploads';
import type { LogUpload } from './upload-metadata';
import { ShownDatePipe } from '../dates/shown-dates';

/** Where the upload is. */
type UploadPhase = 'choosing' | 'uploading' | 'analysing' | 'finished';

/** How the night's data comes: one joined log, or each station's own log. */
type LogSource = 'joined' | 'stations';

/** The mapping's controls: a header name per round field (null: not in the log), and the outcome encoding. */
type MappingControls = Record<RoundField, FormControl<string | null>> & { outcomes: FormControl<OutcomeEncoding> };

/**
 * Uploading a night's log: setup, the booking it joins (and why it replaces the night's earlier log),
 * the file (dropped or picked, plain or gzip), its first rows read in the browser under an editable
 * column mapping, then the resumable upload's progress and the analysis's progress up to the verdict.
 * Or the two stations' own logs, either alone: each checked against its station's columns, sent with
 * its station, and the night a run once both are in.
 */
@Component({
  selector: 'bk-upload-page',
  imports: [
    ShownDatePipe,
    DayField,
    LogDrop,
    MatButtonModule,
    MatButtonToggleModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatSelectModule,
    ReactiveFormsModule,
    RouterLink,
    StationLogPicker,
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

  protected readonly source = signal<LogSource>('joined');
  protected readonly file = signal<File | null>(null);
  protected readonly sample = signal<LogSample | null>(null);
  protected readonly sampleFailure = signal('');

  /** Each station's log picked for upload. */
  protected readonly stationLogs: Record<StationName, WritableSignal<PickedStationLog | null>> = { A: signal(null), B: signal(null) };
  /** The stations whose logs are picked, A first. */
  protected readonly pickedStations = computed(() => STATIONS.filter((station) => this.stationLogs[station]() !== null));
  /** Why the station logs cannot be sent as they are, or empty when they can. */
  protected readonly stationsRefusal = computed(() => {
    const picked = this.pickedStations().map((station) => ({ station, check: this.stationLogs[station]()!.check }));
    return stationLogsRefusal(picked, this.needsTestColumn());
  });
  /** The station whose log is given alone (the night then waits for the other's), or null. */
  protected readonly loneStation = computed(() => {
    const picked = this.pickedStations();
    return picked.length === 1 ? picked[0] : null;
  });
  protected readonly otherStation = otherStation;
  /** What each station's log made, once sent. */
  protected readonly arrivals = signal<{ station: StationName; arrival: UploadArrival }[]>([]);
  protected readonly arrivalSentence = arrivalSentence;
  /** The station whose log the night waits for after the last upload, or null. */
  protected readonly nightWaitsFor = computed(() => {
    const latest = this.arrivals().at(-1);
    return latest?.arrival.kind === 'waiting' ? otherStation(latest.station) : null;
  });
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
  /** Whether what is chosen cannot be sent. */
  protected readonly uploadRefused = computed(() => (this.source() === 'joined' ? this.previewRefuses() : this.stationsRefusal() !== ''));

  protected readonly phase = signal<UploadPhase>('choosing');
  protected readonly uploaded = signal(0);
  protected readonly run = signal<RunDto | null>(null);
  protected readonly failure = signal('');
  protected readonly uploadPercent = computed(() => Math.round(this.uploaded() * 100));
  /** The files being sent or analysed, by name. */
  protected readonly uploadTitle = computed(() => {
    const run = this.run();
    if (run !== null) return run.stations ? `${run.file.originalName} and ${run.stations.stationB.originalName}` : run.file.originalName;
    if (this.source() === 'joined') return this.file()?.name ?? '';
    return this.pickedStations()
      .map((station) => this.stationLogs[station]()!.file.name)
      .join(' and ');
  });
  protected readonly count = formatCount;
  /** The latest acquisition date: today, in the browser's zone (the server allows today anywhere on Earth). */
  protected readonly today = DateTime.now().startOf('day');
  /** What the acquisition date is for: the booking's night, or (unbooked) what pairs station logs. */
  protected readonly acquiredOnHint = computed(() => {
    if (this.chosenBooking()) return 'The booking’s night.';
    return this.source() === 'stations' ? 'The night the rounds were taken: station logs pair by it.' : 'The night the rounds were taken (optional).';
  });

  constructor() {
    const shownRun = Number(inject(ActivatedRoute).snapshot.queryParamMap.get('run'));
    if (Number.isSafeInteger(shownRun) && shownRun > 0) {
      this.uploaded.set(1);
      this.watchRun(shownRun)
        .pipe(
          catchError((error: unknown) => this.refused(error)),
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
      // Unbooked station logs pair by setup and night: the night must be named.
      const nightNeeded = booking === null && this.source() === 'stations';
      untracked(() => {
        // Added and removed, not set: setting would drop the date field's own validators (a date after today).
        if (nightNeeded) acquiredOn.addValidators(Validators.required);
        else acquiredOn.removeValidators(Validators.required);
        acquiredOn.updateValueAndValidity();
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
    const { setupId } = this.form.getRawValue();
    const nothingChosen = this.source() === 'joined' ? file === null : this.pickedStations().length === 0;
    if (this.form.invalid || nothingChosen || setupId === null || this.uploadRefused() || this.bookingsLoading()) {
      this.form.markAllAsTouched();
      return;
    }
    this.phase.set('uploading');
    this.uploaded.set(0);
    this.failure.set('');
    this.arrivals.set([]);
    if (this.source() === 'stations') this.sendStationLogs(setupId);
    else this.sendJoinedLog(file!, setupId);
  }

  /** The fields every log of this upload carries, besides the file and its mapping. */
  private uploadFields(setupId: number): Omit<LogUpload, 'log' | 'mapping'> {
    const { bookingId, replacementReason, acquiredOn, notes } = this.form.getRawValue();
    return { setupId, bookingId, replacementReason, acquiredOn: bookingId === null ? (isoDay(acquiredOn) ?? '') : '', notes };
  }

  private sendJoinedLog(file: File, setupId: number): void {
    this.uploads
      .send({ ...this.uploadFields(setupId), log: file, mapping: this.columnMapping() })
      .pipe(
        switchMap((progress) => {
          if (progress.kind === 'sending') {
            this.uploaded.set(progress.fraction);
            return of(null);
          }
          // A joined log always makes a run: only a station's own log waits.
          if (progress.kind !== 'done') return of(null);
          this.uploaded.set(1);
          return this.followRun(progress.run);
        }),
        catchError((error: unknown) => this.refused(error)),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe();
  }

  /** Sends the picked station logs one after the other; follows the run when the pair is one, else says what the night waits for. */
  private sendStationLogs(setupId: number): void {
    const fields = this.uploadFields(setupId);
    const logs = this.pickedStations().map((station): StationLogUpload => {
      const { file, check } = this.stationLogs[station]()!;
      return { ...fields, station, log: file, mapping: { columns: {}, outcomes: check?.ok ? check.outcomes : '0/1' } };
    });
    let madeRun: RunDto | null = null;
    sendStationLogs((log) => this.uploads.send(log), logs)
      .pipe(
        tap((progress) => {
          if (progress.kind === 'sending') {
            this.uploaded.set(progress.fraction);
            return;
          }
          this.arrivals.update((arrivals) => [...arrivals, { station: progress.station, arrival: progress.arrival }]);
          if (progress.arrival.kind === 'done') madeRun = progress.arrival.run;
        }),
        last(),
        switchMap(() => {
          this.uploaded.set(1);
          if (madeRun !== null) return this.followRun(madeRun);
          this.phase.set('finished');
          return of(null);
        }),
        catchError((error: unknown) => this.refused(error)),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe();
  }

  /** Shows the run made by an upload and follows its analysis; the address names it, so a reload while it is analysed comes back to it. */
  private followRun(run: RunDto): Observable<RunDto> {
    this.run.set(run);
    void this.router.navigate([], { queryParams: { run: run.id }, replaceUrl: true });
    return this.watchRun(run.id);
  }

  /** Back to the form with the server's refusal. */
  private refused(error: unknown): Observable<null> {
    this.failure.set(apiErrorMessage(error));
    this.phase.set('choosing');
    return of(null);
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

  /** "station B’s log (Mill Lane)", with the chosen setup's name for the station. */
  protected stationLogNamed(station: StationName): string {
    const setup = this.chosenSetup();
    const label = setup === null ? '' : station === 'A' ? setup.stationALabel : setup.stationBLabel;
    return `station ${station}’s log${label ? ` (${label})` : ''}`;
  }

  protected startAgain(): void {
    void this.router.navigate([], { queryParams: { run: null }, replaceUrl: true });
    this.phase.set('choosing');
    this.run.set(null);
    this.arrivals.set([]);
    this.file.set(null);
    this.sample.set(null);
    for (const station of STATIONS) this.stationLogs[station].set(null);
    this.form.controls.notes.reset('');
    this.form.controls.replacementReason.reset('');
    if (this.form.controls.acquiredOn.enabled) this.form.controls.acquiredOn.reset(null);
    this.reloadBookings.update((attempt) => attempt + 1);
  }
}
