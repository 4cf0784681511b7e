import { ChangeDetectionStrategy, Component, HostListener, computed, effect, inject, input, untracked } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { Router, RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { MatTableModule } from '@angular/material/table';
import { MatTabsModule } from '@angular/material/tabs';
import { SessionStore } from '../auth/session-store';
import { BalanceChanges } from './balance-changes';
import { CloneDialog, type CloneDetails } from './clone-dialog';
import { EDITOR_COLUMNS, EDITOR_TABLES, type EditorRow, type EditorTable } from './editor-tables';
import { EditorStore } from './editor-store';
import { ImbalancePanel } from './imbalance-panel';
import type { BalanceMethod } from './webs-api';
import type { HasUnsavedChanges } from './unsaved-changes-guard';

const TABLE_TITLES: Record<EditorTable, { title: string; row: string; explain: string }> = {
  compartments: { title: 'Compartments', row: 'compartment', explain: 'Producers, consumers and detritus pools. Flows name compartments by id.' },
  flows: { title: 'Flows', row: 'flow', explain: 'Material passed from one compartment to another: what is eaten, and what becomes detritus.' },
  imports: { title: 'Imports', row: 'import', explain: 'What enters from outside: primary production of producers, and any immigration or inflow.' },
  exports: { title: 'Exports', row: 'export', explain: 'What leaves the web. An export with a fleet is a harvest; its price is per tonne landed.' },
  respiration: { title: 'Respiration', row: 'respiration', explain: 'What each compartment respires.' },
};

export const BALANCE_METHODS: readonly { method: BalanceMethod; label: string; explain: string }[] = [
  { method: 'least-change', label: 'Smallest change', explain: 'Moves every number as little as it can, the most uncertain (largest cv) the most.' },
  { method: 'input', label: 'Keep what comes in', explain: 'Keeps imports and how each compartment splits its outputs; works the rest out from them.' },
  { method: 'output', label: 'Keep what goes out', explain: 'Keeps exports and respiration and how each compartment splits its inputs.' },
  { method: 'average', label: 'Halfway', explain: 'The average of “keep what comes in” and “keep what goes out”.' },
];

/** The flow editor: a web's tables, its live balance, balancing, and saving each change as a new draft. */
@Component({
  selector: 'sw-flow-editor',
  imports: [
    FormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatRadioModule,
    MatTableModule,
    MatTabsModule,
    BalanceChanges,
    ImbalancePanel,
  ],
  providers: [EditorStore],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './flow-editor.html',
  styleUrl: './flow-editor.scss',
})
export class FlowEditor implements HasUnsavedChanges {
  /** Route parameters `:id` and `:versionId`. */
  readonly id = input.required<string>();
  readonly versionId = input.required<string>();

  protected readonly store = inject(EditorStore);
  protected readonly session = inject(SessionStore);
  private readonly router = inject(Router);
  private readonly dialog = inject(MatDialog);

  protected readonly tables = EDITOR_TABLES;
  protected readonly titles = TABLE_TITLES;
  protected readonly columnsOf = EDITOR_COLUMNS;
  protected readonly methods = BALANCE_METHODS;
  protected readonly displayed = Object.fromEntries(EDITOR_TABLES.map((t) => [t, [...EDITOR_COLUMNS[t].map((c) => c.field), 'remove']])) as Record<EditorTable, string[]>;
  protected readonly kinds = ['producer', 'consumer', 'detritus'];

  protected readonly problemAt = computed(() => new Map(this.store.cellProblems().map((p) => [`${p.table}:${p.key}:${p.field}`, p.problem])));
  protected readonly names = computed(() => new Map(this.store.tables().compartments.map((r) => [r.cells['id'].trim(), r.cells['name'].trim() || r.cells['id'].trim()])));
  protected readonly problemCount = computed(() => this.store.cellProblems().length);

  constructor() {
    effect(() => {
      const [id, versionId] = [this.id(), this.versionId()];
      untracked(() => this.store.load(id, versionId));
    });
  }

  hasUnsavedChanges(): boolean {
    return this.store.dirty();
  }

  /** Leaving the page (reload, closing the tab) with unsaved edits asks first. */
  @HostListener('window:beforeunload', ['$event'])
  protected warnBeforeUnload(event: BeforeUnloadEvent): void {
    if (this.store.dirty()) event.preventDefault();
  }

  protected trackRow(_: number, row: EditorRow): number {
    return row.key;
  }

  protected rowCount(table: EditorTable): number {
    return this.store.tables()[table].length;
  }

  protected cellLabel(table: EditorTable, index: number, label: string): string {
    return `${TABLE_TITLES[table].row} ${index + 1}, ${label}`;
  }

  protected setCell(table: EditorTable, row: EditorRow, field: string, event: Event): void {
    this.store.setCell(table, row.key, field, (event.target as HTMLInputElement | HTMLSelectElement).value);
  }

  protected async saveDraft(): Promise<void> {
    await this.store.saveDraft();
  }

  protected async publishDraft(): Promise<void> {
    const published = await this.store.publishSaved();
    if (published) this.router.navigate(['/webs', this.id()], { queryParams: { version: published.id } });
  }

  protected cloneWeb(): void {
    const source = this.store.source();
    if (!source) return;
    this.dialog
      .open<CloneDialog, unknown, CloneDetails>(CloneDialog, {
        data: { webName: this.store.webName(), versionNumber: source.number, place: '', period: '' },
        width: 'min(520px, 95vw)',
      })
      .afterClosed()
      .subscribe(async (details) => {
        if (!details) return;
        const created = await this.store.cloneSource(details);
        if (created) this.router.navigate(['/webs', created.id, 'versions', created.versionId, 'edit']);
      });
  }
}
