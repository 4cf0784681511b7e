import { ChangeDetectionStrategy, Component } from '@angular/core';

/**
 * Route data of the pages that show the caution themselves, beside their results: the shell then
 * leaves it out of its footer, so that it is said once, where the numbers are.
 */
export const PAGE_CARRIES_CAUTION = { pageCarriesCaution: true } as const;

/** The caution every result page and brief carries (PRODUCT.md, "Cautions the product shows"). */
@Component({
  selector: 'sw-caution',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <p role="note">
      Results describe the web at steady state and are indicative only. They carry data uncertainty and do not
      replace stock assessments, the advice of the council's scientific body, or the law that governs the fishery.
    </p>
  `,
  styles: `
    p {
      margin: 0;
      padding: 12px 16px;
      border-left: 4px solid var(--mat-sys-tertiary);
      background: var(--mat-sys-surface-container);
      font-size: 0.875rem;
    }
  `,
})
export class Caution {}
