import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSnackBar } from '@angular/material/snack-bar';
import { RouterLink } from '@angular/router';
import { filter, map } from 'rxjs';

import type { SetupDto } from '@shared/api';
import { Session } from '../auth/session';
import { FilterBar } from '../lists/filter-bar';
import { ListFrame } from '../lists/list-frame';
import { pagedList, pageOfWhole, textHolds } from '../lists/paged-list';
import { SetupDialog, type SetupDialogData } from './setup-dialog';
import { SetupFacts } from './setup-facts';
import { SetupTrendChart } from './setup-trend-chart';
import { SetupsApi } from './setups-api';

/** The setups, each with its shift leads and the trend of its nightly runs; admins edit them. */
@Component({
  selector: 'bk-setup-list',
  imports: [FilterBar, ListFrame, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, ReactiveFormsModule, RouterLink, SetupFacts, SetupTrendChart],
  templateUrl: './setup-list.html',
  styleUrl: './setup-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SetupList {
  private readonly setupsApi = inject(SetupsApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);

  protected readonly isAdmin = inject(Session).hasAnyRole(['admin']);
  protected readonly filters = new FormGroup({ search: new FormControl('') });
  /** The lab's setups, found by any of their words: name, description, stations, shift leads, profile. */
  protected readonly list = pagedList({
    filters: this.filters,
    chosen: () => ({ search: this.filters.controls.search.value ?? '' }),
    firstPage: { page: 0, pageSize: 10, search: '' },
    load: (query) =>
      this.setupsApi
        .list()
        .pipe(
          map((setups) =>
            pageOfWhole(setups, query, (setup) =>
              textHolds(
                query.search,
                setup.name,
                setup.description,
                setup.stationALabel,
                setup.stationBLabel,
                setup.defaultProfileName,
                ...setup.shiftLeads.map((lead) => lead.name),
              ),
            ),
          ),
        ),
  });

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
