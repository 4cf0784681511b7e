import { ChangeDetectionStrategy, Component, computed, effect, inject, input, untracked } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { Router, RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import { Caution } from '../shared/caution';
import type { HasUnsavedChanges } from '../webs/unsaved-changes-guard';
import { AdjustmentEditor } from './adjustment-editor';
import { OptionFormStore } from './option-form-store';
import { OptionPreviewTables } from './option-preview';
import { RESPONSE_RULES } from './option-words';

/** Writing a harvest option: `/options/new?web=&version=` or `/options/:id/edit`, with the engine's preview as it is typed. */
@Component({
  selector: 'sw-option-form',
  imports: [
    FormsModule,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatProgressBarModule,
    MatRadioModule,
    Caution,
    AdjustmentEditor,
    OptionPreviewTables,
  ],
  providers: [OptionFormStore],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './option-form.html',
  styleUrl: './option-form.scss',
})
export class OptionForm implements HasUnsavedChanges {
  /** Route parameter `:id` when editing. */
  readonly id = input<string>();
  /** Query parameters of a new option: the web and the published version it stands on. */
  readonly web = input<string>();
  readonly version = input<string>();

  protected readonly store = inject(OptionFormStore);
  private readonly router = inject(Router);
  protected readonly rules = RESPONSE_RULES;

  /** Problems of the whole option (adjustment null), shown above the preview. */
  protected readonly optionProblems = computed(() => this.store.problems().filter((p) => p.adjustment === null).map((p) => p.problem));
  protected readonly heading = computed(() => (this.id() ? `Edit “${this.store.name() || 'harvest option'}”` : 'New harvest option'));

  constructor() {
    effect(() => {
      const id = this.id();
      const web = this.web();
      const version = this.version();
      untracked(() => {
        if (id) void this.store.startEdit(id);
        else if (web && version) void this.store.startNew(web, version);
      });
    });
  }

  /** What an adjustment still lacks before the engine can be asked. */
  protected missingOf(index: number): string | null {
    return this.store.draft().problems.find((p) => p.adjustment === index)?.problem ?? null;
  }

  hasUnsavedChanges(): boolean {
    return this.store.dirty();
  }

  protected problemsOf(index: number): string[] {
    return this.store
      .problems()
      .filter((p) => p.adjustment === index)
      .map((p) => p.problem);
  }

  protected async saveOption(): Promise<void> {
    const id = await this.store.save();
    if (id) void this.router.navigate(['/options', id]);
  }

  /** A frozen option is copied; the copy opens in this form. */
  protected async duplicateToEdit(): Promise<void> {
    const id = await this.store.duplicate();
    if (id) void this.router.navigate(['/options', id, 'edit']);
  }
}
