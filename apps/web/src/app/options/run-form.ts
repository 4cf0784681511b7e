import { ChangeDetectionStrategy, Component, computed, effect, input, output, signal } from '@angular/core';
import { FormsModule } from '@angular/forms';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MAX_RUN_DRAWS, type UncertaintySettings } from '@seinework/contracts';
import type { RunSettings } from './options-api';

/** The settings of a new run, starting from the option's own uncertainty settings. */
@Component({
  selector: 'sw-run-form',
  imports: [FormsModule, MatButtonModule, MatFormFieldModule, MatIconModule, MatInputModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <form class="run-form" (ngSubmit)="runOption()" aria-label="Start a run">
      <mat-form-field appearance="outline">
        <mat-label>Draws</mat-label>
        <input matInput type="number" name="draws" required min="0" [max]="maxDraws" step="1" [ngModel]="draws()" (ngModelChange)="draws.set($event)" />
        <mat-hint>0 to {{ maxDraws.toLocaleString('en-GB') }}</mat-hint>
      </mat-form-field>
      <mat-form-field appearance="outline">
        <mat-label>Coefficient of variation</mat-label>
        <input matInput type="number" name="cv" required min="0" max="2" step="0.05" [ngModel]="cv()" (ngModelChange)="cv.set($event)" />
      </mat-form-field>
      <mat-form-field appearance="outline">
        <mat-label>Seed</mat-label>
        <input matInput type="number" name="seed" required min="0" step="1" [ngModel]="seed()" (ngModelChange)="seed.set($event)" />
      </mat-form-field>
      <button mat-flat-button type="submit" [disabled]="disabled()"><mat-icon aria-hidden="true">play_arrow</mat-icon> Run</button>
    </form>
    @if (problem(); as problem) {
      <p class="error" role="alert">{{ problem }}</p>
    }
  `,
  styles: `
    .run-form { display: flex; flex-wrap: wrap; align-items: flex-start; gap: 0 12px; margin-bottom: 16px; }
    .run-form mat-form-field { flex: 0 1 200px; }
    .run-form button { margin-top: 8px; }
    .error { color: var(--mat-sys-error); }
  `,
})
export class RunForm {
  readonly defaults = input<UncertaintySettings | undefined>();
  /** The option's own settings by value: the option read again (after a share) is not new settings, and leaves what was typed. */
  private readonly settings = computed(() => this.defaults(), {
    equal: (a, b) => a?.draws === b?.draws && a?.cv === b?.cv && a?.seed === b?.seed,
  });
  readonly disabled = input(false);
  readonly started = output<RunSettings>();

  protected readonly maxDraws = MAX_RUN_DRAWS;
  protected readonly draws = signal<number | null>(1000);
  protected readonly cv = signal<number | null>(0.25);
  protected readonly seed = signal<number | null>(1);
  protected readonly problem = signal<string | null>(null);

  constructor() {
    effect(() => {
      const defaults = this.settings();
      if (!defaults) return;
      this.draws.set(Math.min(defaults.draws, MAX_RUN_DRAWS));
      this.cv.set(defaults.cv);
      this.seed.set(defaults.seed);
    });
  }

  protected runOption(): void {
    const draws = this.draws();
    const cv = this.cv();
    const seed = this.seed();
    if (draws === null || !Number.isInteger(draws) || draws < 0 || draws > MAX_RUN_DRAWS) return this.problem.set(`Draws must be a whole number from 0 to ${MAX_RUN_DRAWS}.`);
    if (cv === null || cv < 0 || cv > 2) return this.problem.set('The coefficient of variation must be between 0 and 2.');
    if (seed === null || !Number.isInteger(seed) || seed < 0) return this.problem.set('The seed must be a whole number, 0 or more.');
    this.problem.set(null);
    this.started.emit({ draws, cv, seed });
  }
}
