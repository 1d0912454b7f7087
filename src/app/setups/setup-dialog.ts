import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { FormControl, FormGroup, ReactiveFormsModule, Validators, type AbstractControl, type ValidationErrors } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import { catchError, map, of } from 'rxjs';

import type { SaveSetupRequest, SetupDto } from '@shared/api';
import { apiErrorMessage } from '../api/api-error-message';
import { ProfilesApi } from '../profiles/profiles-api';
import { UsersApi } from '../users/users-api';
import { SetupsApi } from './setups-api';

/** What the dialog edits: `setup`, or a new setup when null. */
export interface SetupDialogData {
  setup: SetupDto | null;
}

const EMAIL = /^[^\s@]+@[^\s@]+\.[^\s@]+$/;

/** The extra recipients as typed: addresses separated by commas, spaces or new lines. */
export function recipientList(text: string): string[] {
  return text.split(/[\s,;]+/).filter((address) => address !== '');
}

/** Every extra recipient must look like an e-mail address. */
function recipientsValidator(control: AbstractControl<string>): ValidationErrors | null {
  const wrong = recipientList(control.value).find((address) => !EMAIL.test(address));
  return wrong === undefined ? null : { recipients: `“${wrong}” is not an e-mail address.` };
}

/** A clock offset and its uncertainty come together or not at all. */
function clockPairValidator(form: AbstractControl<{ clockOffsetNs: number | null; clockUncertaintyNs: number | null }>): ValidationErrors | null {
  const { clockOffsetNs, clockUncertaintyNs } = form.value;
  return ((clockOffsetNs ?? null) === null) === ((clockUncertaintyNs ?? null) === null) ? null : { clockPair: true };
}

/** The admin's form for a setup: names, stations (with their distance and clocks), default profile, shift leads and extra recipients. */
@Component({
  selector: 'bk-setup-dialog',
  imports: [MatButtonModule, MatCheckboxModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './setup-dialog.html',
  styles: `
    .bk-setup-form {
      display: grid;
      grid-template-columns: repeat(auto-fill, minmax(240px, 1fr));
      gap: 12px 16px;
      /* A field without a hint keeps its own height beside one with a hint, not the row's. */
      align-items: start;
      padding-top: 8px;
    }
    .bk-wide {
      grid-column: 1 / -1;
    }
    .bk-setup-failure {
      color: var(--bk-abort);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SetupDialog {
  private readonly setupsApi = inject(SetupsApi);
  private readonly dialogRef = inject<MatDialogRef<SetupDialog, SetupDto>>(MatDialogRef);

  protected readonly setup = inject<SetupDialogData>(MAT_DIALOG_DATA).setup;
  protected readonly profiles = toSignal(
    inject(ProfilesApi)
      .list()
      .pipe(catchError(() => of([]))),
    { initialValue: [] },
  );
  protected readonly shiftLeads = toSignal(
    inject(UsersApi)
      .list()
      .pipe(
        map((users) => users.filter((user) => user.active && user.roles.includes('shift-lead'))),
        catchError(() => of([])),
      ),
    { initialValue: [] },
  );

  protected readonly form = new FormGroup(
    {
      name: new FormControl(this.setup?.name ?? '', { nonNullable: true, validators: [Validators.required, Validators.maxLength(120)] }),
      description: new FormControl(this.setup?.description ?? '', { nonNullable: true, validators: [Validators.maxLength(2000)] }),
      stationALabel: new FormControl(this.setup?.stationALabel ?? '', { nonNullable: true, validators: [Validators.required, Validators.maxLength(80)] }),
      stationBLabel: new FormControl(this.setup?.stationBLabel ?? '', { nonNullable: true, validators: [Validators.required, Validators.maxLength(80)] }),
      defaultProfileId: new FormControl<number | null>(this.setup?.defaultProfileId ?? null, Validators.required),
      shiftLeadIds: new FormControl<number[]>(this.setup?.shiftLeads.map((lead) => lead.id) ?? [], { nonNullable: true }),
      extraRecipients: new FormControl(this.setup?.extraRecipients.join(', ') ?? '', { nonNullable: true, validators: [recipientsValidator] }),
      fourEyes: new FormControl(this.setup?.fourEyes ?? true, { nonNullable: true }),
      stationDistanceM: new FormControl<number | null>(this.setup?.stationDistanceM ?? null, [Validators.min(Number.MIN_VALUE), Validators.max(1e9)]),
      clockOffsetNs: new FormControl<number | null>(this.setup?.clockOffsetNs ?? null, [Validators.min(-1e12), Validators.max(1e12)]),
      clockUncertaintyNs: new FormControl<number | null>(this.setup?.clockUncertaintyNs ?? null, [Validators.min(0), Validators.max(1e12)]),
    },
    { validators: clockPairValidator },
  );
  protected readonly saving = signal(false);
  protected readonly failure = signal('');

  protected save(): void {
    if (this.form.invalid) {
      this.form.markAllAsTouched();
      return;
    }
    const value = this.form.getRawValue();
    const request: SaveSetupRequest = {
      name: value.name.trim(),
      description: value.description.trim(),
      stationALabel: value.stationALabel.trim(),
      stationBLabel: value.stationBLabel.trim(),
      defaultProfileId: value.defaultProfileId!,
      shiftLeadIds: value.shiftLeadIds,
      extraRecipients: recipientList(value.extraRecipients),
      fourEyes: value.fourEyes,
      stationDistanceM: value.stationDistanceM,
      clockOffsetNs: value.clockOffsetNs,
      clockUncertaintyNs: value.clockUncertaintyNs,
    };
    this.saving.set(true);
    this.failure.set('');
    (this.setup === null ? this.setupsApi.create(request) : this.setupsApi.update(this.setup.id, request)).subscribe({
      next: (saved) => this.dialogRef.close(saved),
      error: (error: unknown) => {
        this.saving.set(false);
        this.failure.set(apiErrorMessage(error));
      },
    });
  }
}
