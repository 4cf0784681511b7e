import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { Band } from './result-document';

/** The 5–95 % band of a difference drawn against zero: a bar, its median, and the zero line. */
@Component({
  selector: 'sw-difference-band',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <svg viewBox="0 0 200 22" width="200" height="22" aria-hidden="true">
      <line x1="0" y1="11" x2="200" y2="11" class="axis" />
      <line x1="100" y1="0" x2="100" y2="22" class="zero" />
      <rect [attr.x]="left()" y="5" [attr.width]="width()" height="12" rx="2" [class.robust]="robust()" />
      <line [attr.x1]="mid()" [attr.x2]="mid()" y1="2" y2="20" class="median" />
    </svg>
  `,
  styles: `
    svg { vertical-align: middle; }
    .axis { stroke: var(--mat-sys-outline-variant); stroke-width: 1; }
    .zero { stroke: var(--mat-sys-on-surface); stroke-width: 1.5; stroke-dasharray: 3 2; }
    rect { fill: var(--mat-sys-outline-variant); }
    rect.robust { fill: var(--mat-sys-primary); }
    .median { stroke: var(--mat-sys-on-surface); stroke-width: 2; }
  `,
})
export class DifferenceBand {
  readonly band = input.required<Band>();
  readonly robust = input(false);

  private readonly scale = computed(() => {
    const b = this.band();
    // zero in the middle, the band's far end at 90 % of the half-width
    const extent = Math.max(Math.abs(b.p5), Math.abs(b.p95), Number.EPSILON) / 0.9;
    return (v: number) => 100 + (v / extent) * 100;
  });
  protected readonly left = computed(() => this.scale()(this.band().p5));
  protected readonly width = computed(() => Math.max(2, this.scale()(this.band().p95) - this.scale()(this.band().p5)));
  protected readonly mid = computed(() => this.scale()(this.band().median));
}
