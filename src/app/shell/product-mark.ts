import { ChangeDetectionStrategy, Component } from '@angular/core';

/**
 * Bellkeep's mark and wordmark: the two stations as filled circles, joined by one arc (the
 * link between them). Sized by the host's font size.
 */
@Component({
  selector: 'bk-product-mark',
  template: `
    <svg class="bk-product-mark-symbol" viewBox="0 0 40 24" aria-hidden="true" focusable="false">
      <path d="M6 17 A 16 16 0 0 1 34 17" fill="none" stroke="currentColor" stroke-width="2.25" stroke-linecap="round" />
      <circle cx="6" cy="17" r="4.5" fill="currentColor" />
      <circle cx="34" cy="17" r="4.5" fill="currentColor" />
    </svg>
    <span class="bk-product-mark-word">Bellkeep</span>
  `,
  styles: `
    :host {
      display: inline-flex;
      align-items: center;
      gap: 0.4em;
      color: var(--mat-sys-primary);
      font-family: var(--mat-sys-title-large-font);
      font-weight: 500;
      letter-spacing: 0.01em;
    }

    .bk-product-mark-symbol {
      height: 1.1em;
      width: auto;
    }

    .bk-product-mark-word {
      color: var(--mat-sys-on-surface);
    }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ProductMark {}
