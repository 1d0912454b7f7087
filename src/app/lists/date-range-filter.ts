import { ChangeDetectionStrategy, Component, inject, input } from '@angular/core';
import { type FormControl, ReactiveFormsModule } from '@angular/forms';
import { MAT_DATE_LOCALE } from '@angular/material/core';
import { MatDatepickerModule } from '@angular/material/datepicker';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';

import { provideLocalDates, shortDateExample, type PickedDay } from '../dates/local-dates';

/**
 * A from–to filter of days in one field, typed in the browser's own date order (named by the
 * hint's example) or picked from a calendar. Both ends are inclusive; either may stay open. A date
 * that cannot be read leaves the form invalid, which holds the list where it was.
 */
@Component({
  selector: 'bk-date-range-filter',
  imports: [MatDatepickerModule, MatFormFieldModule, MatInputModule, ReactiveFormsModule],
  providers: [provideLocalDates()],
  template: `
    <mat-form-field appearance="outline" subscriptSizing="dynamic" class="bk-filter-wide">
      <mat-label>{{ label() }}</mat-label>
      <mat-date-range-input [rangePicker]="picker">
        <input matStartDate [formControl]="from()" placeholder="from" [attr.aria-label]="label() + ' from'" />
        <input matEndDate [formControl]="to()" placeholder="to" [attr.aria-label]="label() + ' to'" />
      </mat-date-range-input>
      <mat-hint>e.g. {{ example }}</mat-hint>
      <mat-datepicker-toggle matIconSuffix [for]="picker" />
      <mat-date-range-picker #picker />
    </mat-form-field>
  `,
  styles: ':host { display: contents; }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class DateRangeFilter {
  /** "Uploaded", "Acquired", "When". */
  readonly label = input.required<string>();
  readonly from = input.required<FormControl<PickedDay>>();
  readonly to = input.required<FormControl<PickedDay>>();

  protected readonly example = shortDateExample(inject<string>(MAT_DATE_LOCALE));
}
