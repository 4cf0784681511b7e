import { ChangeDetectionStrategy, Component, computed, effect, inject, input, untracked } from '@angular/core';
import { Title } from '@angular/platform-browser';
import { RouterLink } from '@angular/router';
import { BriefActions } from './brief-actions';
import { BriefApi } from './brief-api';
import { BriefChart } from './brief-chart';
import { BriefPreferences } from './brief-preferences';
import { BriefStatus } from './brief-status';
import { BriefDatePipe, BriefNumberPipe } from './brief-format';
import { BriefStore } from './brief-store';

/** `/brief/compare?runs=ID,ID`: the brief of a comparison of 2–6 runs as a document to print, with its PDF. */
@Component({
  selector: 'sw-comparison-brief',
  imports: [RouterLink, BriefActions, BriefChart, BriefDatePipe, BriefNumberPipe, BriefPreferences, BriefStatus],
  providers: [BriefStore],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './comparison-brief.html',
  styleUrl: './brief-document.scss',
})
export class ComparisonBrief {
  /** Query parameter `?runs=`: the compared runs, separated by commas. */
  readonly runs = input<string>('');

  protected readonly store = inject(BriefStore);
  private readonly api = inject(BriefApi);
  private readonly title = inject(Title);
  protected readonly runIds = computed(() =>
    this.runs()
      .split(',')
      .map((id) => id.trim())
      .filter((id) => id.length > 0),
  );
  /** A comparison is of 2 to 6 runs: with fewer or more the page says so and asks the server nothing. */
  protected readonly listable = computed(() => this.runIds().length >= 2 && this.runIds().length <= 6);
  protected readonly pdfUrl = computed(() => this.api.comparisonPdfUrl(this.runIds()));
  protected readonly letters = 'ABCDEF';

  constructor() {
    effect(() => {
      const ids = this.runIds();
      if (this.listable()) untracked(() => this.store.loadComparison(ids));
    });
    effect(() => {
      const brief = this.store.comparison();
      if (brief) this.title.setTitle(`Brief: comparison of ${brief.options.length} options on ${brief.web.name} — Seinework`);
    });
  }
}
