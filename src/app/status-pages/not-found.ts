import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { ActivatedRoute, RouterLink } from '@angular/router';

/** Shown for an address that matches no page. */
@Component({
  selector: 'bk-not-found',
  imports: [MatButtonModule, MatIconModule, RouterLink],
  templateUrl: './not-found.html',
  styleUrl: './status-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NotFound {
  /** The address that was asked for, as the catch-all route took it. */
  protected readonly address =
    '/' +
    inject(ActivatedRoute)
      .snapshot.url.map((segment) => segment.path)
      .join('/');
}
