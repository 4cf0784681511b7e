import { ChangeDetectionStrategy, Component, computed, effect, input, output, signal, untracked, viewChild } from '@angular/core';
import { DatePipe } from '@angular/common';
import { FormsModule, NgForm } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatInputModule } from '@angular/material/input';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatRadioModule } from '@angular/material/radio';
import type { PreferenceSummary } from '@seinework/contracts';
import type { ComparedRun } from './compared-run';

export const MAX_REASON = 4000;

/** The council's current preferences among the compared options, and the form to record one's own. */
@Component({
  selector: 'sw-preference-panel',
  imports: [DatePipe, FormsModule, MatButtonModule, MatFormFieldModule, MatInputModule, MatProgressBarModule, MatRadioModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <h2>The council's preferences</h2>
    @if (preferences().length === 0) {
      <p class="quiet">No council member has recorded a preference among these options yet.</p>
    } @else {
      <ul class="preferences" aria-label="The council's preferences">
        @for (preference of preferences(); track preference.id) {
          <li>
            <p class="who"><strong>{{ preference.member }}</strong> prefers <strong>{{ letterOf(preference.optionId) }}{{ preference.optionName }}</strong></p>
            <p class="reason">{{ preference.reason }}</p>
            <p class="when">{{ preference.createdAt | date: 'd MMM y, HH:mm' }}</p>
          </li>
        }
      </ul>
    }

    @if (canRecord()) {
      <form class="record" (ngSubmit)="recordPreference()" #form="ngForm" aria-labelledby="record-heading">
        <h3 id="record-heading">Record your preference</h3>
        <p class="quiet">One preference per member on this baseline: a new one replaces your earlier one, which stays on the record.</p>
        <div class="choice">
          <span id="option-choice" class="label">The option you prefer</span>
          <mat-radio-group name="option" aria-labelledby="option-choice" [ngModel]="optionId()" (ngModelChange)="optionId.set($event)">
            @for (run of runs(); track run.runId) {
              <mat-radio-button [value]="run.optionId">Option {{ run.letter }}: {{ run.optionName }}</mat-radio-button>
            }
          </mat-radio-group>
          @if (form.submitted && !optionId()) {
            <p class="error" role="alert">Choose the option you prefer.</p>
          }
        </div>
        <mat-form-field appearance="outline" class="reason-field">
          <mat-label>Your reason</mat-label>
          <textarea matInput name="reason" rows="4" required [maxlength]="maxReason" [ngModel]="reason()" (ngModelChange)="reason.set($event)"></textarea>
          <mat-hint align="end">{{ reason().length }} / {{ maxReason }}</mat-hint>
          @if (form.submitted && !reason().trim()) {
            <mat-error>Say why you prefer this option.</mat-error>
          }
        </mat-form-field>
        @if (recording()) {
          <mat-progress-bar mode="indeterminate" aria-label="Recording your preference" />
        }
        @if (error(); as error) {
          <p class="error" role="alert">{{ error }}</p>
        }
        @if (recorded()) {
          <p class="done" role="status">Your preference was recorded.</p>
        }
        <button mat-flat-button type="submit" [disabled]="recording()">Record preference</button>
      </form>
    }
  `,
  styles: `
    h2 { font: var(--mat-sys-title-large); margin: 32px 0 8px; }
    h3 { font: var(--mat-sys-title-medium); margin: 0 0 4px; }
    .preferences { list-style: none; padding: 0; margin: 0; display: grid; gap: 8px; max-width: 80ch; }
    .preferences li { padding: 12px 16px; border: 1px solid var(--mat-sys-outline-variant); border-radius: 8px; }
    .preferences p { margin: 0; }
    .reason { white-space: pre-line; margin: 4px 0 !important; }
    .when, .quiet { color: var(--mat-sys-on-surface-variant); font-size: 0.875rem; }
    .record { margin-top: 24px; max-width: 80ch; padding: 16px; border-radius: 12px; background: var(--mat-sys-surface-container-low); }
    .choice { margin: 12px 0; }
    .label { display: block; font: var(--mat-sys-label-large); margin-bottom: 4px; }
    mat-radio-group { display: flex; flex-direction: column; }
    .reason-field { display: block; width: 100%; }
    .error { color: var(--mat-sys-error); }
    .done { color: var(--mat-sys-primary); font-weight: 500; }
  `,
})
export class PreferencePanel {
  readonly runs = input.required<readonly ComparedRun[]>();
  readonly preferences = input.required<readonly PreferenceSummary[]>();
  readonly canRecord = input(false);
  readonly recording = input(false);
  readonly error = input<string | null>(null);
  /** The option whose preference was just stored: the form clears. */
  readonly recorded = input<string | null>(null);
  readonly record = output<{ optionId: string; reason: string }>();

  protected readonly maxReason = MAX_REASON;
  protected readonly optionId = signal<string | null>(null);
  protected readonly reason = signal('');
  private readonly form = viewChild(NgForm);
  private readonly letters = computed(() => new Map(this.runs().map((run) => [run.optionId, run.letter])));

  constructor() {
    // once stored, the form starts afresh (and stops showing what was missing at the first try)
    effect(() => {
      if (!this.recorded()) return;
      untracked(() => {
        this.form()?.resetForm();
        this.optionId.set(null);
        this.reason.set('');
      });
    });
  }

  protected letterOf(optionId: string): string {
    const letter = this.letters().get(optionId);
    return letter ? `option ${letter}, ` : '';
  }

  protected recordPreference(): void {
    const optionId = this.optionId();
    const reason = this.reason().trim();
    if (!optionId || !reason) return;
    this.record.emit({ optionId, reason });
  }
}
