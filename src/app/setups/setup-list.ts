import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import { filter } from 'rxjs';

import type { SetupDto } from '@shared/api';
import { Session } from '../auth/session';
import { ListFrame } from '../lists/list-frame';
import { searchedList, WordSearch } from '../lists/word-search';
import { SetupDialog, type SetupDialogData } from './setup-dialog';
import { SetupFacts } from './setup-facts';
import { SetupTrendChart } from './setup-trend-chart';
import { SetupsApi } from './setups-api';

/** The setups, each with its shift leads and the trend of its nightly runs; admins edit them. */
@Component({
  selector: 'bk-setup-list',
  imports: [ListFrame, MatButtonModule, MatIconModule, RouterLink, SetupFacts, SetupTrendChart, WordSearch],
  templateUrl: './setup-list.html',
  styleUrl: './setup-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SetupList {
  private readonly setupsApi = inject(SetupsApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);

  protected readonly isAdmin = inject(Session).hasAnyRole(['admin']);
  /** The lab's setups, found by any of their words: name, description, stations, shift leads, profile. */
  protected readonly list = searchedList(
    () => this.setupsApi.list(),
    (setup) => [setup.name, setup.description, setup.stationALabel, setup.stationBLabel, setup.defaultProfileName, ...setup.shiftLeads.map((lead) => lead.name)],
  );

  protected openEditor(setup: SetupDto | null): void {
    this.dialog
      .open<SetupDialog, SetupDialogData, SetupDto>(SetupDialog, { data: { setup }, width: '680px', maxWidth: '96vw' })
      .afterClosed()
      .pipe(filter((saved) => saved !== undefined))
      .subscribe((saved) => {
        this.list.retry();
        this.snackBar.open(`${saved.name} saved.`, undefined, { duration: 4000 });
      });
  }
}
