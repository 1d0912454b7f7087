import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { type FormControl, ReactiveFormsModule, Validators } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

import { MIN_PASSWORD_LENGTH } from '@shared/api';

/** The validators of a new password: required, MIN_PASSWORD_LENGTH to 200 characters. */
export const NEW_PASSWORD_VALIDATORS = [Validators.required, Validators.minLength(MIN_PASSWORD_LENGTH), Validators.maxLength(200)];

/** A new password typed twice, with the length it needs and what is missing; the form compares the two. */
@Component({
  selector: 'bk-new-password-fields',
  imports: [MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  template: `
    <mat-form-field appearance="outline">
      <mat-label>New password</mat-label>
      <input matInput type="password" [formControl]="password()" autocomplete="new-password" />
      <mat-hint>At least {{ minLength }} characters.</mat-hint>
      @if (password().hasError('required')) {
        <mat-error>Enter a new password.</mat-error>
      } @else if (password().hasError('minlength')) {
        <mat-error>Use at least {{ minLength }} characters.</mat-error>
      }
    </mat-form-field>
    <mat-form-field appearance="outline">
      <mat-label>New password again</mat-label>
      <input matInput type="password" [formControl]="repeated()" autocomplete="new-password" />
      @if (repeated().hasError('required')) {
        <mat-error>Enter the new password once more.</mat-error>
      }
    </mat-form-field>
  `,
  styles: ':host { display: contents; }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NewPasswordFields {
  readonly password = input.required<FormControl<string>>();
  readonly repeated = input.required<FormControl<string>>();

  protected readonly minLength = MIN_PASSWORD_LENGTH;
}
