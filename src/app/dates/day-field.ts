import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { type FormControl, ReactiveFormsModule } from '@angular/forms';
import { MAT_DATE_LOCALE } from '@angular/material/core';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

import { provideLocalDates, shortDateExample, type PickedDay } from './local-dates';

/**
 * One day, typed in the browser's own date order (named by the hint's example) or picked from a
 * calendar: the night of a booking, the acquisition date of an upload.
 */
@Component({
  selector: 'bk-day-field',
  imports: [MatDatepickerModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  providers: [provideLocalDates()],
  template: `
    <!-- The hint with its example takes two lines in a narrow field: the field grows rather than the hint running over the next one. -->
    <mat-form-field appearance="outline" subscriptSizing="dynamic">
      <mat-label>{{ label() }}</mat-label>
      <input matInput [matDatepicker]="picker" [formControl]="control()" [max]="max()" [attr.data-testid]="testId()" autocomplete="off" />
      <mat-datepicker-toggle matIconSuffix [for]="picker" />
      <mat-datepicker #picker />
      <mat-hint>{{ hint() }} E.g. {{ example }}.</mat-hint>
      <mat-error>{{ error() }}</mat-error>
    </mat-form-field>
  `,
  styles: ':host { display: contents; }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DayField {
  readonly label = input.required<string>();
  readonly control = input.required<FormControl<PickedDay>>();
  /** What the day is, in a sentence; the example of the browser's date order follows it. */
  readonly hint = input('');
  /** What to say when a required day is left empty. */
  readonly required = input('Give the date.');
  readonly testId = input<string | null>(null);
  /** The latest day it may be, and what to say of a later one; none: any day. */
  readonly max = input<PickedDay>(null);
  readonly tooLate = input('The day is too late.');

  protected readonly example = shortDateExample(inject<string>(MAT_DATE_LOCALE));

  /** The error under the field: a date that cannot be read, one after `max`, or none given. */
  protected error(): string {
    const control = this.control();
    if (control.hasError('matDatepickerParse')) return `Write the date as ${this.example}.`;
    if (control.hasError('matDatepickerMax')) return this.tooLate();
    return this.required();
  }
}
