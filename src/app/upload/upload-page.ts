import { HttpEventType } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, inject, signal } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { catchError, filter, map, of, startWith, switchMap, tap } from 'rxjs';

import { FINISHED_STATES, type ProfileDto, type RunDto, type SetupDto } from '../../../shared/api';
import { OUTCOME_ENCODINGS, type ColumnMapping, type OutcomeEncoding } from '../../../shared/analysis/log/column-mapping';
import { FIELD_MEANING, ROUND_FIELDS, type RoundField } from '../../../shared/analysis/log/round-fields';
import { formatCount } from '../../../shared/format/numbers';
import { apiErrorMessage } from '../api/api-error-message';
import { loaded, type Loaded } from '../api/loaded';
import { ProfilesApi } from '../profiles/profiles-api';
import { RunsApi } from '../runs/runs-api';
import { VerdictBanner } from '../runs/verdict-banner';
import { SetupsApi } from '../setups/setups-api';
import { guessMapping, headerNames, previewLog, readLogSample, type LogSample } from './log-preview';

/** Where the upload is. */
type UploadPhase = 'choosing' | 'uploading' | 'analysing' | 'finished';

/** The mapping's controls: a header name per round field (null: not in the log), and the outcome encoding. */
type MappingControls = Record<RoundField, FormControl<string | null>> & { outcomes: FormControl<OutcomeEncoding> };

/**
 * Uploading a night's log: setup and profile, the file (dropped or picked, plain or gzip), its first
 * rows read in the browser under an editable column mapping, then the upload's progress and the
 * analysis's progress up to the verdict.
 */
@Component({
  selector: 'bk-upload-page',
  imports: [
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
  private readonly destroyRef = inject(DestroyRef);

  protected readonly fields = ROUND_FIELDS.map((field) => ({ field, meaning: FIELD_MEANING[field] }));
  protected readonly encodings = OUTCOME_ENCODINGS;

  protected readonly form = new FormGroup({
    setupId: new FormControl<number | null>(null, Validators.required),
    // Shown, never chosen: a run is judged under its setup's profile (the server refuses another).
    profileId: new FormControl<number | null>({ value: null, disabled: true }),
    acquiredOn: new FormControl(''),
    notes: new FormControl('', Validators.maxLength(4000)),
  });
  protected readonly mapping = new FormGroup<MappingControls>({
    ...(Object.fromEntries(ROUND_FIELDS.map((field) => [field, new FormControl<string | null>(null)])) as Record<RoundField, FormControl<string | null>>),
    outcomes: new FormControl<OutcomeEncoding>('0/1', { nonNullable: true }),
  });

  protected readonly setups = toSignal(loaded(inject(SetupsApi).list()), { initialValue: { status: 'loading' } as Loaded<SetupDto[]> });
  protected readonly profiles = toSignal(loaded(inject(ProfilesApi).list()), { initialValue: { status: 'loading' } as Loaded<ProfileDto[]> });
  protected readonly setupList = computed(() => {
    const setups = this.setups();
    return setups.status === 'ready' ? setups.value : [];
  });
  protected readonly profileList = computed(() => {
    const profiles = this.profiles();
    return profiles.status === 'ready' ? profiles.value : [];
  });

  private readonly profileId = toSignal(this.form.controls.profileId.valueChanges.pipe(startWith(null)));
  /** Whether the chosen profile takes its test rounds from the log's own `test` column. */
  protected readonly needsTestColumn = computed(() => {
    const profile = this.profileList().find((candidate) => candidate.id === this.profileId());
    const latest = profile?.versions.find((version) => version.id === profile.latestVersionId);
    return (latest?.parameters['testSelection'] as { mode?: string } | undefined)?.mode === 'from-log';
  });

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
  protected readonly preview = computed(() => {
    const sample = this.sample();
    return sample === null ? null : previewLog(sample, this.columnMapping(), this.needsTestColumn());
  });
  protected readonly badRows = computed(() => {
    const preview = this.preview();
    return preview?.ok ? preview.rows.filter((row) => row.round === null).length : 0;
  });

  protected readonly phase = signal<UploadPhase>('choosing');
  protected readonly uploaded = signal(0);
  protected readonly run = signal<RunDto | null>(null);
  protected readonly failure = signal('');
  protected readonly uploadPercent = computed(() => Math.round(this.uploaded() * 100));
  protected readonly count = formatCount;

  constructor() {
    // A setup brings its profile, which judges the run.
    this.form.controls.setupId.valueChanges.pipe(takeUntilDestroyed()).subscribe((setupId) => {
      const setup = this.setupList().find((candidate) => candidate.id === setupId);
      if (setup) this.form.controls.profileId.setValue(setup.defaultProfileId);
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

  /** Reads the start of the file and fills the mapping in from its header. */
  async chooseLog(file: File): Promise<void> {
    this.file.set(file);
    this.sample.set(null);
    this.sampleFailure.set('');
    try {
      const sample = await readLogSample(file);
      const guessed = guessMapping(sample);
      this.mapping.setValue({
        ...(Object.fromEntries(ROUND_FIELDS.map((field) => [field, guessed.columns[field] ?? null])) as Record<RoundField, string | null>),
        outcomes: guessed.outcomes,
      });
      this.sample.set(sample);
    } catch {
      this.sampleFailure.set('The file could not be read: it may be damaged gzip. Choose another file.');
    }
  }

  protected upload(): void {
    const file = this.file();
    // A second click before the page shows the upload must not send the log again.
    if (this.phase() !== 'choosing') return;
    const { setupId, acquiredOn, notes } = this.form.getRawValue();
    if (this.form.invalid || file === null || setupId === null || !this.preview()?.ok) {
      this.form.markAllAsTouched();
      return;
    }
    this.phase.set('uploading');
    this.uploaded.set(0);
    this.failure.set('');
    this.runsApi
      .upload({ log: file, setupId, mapping: this.columnMapping(), acquiredOn, notes, idempotencyKey: crypto.randomUUID() })
      .pipe(
        tap((event) => {
          if (event.type === HttpEventType.UploadProgress) this.uploaded.set(event.total ? event.loaded / event.total : 0);
        }),
        filter((event) => event.type === HttpEventType.Response),
        switchMap((event) => {
          this.uploaded.set(1);
          this.phase.set('analysing');
          return this.runsApi.watch(event.body!.id);
        }),
        catchError((error: unknown) => {
          this.failure.set(apiErrorMessage(error));
          this.phase.set('choosing');
          return of(null);
        }),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe((run) => {
        if (run === null) return;
        this.run.set(run);
        if (FINISHED_STATES.includes(run.state)) this.phase.set('finished');
      });
  }

  protected startAgain(): void {
    this.phase.set('choosing');
    this.run.set(null);
    this.file.set(null);
    this.sample.set(null);
    this.form.controls.notes.reset('');
    this.form.controls.acquiredOn.reset('');
  }
}
