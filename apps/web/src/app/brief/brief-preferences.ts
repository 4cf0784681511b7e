import { ChangeDetectionStrategy, Component, input } from '@angular/core';
import type { PreferenceSummary } from '@seinework/contracts';
import { BriefDatePipe } from './brief-format';

/** "Preferences recorded": the section both briefs end with, in the brief's own table style. */
@Component({
  selector: 'sw-brief-preferences',
  imports: [BriefDatePipe],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <section aria-labelledby="preferences">
      <h2 id="preferences">Preferences recorded</h2>
      @if (preferences().length === 0) {
        <p>No council member has recorded a preference.</p>
      } @else {
        <table>
          <thead>
            <tr>
              <th scope="col">Member</th>
              <th scope="col">Prefers</th>
              <th scope="col">Reason</th>
              <th scope="col">Recorded</th>
            </tr>
          </thead>
          <tbody>
            @for (preference of preferences(); track preference.id) {
              <tr>
                <td>{{ preference.member }}</td>
                <td>{{ preference.optionName }}</td>
                <td>{{ preference.reason }}</td>
                <td>{{ preference.createdAt | briefDate }}</td>
              </tr>
            }
          </tbody>
        </table>
      }
    </section>
  `,
  styleUrl: './brief-document.scss',
})
export class BriefPreferences {
  readonly preferences = input.required<readonly PreferenceSummary[]>();
}
