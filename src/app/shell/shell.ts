import { BreakpointObserver } from '@angular/cdk/layout';
import { ChangeDetectionStrategy, Component, computed, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatDividerModule } from '@angular/material/divider';
import { MatIconModule } from '@angular/material/icon';
import { MatListModule } from '@angular/material/list';
import { MatMenuModule } from '@angular/material/menu';
import { MatSnackBar } from '@angular/material/snack-bar';
import { MatSidenavModule } from '@angular/material/sidenav';
import { MatToolbarModule } from '@angular/material/toolbar';
import { Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { filter, map } from 'rxjs';

import { ROLE_LABELS } from '@shared/api';
import { Session } from '../auth/session';
import { PasswordDialog } from '../passwords/password-dialog';
import { EmailAddress } from '../users/email-address';
import { navItemsFor } from './navigation';
import { WorkersAlert } from '../workers/workers-alert';
import { ProductMark } from './product-mark';

/** Below this width the side navigation slides over the page instead of sitting beside it. */
const WIDE_LAYOUT = '(min-width: 1000px)';

/** The frame around every signed-in page: top bar, side navigation and user menu. */
@Component({
  selector: 'bk-shell',
  imports: [
    EmailAddress,
    MatButtonModule,
    MatDividerModule,
    MatIconModule,
    MatListModule,
    MatMenuModule,
    MatSidenavModule,
    MatToolbarModule,
    ProductMark,
    RouterLink,
    RouterLinkActive,
    RouterOutlet,
    WorkersAlert,
  ],
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class Shell {
  private readonly session = inject(Session);
  private readonly router = inject(Router);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);

  protected readonly user = this.session.user;
  protected readonly navItems = computed(() => navItemsFor(this.session.roles()));
  protected readonly roleLabels = computed(() =>
    this.session
      .roles()
      .map((role) => ROLE_LABELS[role])
      .join(', '),
  );

  /** Whether the window is wide enough for the navigation to stay open beside the page. */
  protected readonly wide = toSignal(
    inject(BreakpointObserver)
      .observe(WIDE_LAYOUT)
      .pipe(map((state) => state.matches)),
    { initialValue: true },
  );

  /** Moves the focus past the bar and the navigation to the page itself (the link's target would only scroll). */
  protected skipToMain(event: Event): void {
    event.preventDefault();
    document.getElementById('bk-main')?.focus();
  }

  protected changePassword(): void {
    this.dialog
      .open<PasswordDialog, void, true>(PasswordDialog, { autoFocus: 'first-tabbable' })
      .afterClosed()
      .pipe(filter((changed) => changed === true))
      .subscribe(() => this.snackBar.open('Your password is changed; your other sessions have ended.', undefined, { duration: 5000 }));
  }

  protected signOut(): void {
    this.session.end();
    void this.router.navigateByUrl('/sign-in');
  }
}
