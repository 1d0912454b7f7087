import { ChangeDetectionStrategy, Component, computed, input, linkedSignal } from '@angular/core';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatSelectModule } from '@angular/material/select';

import type { AnalysisProfile } from '@shared/analysis';
import type { ProfileDto, ProfileVersionDto } from '@shared/api';
import { profileDifferences } from './profile-differences';

/**
 * What changed between the version shown and another version of the same profile (the one before it
 * unless another is picked), field by field, older version first.
 */
@Component({
  selector: 'bk-profile-comparison',
  imports: [MatFormFieldModule, MatSelectModule],
  template: `
    @if (others().length > 0) {
      <section class="bk-comparison" [attr.aria-label]="'Version ' + shown().version + ' compared with another version'" data-testid="profile-comparison">
        <mat-form-field appearance="outline" subscriptSizing="dynamic" class="bk-comparison-pick">
          <mat-label>Compare v{{ shown().version }} with</mat-label>
          <mat-select [value]="otherId()" (valueChange)="otherId.set($event)" data-testid="compare-with">
            @for (version of others(); track version.id) {
              <mat-option [value]="version.id">v{{ version.version }}{{ version.note ? ' · ' + version.note : '' }}</mat-option>
            }
          </mat-select>
        </mat-form-field>
        @if (comparison(); as comparison) {
          @if (comparison.differences.length === 0) {
            <p class="bk-muted">v{{ comparison.older.version }} and v{{ comparison.newer.version }} hold the same rules.</p>
          } @else {
            <table class="bk-figure-table bk-comparison-table">
              <caption class="bk-visually-hidden">
                Fields that differ between version {{ comparison.older.version }} and version {{ comparison.newer.version }}
              </caption>
              <thead>
                <tr>
                  <th scope="col">Field</th>
                  <th scope="col">v{{ comparison.older.version }}</th>
                  <th scope="col">v{{ comparison.newer.version }}</th>
                </tr>
              </thead>
              <tbody>
                @for (difference of comparison.differences; track difference.label) {
                  <tr>
                    <th scope="row">{{ difference.label }}</th>
                    <td>{{ difference.from }}</td>
                    <td>{{ difference.to }}</td>
                  </tr>
                }
              </tbody>
            </table>
          }
        }
      </section>
    }
  `,
  styles: `
    .bk-comparison {
      margin-top: 16px;
    }
    .bk-comparison-pick {
      min-width: 16em;
      margin-bottom: 8px;
    }
    .bk-comparison-table {
      width: 100%;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProfileComparison {
  readonly profile = input.required<ProfileDto>();
  /** The version on screen. */
  readonly shown = input.required<ProfileVersionDto>();

  /** The profile's other versions, newest first. */
  protected readonly others = computed(() => this.profile().versions.filter((version) => version.id !== this.shown().id));
  /** The version compared with: the one before the shown one (or the one after, for v1) until another is picked. */
  protected readonly otherId = linkedSignal(() => {
    const before = this.others().find((version) => version.version < this.shown().version);
    return (before ?? this.others().at(-1))?.id ?? null;
  });
  protected readonly comparison = computed(() => {
    const other = this.others().find((version) => version.id === this.otherId());
    if (other === undefined) return null;
    const [older, newer] = other.version < this.shown().version ? [other, this.shown()] : [this.shown(), other];
    return { older, newer, differences: profileDifferences(older.parameters as AnalysisProfile, newer.parameters as AnalysisProfile) };
  });
}
