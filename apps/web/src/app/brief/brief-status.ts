import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import { MatProgressBarModule } from '@angular/material/progress-bar';

/** What a brief page shows before its brief: "Preparing the brief…", or why there is none, in the server's words. */
@Component({
  selector: 'sw-brief-status',
  imports: [MatProgressBarModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    @if (error(); as message) {
      <div class="state" role="alert">
        <h1>{{ refusal() }}</h1>
        <p class="error">{{ message }}</p>
      </div>
    } @else {
      <div class="state" role="status">
        <p>Preparing the brief…</p>
        <mat-progress-bar mode="indeterminate" aria-label="Preparing the brief" />
      </div>
    }
  `,
  styleUrl: './brief-document.scss',
})
export class BriefStatus {
  /** The server's reason, once asking failed; until then the page is preparing. */
  readonly error = input<string | null>(null);
  /** The heading of a refusal: "No brief for this option". */
  readonly refusal = input.required<string>();
}
