import { ChangeDetectionStrategy, Component, inject, signal } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatSnackBar } from '@angular/material/snack-bar';
import { filter } from 'rxjs';

import type { ProfileDto, ProfileVersionDto } from '@shared/api';
import type { AnalysisProfile } from '@shared/analysis';
import { Session } from '../auth/session';
import { ListFrame } from '../lists/list-frame';
import { searchedList, WordSearch } from '../lists/word-search';
import { ProfileComparison } from './profile-comparison';
import { ProfileDialog, type ProfileDialogData } from './profile-dialog';
import { describeProfile } from '@shared/format/profile-field-labels';
import { ProfilesApi } from './profiles-api';
import { ShownDatePipe } from '../dates/shown-dates';

/** The acceptance profiles with their versions; each version readable as it was; admins add versions. */
@Component({
  selector: 'bk-profile-list',
  imports: [ShownDatePipe, ListFrame, MatButtonModule, MatIconModule, ProfileComparison, WordSearch],
  templateUrl: './profile-list.html',
  styleUrl: './profile-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProfileList {
  private readonly profilesApi = inject(ProfilesApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);

  protected readonly isAdmin = inject(Session).hasAnyRole(['admin']);
  /** The profiles, found by their name, description or a version's note. */
  protected readonly list = searchedList(
    () => this.profilesApi.list(),
    (profile) => [profile.name, profile.description, ...profile.versions.map((version) => version.note)],
  );
  /** The version shown in full, per profile id (the latest unless another was picked). */
  private readonly picked = signal<Record<number, number>>({});

  protected shownVersion(profile: ProfileDto): ProfileVersionDto | undefined {
    const id = this.picked()[profile.id] ?? profile.latestVersionId;
    return profile.versions.find((version) => version.id === id);
  }

  protected showVersion(profile: ProfileDto, version: ProfileVersionDto): void {
    this.picked.update((picked) => ({ ...picked, [profile.id]: version.id }));
  }

  protected describe(version: ProfileVersionDto): ReturnType<typeof describeProfile> {
    return describeProfile(version.parameters as AnalysisProfile);
  }

  protected openEditor(profile: ProfileDto | null): void {
    this.dialog
      .open<ProfileDialog, ProfileDialogData, ProfileDto>(ProfileDialog, { data: { profile }, width: '760px', maxWidth: '96vw', autoFocus: 'first-tabbable' })
      .afterClosed()
      .pipe(filter((saved) => saved !== undefined))
      .subscribe((saved) => {
        this.picked.update((picked) => ({ ...picked, [saved.id]: saved.latestVersionId }));
        this.list.retry();
        this.snackBar.open(`${saved.name} version ${saved.versions[0]?.version} saved.`, undefined, { duration: 4000 });
      });
  }
}
