import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { MatTabsModule } from '@angular/material/tabs';
import { ActivatedRoute, Router } from '@angular/router';

import { FinishedRuns } from './finished-runs';
import { SigningKeys } from './signing-keys';
import { SystemTrail } from './system-trail';

/** The tabs as the address names them, in their order. */
const TABS = ['runs', 'trail', 'keys'] as const;

/** The auditor's screen: finished runs to re-open, the system-wide trail, and the keys results are signed with. */
@Component({
  selector: 'bk-audit-page',
  imports: [FinishedRuns, MatTabsModule, SigningKeys, SystemTrail],
  template: `
    <header class="bk-page-header">
      <div>
        <h1>Audit</h1>
        <p>Re-open any finished run, read everything the system recorded, and take the keys that prove a result is the one Bellkeep stored.</p>
      </div>
    </header>
    <!-- Each tab loads only when opened: the trail and the keys are not asked for until wanted. -->
    <mat-tab-group mat-stretch-tabs="false" animationDuration="0ms" [selectedIndex]="shownTab" (selectedIndexChange)="showTab($event)">
      <mat-tab label="Finished runs">
        <ng-template matTabContent><bk-finished-runs /></ng-template>
      </mat-tab>
      <mat-tab label="System trail">
        <ng-template matTabContent><bk-system-trail /></ng-template>
      </mat-tab>
      <mat-tab label="Report-signing keys">
        <ng-template matTabContent><bk-signing-keys /></ng-template>
      </mat-tab>
    </mat-tab-group>
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AuditPage {
  private readonly router = inject(Router);

  /** The tab named by the address (`?tab=trail`), the first one otherwise. */
  protected readonly shownTab = Math.max(0, TABS.indexOf(inject(ActivatedRoute).snapshot.queryParamMap.get('tab') as (typeof TABS)[number]));

  /** Names the tab in the address; the other tab's filters go, the new tab writes its own. */
  protected showTab(index: number): void {
    void this.router.navigate([], { queryParams: { tab: index === 0 ? null : TABS[index] }, replaceUrl: true });
  }
}
