import { DOCUMENT } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, inject, input } from '@angular/core';

import { CopyButton } from '../clipboard/copy-button';
import { acquisitionRecipe, UPLOAD_TOKEN_PLACEHOLDER } from './acquisition-recipe';

/** The bash recipe the acquisition computer runs to send its night's log, ready to copy. */
@Component({
  selector: 'bk-acquisition-recipe-panel',
  imports: [CopyButton],
  template: `
    <p>
      Sends a log from the acquisition computer with curl, resumably: when the link breaks off, it asks how far the upload got and
      goes on from there. Put an upload token of this setup in place of <code>{{ placeholder }}</code>. The log goes to the booking
      whose window is open or closed less than a day ago; with none, the run is unbooked.
    </p>
    <!-- On a phone the recipe scrolls sideways: it takes the keyboard's focus so the keys can scroll it. -->
    <pre class="bk-recipe" tabindex="0" data-testid="acquisition-recipe">{{ recipe() }}</pre>
    <bk-copy-button [text]="recipe()" what="the acquisition recipe" label="Copy the recipe" />
  `,
  styles: `
    :host {
      display: block;
    }

    p {
      margin: 0 0 8px;
    }

    .bk-recipe {
      margin: 0 0 8px;
      padding: 12px;
      overflow-x: auto;
      border-radius: var(--mat-sys-corner-small);
      background: var(--mat-sys-surface-container);
      font: var(--mat-sys-body-small);
      font-family: 'Roboto Mono', ui-monospace, monospace;
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class AcquisitionRecipePanel {
  private readonly origin = inject(DOCUMENT).location.origin;

  /** The setup the logs go to. */
  readonly setupId = input.required<number>();

  protected readonly placeholder = UPLOAD_TOKEN_PLACEHOLDER;
  protected readonly recipe = computed(() => acquisitionRecipe(this.origin, this.setupId()));
}
