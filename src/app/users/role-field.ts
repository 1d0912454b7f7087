import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { FormControl, ReactiveFormsModule } from '@angular/forms';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';

import { ROLE_LABELS, ROLES, type Role } from '@shared/api';

/** A choice of one or more roles, bound to a form control that requires at least one. */
@Component({
  selector: 'bk-role-field',
  imports: [MatFormFieldModule, MatSelectModule, ReactiveFormsModule],
  template: `
    <mat-form-field appearance="outline">
      <mat-label>Roles</mat-label>
      <mat-select [formControl]="control()" multiple data-testid="role-field">
        @for (role of roles; track role) {
          <mat-option [value]="role">{{ labels[role] }}</mat-option>
        }
      </mat-select>
      <!-- The control's only validator is "required", so this is the only error it can have. -->
      <mat-error>Choose at least one role.</mat-error>
    </mat-form-field>
  `,
  styles: `
    :host,
    mat-form-field {
      display: block;
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class RoleField {
  /** The control holding the chosen roles. */
  readonly control = input.required<FormControl<Role[]>>();

  protected readonly roles = ROLES;
  protected readonly labels = ROLE_LABELS;
}
