import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { type FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';

/** One choice of a filter menu. */
export interface FilterChoice<T> {
  value: T;
  label: string;
}

/** A filter field that picks one of a few values, or none ("Any setup"), bound to a form control. */
@Component({
  selector: 'bk-choice-filter',
  imports: [MatFormFieldModule, MatSelectModule, ReactiveFormsModule],
  template: `
    <mat-form-field appearance="outline" subscriptSizing="dynamic">
      <mat-label>{{ label() }}</mat-label>
      <mat-select [formControl]="control()">
        <mat-option [value]="null">{{ any() }}</mat-option>
        @for (choice of choices(); track choice.value) {
          <mat-option [value]="choice.value">{{ choice.label }}</mat-option>
        }
      </mat-select>
    </mat-form-field>
  `,
  styles: ':host { display: contents; }',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChoiceFilter<T> {
  readonly label = input.required<string>();
  /** The words of choosing none: "Any setup". */
  readonly any = input.required<string>();
  readonly control = input.required<FormControl<T | null>>();
  readonly choices = input.required<readonly FilterChoice<T>[]>();
}
