import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import { DecimalPipe, PercentPipe } from '@angular/common';
import { MatCardModule } from '@angular/material/card';
import type { Analysis } from '@seinework/contracts';

/** The four figures a council member reads first: ascendency, cycling, catch and what the catch costs the web. */
@Component({
  selector: 'sw-headline-indicators',
  imports: [MatCardModule, DecimalPipe, PercentPipe],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section class="headline" aria-label="Headline indicators">
      <mat-card appearance="outlined">
        <mat-card-header><mat-card-title>Relative ascendency</mat-card-title></mat-card-header>
        <mat-card-content>
          <p class="figure">{{ analysis().relativeAscendency | number: '1.3-3' }}</p>
          <p>Fitness {{ analysis().fitness.shareOfPeak | percent: '1.1-1' }} of its peak, {{ fitnessSide() }}.</p>
        </mat-card-content>
      </mat-card>
      <mat-card appearance="outlined">
        <mat-card-header><mat-card-title>Finn cycling index</mat-card-title></mat-card-header>
        <mat-card-content>
          <p class="figure">{{ analysis().finnCyclingIndex | percent: '1.1-1' }}</p>
          <p>of all throughflow is recycled.</p>
        </mat-card-content>
      </mat-card>
      <mat-card appearance="outlined">
        <mat-card-header><mat-card-title>Catch</mat-card-title></mat-card-header>
        <mat-card-content>
          <p class="figure">
            @if (analysis().totalCatchTonnes !== null) {
              {{ analysis().totalCatchTonnes | number: '1.0-0' }} t/y
            } @else {
              {{ analysis().totalCatch | number: '1.2-2' }} <span class="unit">{{ unit() }}</span>
            }
          </p>
          <p>
            @if (analysis().meanTrophicLevelOfCatch !== null) {
              Mean trophic level of the catch {{ analysis().meanTrophicLevelOfCatch | number: '1.2-2' }}.
            } @else {
              No harvest in this web.
            }
          </p>
        </mat-card-content>
      </mat-card>
      <mat-card appearance="outlined">
        <mat-card-header><mat-card-title>Primary production required</mat-card-title></mat-card-header>
        <mat-card-content>
          @if (analysis().primaryProductionRequiredShare !== null) {
            <p class="figure">{{ analysis().primaryProductionRequiredShare | percent: '1.1-1' }}</p>
            <p>of primary production supports the catch.</p>
          } @else {
            <p class="figure">—</p>
            <p>This web has no primary production.</p>
          }
        </mat-card-content>
      </mat-card>
    </section>
  `,
  styles: `
    .headline { display: grid; grid-template-columns: repeat(auto-fit, minmax(220px, 1fr)); gap: 16px; }
    .figure { font: var(--mat-sys-display-small); margin: 8px 0; color: var(--mat-sys-primary); overflow-wrap: anywhere; }
    .unit { font: var(--mat-sys-body-large); }
  `,
})
export class HeadlineIndicators {
  readonly analysis = input.required<Analysis>();
  readonly unit = input.required<string>();

  protected readonly fitnessSide = computed(() => {
    const side = this.analysis().fitness.side;
    if (side === 'constraint') return 'more constraint than flexibility';
    if (side === 'flexibility') return 'more flexibility than constraint';
    return 'at the peak';
  });
}
