import { afterRenderEffect, ChangeDetectionStrategy, Component, computed, type ElementRef, inject, signal, viewChild } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { switchMap } from 'rxjs';

import { failureMessage, loaded, readyValue } from '../api/loaded';
import { LedgerApi } from './ledger-api';
import { lookOfCell, type CellLook } from './ledger-cell';
import { isoNight, nightsBetween, rangeEnding } from './ledger-nights';
import { ShownDatePipe } from '../dates/shown-dates';

/** A setup's row: its name and, for each night shown, the cell's look (null: nothing that night). */
interface LedgerRow {
  setupId: number;
  name: string;
  cells: (CellLook | null)[];
}

/**
 * The ledger of nights: a row per setup, a column per night (three weeks, the latest at the right),
 * each cell the night's verdict by shape and word with its sign-off, booked nights without a log,
 * and how many logs came. A cell opens its run; a booked night without one, its setup.
 */
@Component({
  selector: 'bk-night-ledger',
  imports: [MatButtonModule, MatIconModule, MatProgressBarModule, RouterLink, ShownDatePipe],
  templateUrl: './night-ledger.html',
  styleUrl: './night-ledger.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class NightLedger {
  private readonly ledgerApi = inject(LedgerApi);
  private readonly today = isoNight(Date.now());

  /** Weeks before this one that the last column shows (0: tonight). */
  protected readonly weeksBack = signal(0);
  private readonly range = computed(() => rangeEnding(this.today, this.weeksBack()));
  protected readonly nights = computed(() => nightsBetween(this.range().from, this.range().to));
  protected readonly state = toSignal(toObservable(this.range).pipe(switchMap(({ from, to }) => loaded(this.ledgerApi.ledger(from, to)))), {
    initialValue: { status: 'loading' },
  });
  protected readonly failure = computed(() => failureMessage(this.state()));
  protected readonly rows = computed<LedgerRow[]>(() => {
    const ledger = readyValue(this.state());
    if (ledger === null) return [];
    return ledger.setups.map((setup) => {
      const byNight = new Map(setup.cells.map((cell) => [cell.night, lookOfCell(cell, setup.name)]));
      return { setupId: setup.setupId, name: setup.name, cells: this.nights().map((night) => byNight.get(night) ?? null) };
    });
  });

  private readonly frame = viewChild<ElementRef<HTMLElement>>('frame');

  constructor() {
    // The latest night is at the right: show it, scrolling the older ones out of view on a narrow screen.
    afterRenderEffect(() => {
      const frame = this.frame()?.nativeElement;
      if (frame !== undefined && this.rows().length > 0) frame.scrollLeft = frame.scrollWidth;
    });
  }

  /** "Fri 4": the column head of a night. */
  protected nightHead(night: string): { weekday: string; day: string } {
    const date = new Date(`${night}T12:00:00Z`);
    return { weekday: date.toLocaleDateString(undefined, { weekday: 'short', timeZone: 'UTC' }), day: String(date.getUTCDate()) };
  }

  protected earlier(): void {
    this.weeksBack.update((weeks) => weeks + 1);
  }

  protected later(): void {
    this.weeksBack.update((weeks) => Math.max(0, weeks - 1));
  }
}
