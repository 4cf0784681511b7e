import { ChangeDetectionStrategy, Component, OnInit, computed, inject } from '@angular/core';
import { DecimalPipe, PercentPipe } from '@angular/common';
import { MatCardModule } from '@angular/material/card';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import { FitnessCurve } from '../shared/fitness-curve';
import { BaselineStore } from './baseline-store';

/** First screen: the demo baseline's headline indicators and the trophic position of each compartment. */
@Component({
  selector: 'sw-baseline-overview',
  imports: [MatCardModule, MatProgressBarModule, MatTableModule, DecimalPipe, PercentPipe, FitnessCurve],
  providers: [BaselineStore],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './baseline-overview.html',
  styleUrl: './baseline-overview.scss',
})
export class BaselineOverview implements OnInit {
  protected readonly store = inject(BaselineStore);
  protected readonly columns = ['name', 'kind', 'trophicLevel', 'cycled'];

  protected readonly fitnessSide = computed(() => {
    const side = this.store.baseline()?.analysis.fitness.side;
    if (side === 'constraint') return 'more constraint than flexibility';
    if (side === 'flexibility') return 'more flexibility than constraint';
    return side === 'peak' ? 'at the peak' : '';
  });

  ngOnInit(): void {
    this.store.loadDemo();
  }
}
