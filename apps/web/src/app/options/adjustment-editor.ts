import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatAutocompleteModule } from '@angular/material/autocomplete';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatSelectModule } from '@angular/material/select';
import type { Web } from '@seinework/contracts';
import { compartmentsFor, fieldsOf, fleetsOf, type AdjustmentDraft } from './adjustment-draft';
import { ADJUSTMENT_KINDS } from './option-words';

/** One adjustment of the option form: its kind, the fields that kind needs, and the engine's problems with it. */
@Component({
  selector: 'sw-adjustment-editor',
  imports: [FormsModule, MatAutocompleteModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule, MatSelectModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './adjustment-editor.html',
  styleUrl: './adjustment-editor.scss',
})
export class AdjustmentEditor {
  readonly adjustment = input.required<AdjustmentDraft>();
  /** Position in the option (0-based, as the engine counts). */
  readonly index = input.required<number>();
  readonly web = input.required<Web | null>();
  readonly problems = input<readonly string[]>([]);
  /** What the adjustment still lacks (a quiet hint, not a refusal). */
  readonly missing = input<string | null>(null);
  readonly changed = output<AdjustmentDraft>();
  readonly removed = output<void>();

  protected readonly kinds = ADJUSTMENT_KINDS;
  protected readonly needs = computed(() => fieldsOf(this.adjustment().type));
  protected readonly fleets = computed(() => fleetsOf(this.web()));
  protected readonly compartments = computed(() => compartmentsFor(this.adjustment(), this.web()));
  protected readonly unit = computed(() => this.web()?.unit ?? '');
  protected readonly label = computed(() => `Adjustment ${this.index() + 1}`);

  protected change(field: keyof AdjustmentDraft, value: unknown): void {
    this.changed.emit({ ...this.adjustment(), [field]: value });
  }
}
