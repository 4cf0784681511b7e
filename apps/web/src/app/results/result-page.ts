import { ChangeDetectionStrategy, Component, afterRenderEffect, computed, effect, inject, input, signal, untracked } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { DatePipe } from '@angular/common';
import { Title } from '@angular/platform-browser';
import { ActivatedRoute, RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { SessionStore } from '../auth/session-store';
import { sharedRunOf } from '../options/shared-run';
import { Caution } from '../shared/caution';
import { CsvButton } from '../shared/csv-button';
import { downloadXlsx } from '../shared/table-export';
import { DependenceSection } from './dependence-section';
import { FleetEffects } from './fleet-effects';
import { FleetTable } from './fleet-table';
import { formatValue } from './format';
import { KeyIndicators } from './key-indicators';
import { LadderChart } from './ladder-chart';
import { PositionsTable } from './positions-table';
import { RecyclingSection } from './recycling-section';
import { ResultComments, markPointedAt } from './result-comments';
import { ResultCommentsStore } from './result-comments-store';
import { ResultFitnessCurve } from './result-fitness-curve';
import { allTables, describeAdjustment, fitnessTable } from './result-tables';
import { ResultsStore } from './results-store';
import { SensitivityTable } from './sensitivity-table';

/** Sections of the page, for the "on this page" links. */
const SECTIONS = [
  { id: 'key-indicators', title: 'Key indicators' },
  { id: 'fitness', title: 'Fitness curve' },
  { id: 'fleets', title: 'Fleets' },
  { id: 'dependence', title: 'Diet dependence' },
  { id: 'trophic', title: 'Trophic positions and ladder' },
  { id: 'recycling', title: 'Recycling' },
  { id: 'sensitivity', title: 'Harvest sensitivity' },
] as const;

/** The result of one run of a harvest option: what changes, how sure it is, and every table behind it. */
@Component({
  selector: 'sw-result-page',
  imports: [
    DatePipe,
    RouterLink,
    MatButtonModule,
    MatIconModule,
    MatProgressBarModule,
    Caution,
    CsvButton,
    DependenceSection,
    ResultFitnessCurve,
    FleetEffects,
    FleetTable,
    KeyIndicators,
    LadderChart,
    PositionsTable,
    RecyclingSection,
    ResultComments,
    SensitivityTable,
  ],
  providers: [ResultsStore, ResultCommentsStore],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './result-page.html',
  styleUrl: './result-page.scss',
})
export class ResultPage {
  /** Route parameter `:id`. */
  readonly id = input.required<string>();

  protected readonly store = inject(ResultsStore);
  protected readonly comments = inject(ResultCommentsStore);
  protected readonly session = inject(SessionStore);
  /** `#indicator-tst` or `#compartment-cod` from a comment's link: the row to bring into view once the result is drawn. */
  private readonly fragment = toSignal(inject(ActivatedRoute).fragment, { initialValue: null });
  private pointedAt: string | null = null;
  private readonly title = inject(Title);
  protected readonly sections = computed(() => (this.comments.available() ? [...SECTIONS, { id: 'comments', title: 'Comments' }] : SECTIONS));
  protected readonly exporting = signal(false);
  protected readonly exportError = signal<string | null>(null);

  protected readonly prefix = computed(() => `run-${this.id().slice(0, 8)}`);
  protected readonly unit = computed(() => this.store.doc()?.baseline.unit ?? '');
  protected readonly adjustments = computed(() =>
    (this.store.run()?.inputs.option.adjustments ?? []).map((a) => describeAdjustment(a, this.store.doc(), this.unit())),
  );
  protected readonly fitnessExport = computed(() => fitnessTable(this.store.fitness()));

  constructor() {
    effect(() => {
      const id = this.id();
      untracked(() => this.store.load(id));
    });
    effect(() => {
      const optionId = this.store.run()?.optionId;
      if (optionId) untracked(() => this.comments.load(optionId));
    });
    afterRenderEffect(() => {
      const target = this.fragment();
      if (!target || !this.store.doc() || target === this.pointedAt) return;
      const element = document.getElementById(target);
      if (!element) return;
      this.pointedAt = target;
      element.scrollIntoView({ block: 'center' });
      markPointedAt(element);
    });
    effect(() => {
      const name = this.store.optionName();
      if (name) this.title.setTitle(`${name} — result — Seinework`);
    });
  }

  /** The run the option is shared with, whose discussion the comments belong to. */
  protected readonly sharedRunId = computed(() => sharedRunOf(this.store.option()));

  protected jump(id: string): void {
    document.getElementById(id)?.scrollIntoView({ behavior: 'smooth', block: 'start' });
  }

  protected async downloadWorkbook(): Promise<void> {
    const doc = this.store.doc();
    if (!doc) return;
    this.exporting.set(true);
    this.exportError.set(null);
    try {
      await downloadXlsx(allTables(doc, this.store.sensitivityRows()), this.prefix());
    } catch (error) {
      this.exportError.set(`The workbook could not be made: ${error instanceof Error ? error.message : String(error)}. Each table's CSV still works.`);
    } finally {
      this.exporting.set(false);
    }
  }

  protected a(value: number): string {
    return formatValue(value, 'number', 4);
  }
  protected band(band: { p5: number; p95: number } | null): string {
    return band ? `${formatValue(band.p5, 'number', 4)} to ${formatValue(band.p95, 'number', 4)}` : '—';
  }
  protected side(side: string): string {
    return side === 'flexibility' ? 'more flexible than the peak' : side === 'constraint' ? 'more constrained than the peak' : side === 'peak' ? 'at the peak' : '—';
  }
}
