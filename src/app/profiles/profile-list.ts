import { DatePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, signal } from '@angular/core';
import { toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSnackBar } from '@angular/material/snack-bar';
import { filter, switchMap } from 'rxjs';

import type { ProfileDto, ProfileVersionDto } from '@shared/api';
import type { AnalysisProfile } from '@shared/analysis';
import { loaded } from '../api/loaded';
import { Session } from '../auth/session';
import { ProfileDialog, type ProfileDialogData } from './profile-dialog';
import { describeProfile } from './profile-fields';
import { ProfilesApi } from './profiles-api';

/** The acceptance profiles with their versions; each version readable as it was; admins add versions. */
@Component({
  selector: 'bk-profile-list',
  imports: [DatePipe, MatButtonModule, MatIconModule, MatProgressBarModule],
  templateUrl: './profile-list.html',
  styleUrl: './profile-list.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProfileList {
  private readonly profilesApi = inject(ProfilesApi);
  private readonly dialog = inject(MatDialog);
  private readonly snackBar = inject(MatSnackBar);
  private readonly reload = signal(0);

  protected readonly isAdmin = inject(Session).hasAnyRole(['admin']);
  protected readonly profiles = toSignal(toObservable(this.reload).pipe(switchMap(() => loaded(this.profilesApi.list()))), {
    initialValue: { status: 'loading' },
  });
  protected readonly list = computed(() => {
    const profiles = this.profiles();
    return profiles.status === 'ready' ? profiles.value : [];
  });
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

  protected retry(): void {
    this.reload.update((attempt) => attempt + 1);
  }

  protected openEditor(profile: ProfileDto | null): void {
    this.dialog
      .open<ProfileDialog, ProfileDialogData, ProfileDto>(ProfileDialog, { data: { profile }, width: '760px', maxWidth: '96vw', autoFocus: 'first-tabbable' })
      .afterClosed()
      .pipe(filter((saved) => saved !== undefined))
      .subscribe((saved) => {
        this.picked.update((picked) => ({ ...picked, [saved.id]: saved.latestVersionId }));
        this.retry();
        this.snackBar.open(`${saved.name} version ${saved.versions[0]?.version} saved.`, undefined, { duration: 4000 });
      });
  }
}
