import { ChangeDetectionStrategy, Component, computed, DestroyRef, effect, inject, signal, untracked } from '@angular/core';
import { takeUntilDestroyed, toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MAT_DIALOG_DATA, MatDialogModule } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { RouterLink } from '@angular/router';
import { DateTime } from 'luxon';
import { filter, map, pairwise, startWith } from 'rxjs';

import type { BookingDto, BookNightRequest, SetupDto } from '@shared/api';
import { formatCount } from '@shared/format/numbers';
import { apiErrorMessage } from '../api/api-error-message';
import { loaded, readyValue } from '../api/loaded';
import { Session } from '../auth/session';
import { CopyButton } from '../clipboard/copy-button';
import { DayField } from '../dates/day-field';
import { isoDay, type PickedDay } from '../dates/local-dates';
import { parseRoundCount, roundCountValidator } from '../planner/round-count';
import { profileVersionOptions } from '../planner/profile-versions';
import { ProfilesApi } from '../profiles/profiles-api';
import { leadsSetup } from '../setups/setup-lead';
import { BookingsApi } from './bookings-api';
import { isoFromLocal, moveToNight, tonightWindow, windowProblem } from './booking-window';
import { ShownDatePipe } from '../dates/shown-dates';

/** What the dialog books: a night of `setup`, with the rounds the planner settled on (if any). */
export interface BookNightData {
  readonly setup: SetupDto;
  readonly plannedRounds: number | null;
}

/**
 * Books a night of a setup before acquisition: night, window, planned rounds and profile (another
 * than the setup's only for its shift leads and admins, with a reason). Once booked, it shows the
 * seed commitment the server published and links to the setup's bookings.
 */
@Component({
  selector: 'bk-book-night-dialog',
  imports: [
    CopyButton,
    DayField,
    MatButtonModule,
    MatDialogModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatSelectModule,
    ReactiveFormsModule,
    RouterLink,
    ShownDatePipe,
  ],
  templateUrl: './book-night-dialog.html',
  styleUrl: './book-night-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class BookNightDialog {
  private readonly bookingsApi = inject(BookingsApi);
  private readonly destroyRef = inject(DestroyRef);
  private readonly session = inject(Session);

  protected readonly data = inject<BookNightData>(MAT_DIALOG_DATA);
  private readonly tonight = tonightWindow(new Date());

  protected readonly form = new FormGroup({
    night: new FormControl<PickedDay>(DateTime.fromISO(this.tonight.night), Validators.required),
    windowStart: new FormControl(this.tonight.windowStart, { nonNullable: true, validators: Validators.required }),
    windowEnd: new FormControl(this.tonight.windowEnd, { nonNullable: true, validators: Validators.required }),
    plannedRounds: new FormControl(this.data.plannedRounds === null ? '' : formatCount(this.data.plannedRounds), {
      nonNullable: true,
      validators: [Validators.required, roundCountValidator],
    }),
    // Null until the profiles are in: then the setup's own version.
    profileVersionId: new FormControl<number | null>({ value: null, disabled: true }),
    profileReason: new FormControl('', { nonNullable: true, validators: Validators.maxLength(2000) }),
  });

  /** Whether the user may book under another profile than the setup's: an admin or one of its shift leads. */
  protected readonly mayChooseProfile = this.session.hasAnyRole(['admin']) || leadsSetup(this.session.user(), this.data.setup);
  private readonly profiles = toSignal(loaded(inject(ProfilesApi).list()), { initialValue: { status: 'loading' } });
  protected readonly versions = computed(() => profileVersionOptions(readyValue(this.profiles()) ?? []));
  /** The version a booking of the setup gets unless another is chosen: its default profile's latest. */
  protected readonly setupVersionId = computed(() => readyValue(this.profiles())?.find((profile) => profile.id === this.data.setup.defaultProfileId)?.latestVersionId ?? null);
  private readonly chosenVersionId = toSignal(this.form.controls.profileVersionId.valueChanges.pipe(startWith(null)));
  /** Whether a profile other than the setup's is chosen: then a reason is asked for. */
  protected readonly otherProfile = computed(() => {
    const chosen = this.chosenVersionId();
    return chosen !== null && chosen !== undefined && this.setupVersionId() !== null && chosen !== this.setupVersionId();
  });
  private readonly typed = toSignal(this.form.valueChanges.pipe(map(() => this.form.getRawValue())), { initialValue: this.form.getRawValue() });
  protected readonly windowProblem = computed(() => windowProblem(this.typed().windowStart, this.typed().windowEnd, new Date()));

  protected readonly saving = signal(false);
  protected readonly failure = signal('');
  /** The booking once made. */
  protected readonly booked = signal<BookingDto | null>(null);

  constructor() {
    const { night, windowStart, windowEnd, profileVersionId, profileReason } = this.form.controls;
    // Another night takes the window along, its times as they are (edited or not). A date being
    // typed reads as empty until it is whole: the window moves from the last whole one.
    night.valueChanges
      .pipe(
        startWith(night.value),
        map(isoDay),
        filter((value) => value !== undefined),
        pairwise(),
        takeUntilDestroyed(),
      )
      .subscribe(([before, chosen]) => {
        if (chosen === before) return;
        const moved = moveToNight({ night: before, windowStart: windowStart.value, windowEnd: windowEnd.value }, chosen);
        windowStart.setValue(moved.windowStart);
        windowEnd.setValue(moved.windowEnd);
      });
    // The setup's version is chosen once the profiles are in; only those who may choose another can change it.
    effect(() => {
      const versionId = this.setupVersionId();
      untracked(() => {
        profileVersionId.setValue(versionId);
        if (versionId !== null && this.mayChooseProfile) profileVersionId.enable();
      });
    });
    profileVersionId.valueChanges.pipe(takeUntilDestroyed()).subscribe(() => {
      profileReason.setValidators(this.otherProfile() ? [Validators.required, Validators.maxLength(2000)] : Validators.maxLength(2000));
      profileReason.updateValueAndValidity();
    });
  }

  protected bookNight(): void {
    if (this.saving()) return;
    const value = this.form.getRawValue();
    const plannedRounds = parseRoundCount(value.plannedRounds);
    if (this.form.invalid || this.windowProblem() !== null || plannedRounds === null) {
      this.form.markAllAsTouched();
      return;
    }
    const request: BookNightRequest = {
      setupId: this.data.setup.id,
      night: isoDay(value.night)!,
      windowStart: isoFromLocal(value.windowStart),
      windowEnd: isoFromLocal(value.windowEnd),
      plannedRounds,
      ...(this.otherProfile() ? { profileVersionId: value.profileVersionId!, profileReason: value.profileReason.trim() } : {}),
    };
    this.saving.set(true);
    this.failure.set('');
    this.bookingsApi
      .book(request)
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (booking) => {
          this.saving.set(false);
          this.booked.set(booking);
        },
        error: (error: unknown) => {
          this.saving.set(false);
          this.failure.set(apiErrorMessage(error));
        },
      });
  }
}
