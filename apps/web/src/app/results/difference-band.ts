import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { Band } from './result-document';

/** The 5–95 % band of a difference drawn against zero: a bar, its median, and the zero line. */
@Component({
  selector: 'sw-difference-band',
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <svg viewBox="0 0 120 16" width="120" height="16" aria-hidden="true">
      <line x1="60" y1="0" x2="60" y2="16" class="zero" />
      <rect [attr.x]="left()" y="4" [attr.width]="width()" height="8" rx="2" [class.robust]="robust()" />
      <line [attr.x1]="mid()" [attr.x2]="mid()" y1="2" y2="14" class="median" />
    </svg>
  `,
  styles: `
    svg { vertical-align: middle; }
    .zero { stroke: var(--mat-sys-outline); stroke-width: 1; stroke-dasharray: 2 2; }
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
    const extent = Math.max(Math.abs(b.p5), Math.abs(b.p95), Number.EPSILON);
    return (v: number) => 60 + (v / extent) * 56;
  });
  protected readonly left = computed(() => this.scale()(this.band().p5));
  protected readonly width = computed(() => Math.max(2, this.scale()(this.band().p95) - this.scale()(this.band().p5)));
  protected readonly mid = computed(() => this.scale()(this.band().median));
}
