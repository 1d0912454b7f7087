import { HttpErrorResponse } from '@angular/common/http';
import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatCheckboxModule } from '@angular/material/checkbox';
import { MAT_DIALOG_DATA, MatDialogModule, MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';

import type { ProfileDto } from '@shared/api';
import { type AnalysisProfile, parseProfile } from '@shared/analysis';
import { apiErrorMessage } from '../api/api-error-message';
import { FIELD_MEANINGS, NUMBER_FIELDS, SPACE_LIKE_SEPARATION_WORDS } from '@shared/format/profile-field-labels';
import { CHECK_FAMILY_OPTIONS } from './check-family-options';
import { GENERAL_FIELDS } from './general-attack-form';
import { profileForm, profileParameters } from './profile-form';
import { ProfilesApi } from './profiles-api';

/** What the dialog edits: a new version of `profile`, or a new profile when there is none. */
export interface ProfileDialogData {
  profile: ProfileDto | null;
}

/** The defaults of every field: the engine's profile of `{}`. */
function defaultProfile(): AnalysisProfile {
  const parsed = parseProfile({});
  if (!parsed.ok) throw new Error(parsed.message);
  return parsed.profile;
}

/** The admin's form for a new profile or a new version of one; every field explained and validated. */
@Component({
  selector: 'bk-profile-dialog',
  imports: [MatButtonModule, MatCheckboxModule, MatDialogModule, MatFormFieldModule, MatInputModule, MatSelectModule, ReactiveFormsModule],
  templateUrl: './profile-dialog.html',
  styleUrl: './profile-dialog.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProfileDialog {
  private readonly profilesApi = inject(ProfilesApi);
  private readonly dialogRef = inject<MatDialogRef<ProfileDialog, ProfileDto>>(MatDialogRef);

  protected readonly profile = inject<ProfileDialogData>(MAT_DIALOG_DATA).profile;
  protected readonly meanings = FIELD_MEANINGS;
  protected readonly textFields = [...GENERAL_FIELDS, ...NUMBER_FIELDS];
  protected readonly checkFamilies = CHECK_FAMILY_OPTIONS;
  protected readonly spaceLikeWords = SPACE_LIKE_SEPARATION_WORDS;
  protected readonly form = profileForm((this.profile?.versions[0]?.parameters as AnalysisProfile | undefined) ?? defaultProfile());
  protected readonly name = new FormControl('', { nonNullable: true, validators: [Validators.required, Validators.maxLength(120)] });
  protected readonly description = new FormControl('', { nonNullable: true, validators: [Validators.maxLength(2000)] });
  protected readonly saving = signal(false);
  protected readonly failure = signal('');

  protected save(): void {
    const naming = this.profile === null ? [this.name, this.description] : [];
    if (this.form.invalid || naming.some((control) => control.invalid)) {
      this.form.markAllAsTouched();
      naming.forEach((control) => control.markAsTouched());
      return;
    }
    const parameters = profileParameters(this.form);
    const parsed = parseProfile(parameters);
    if (!parsed.ok) {
      this.failure.set(parsed.message);
      return;
    }
    const note = this.form.controls.note.value.trim() || undefined;
    const request =
      this.profile === null
        ? this.profilesApi.create({ name: this.name.value.trim(), description: this.description.value.trim() || undefined, parameters, note })
        : this.profilesApi.addVersion(this.profile.id, { parameters, note });
    this.saving.set(true);
    this.failure.set('');
    request.subscribe({
      next: (saved) => this.dialogRef.close(saved),
      error: (error: unknown) => {
        this.saving.set(false);
        const field = error instanceof HttpErrorResponse ? (error.error as { error?: { field?: string } } | null)?.error?.field : undefined;
        this.failure.set(field ? `${apiErrorMessage(error)} (field ${field})` : apiErrorMessage(error));
      },
    });
  }
}
