import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { RouterLink } from '@angular/router';

import { isRole, ROLE_LABELS } from '@shared/api';
import { Session } from '../auth/session';
import { NAV_ITEMS } from '../shell/navigation';

/** Shown in place of a page the user's roles do not open; names the roles that would. */
@Component({
  selector: 'bk-forbidden',
  imports: [MatButtonModule, MatIconModule, RouterLink],
  templateUrl: './forbidden.html',
  styleUrl: './status-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Forbidden {
  private readonly session = inject(Session);

  /** The address that was refused, from the `page` query parameter. */
  readonly page = input<string>();

  /** The roles that may open it, comma-separated, from the `roles` query parameter. */
  readonly roles = input<string>();

  protected readonly pageName = computed(() => {
    const page = this.page() ?? '';
    const path = page.split(/[?#]/)[0];
    return NAV_ITEMS.find((item) => item.path === path)?.label ?? (page || 'This page');
  });

  protected readonly allowedRoles = computed(() =>
    (this.roles() ?? '')
      .split(',')
      .filter(isRole)
      .map((role) => ROLE_LABELS[role]),
  );

  protected readonly heldRoles = computed(
    () =>
      this.session
        .roles()
        .map((role) => ROLE_LABELS[role])
        .join(', ') || 'no role',
  );
}
