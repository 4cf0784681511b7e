import { ChangeDetectionStrategy, Component, computed, effect, inject, input, untracked } from '@angular/core';
import { Title } from '@angular/platform-browser';
import { BriefActions } from './brief-actions';
import { BriefApi } from './brief-api';
import { BriefChart } from './brief-chart';
import { BriefPreferences } from './brief-preferences';
import { BriefStatus } from './brief-status';
import { BriefDatePipe, BriefNumberPipe, BriefPercentPipe } from './brief-format';
import { BriefStore } from './brief-store';

/** `/brief/options/:id[?run=]`: the brief of an option's run as a document to print, with its PDF to download. */
@Component({
  selector: 'sw-option-brief',
  imports: [BriefActions, BriefChart, BriefDatePipe, BriefNumberPipe, BriefPercentPipe, BriefPreferences, BriefStatus],
  providers: [BriefStore],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './option-brief.html',
  styleUrl: './brief-document.scss',
})
export class OptionBrief {
  /** Route parameter `:id`. */
  readonly id = input.required<string>();
  /** Query parameter `?run=`: the run to brief, else the option's newest finished run. */
  readonly run = input<string>();

  protected readonly store = inject(BriefStore);
  private readonly api = inject(BriefApi);
  private readonly title = inject(Title);
  protected readonly pdfUrl = computed(() => this.api.optionPdfUrl(this.id(), this.run()));

  constructor() {
    effect(() => {
      const id = this.id();
      const run = this.run();
      untracked(() => this.store.loadOption(id, run));
    });
    effect(() => {
      const name = this.store.option()?.option.name;
      if (name) this.title.setTitle(`Brief: ${name} — Seinework`);
    });
  }
}
