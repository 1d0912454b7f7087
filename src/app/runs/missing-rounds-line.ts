import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { MatIconModule } from '@angular/material/icon';

import type { MissingRoundsSummary } from '@shared/analysis';
import { missingRoundsFigures } from './missing-rounds-figures';

/** The rounds a log lacks between its first and last index: a calm line, or a warning past the profile's tolerance. */
@Component({
  selector: 'bk-missing-rounds-line',
  imports: [MatIconModule],
  template: `
    @if (figures(); as figures) {
      <div class="bk-missing" [class.bk-missing-over]="figures.overTolerance" data-testid="missing-rounds">
        <span class="bk-missing-word" [class.bk-tone-warn]="figures.overTolerance">
          <mat-icon aria-hidden="true">{{ figures.icon }}</mat-icon>
          {{ figures.word }}
        </span>
        <span>
          Round indices {{ figures.span }}: <strong>{{ figures.missing }}</strong> of {{ figures.triggers }} triggers missing ({{ figures.share }}),
          {{ figures.tolerated }} tolerated.
          @if (figures.anyMissing) {
            {{ figures.drawnForTesting }} of them drawn for testing, each counted as a lost CHSH game.
          }
        </span>
      </div>
    } @else {
      <span class="bk-muted">Not recorded by the engine that stored this result.</span>
    }
  `,
  styles: `
    :host { display: block; }
    .bk-missing { display: flex; flex-wrap: wrap; align-items: baseline; gap: 4px 10px; }
    .bk-missing-over {
      padding: 8px 10px;
      border: 1px solid var(--bk-threshold);
      border-left-width: 4px;
      border-radius: var(--mat-sys-corner-small);
      background: color-mix(in srgb, var(--bk-threshold) 8%, transparent);
    }
    .bk-missing-word { display: inline-flex; align-items: center; gap: 4px; font-weight: 500; white-space: nowrap; align-self: center; }
    .bk-missing-word:not(.bk-tone-warn) { color: var(--mat-sys-on-surface-variant); }
    .bk-tone-warn { color: var(--bk-threshold); }
    mat-icon { width: 18px; height: 18px; font-size: 18px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class MissingRoundsLine {
  /** The result's missing-rounds summary; null or absent for a result that has none. */
  readonly summary = input.required<MissingRoundsSummary | null | undefined>();

  protected readonly figures = computed(() => missingRoundsFigures(this.summary()));
}
