import { ChangeDetectionStrategy, Component } from '@angular/core';
import { RouterOutlet } from '@angular/router';
import { MatToolbarModule } from '@angular/material/toolbar';
import { MatIconModule } from '@angular/material/icon';
import { Caution } from './shared/caution';

@Component({
  selector: 'sw-root',
  imports: [RouterOutlet, MatToolbarModule, MatIconModule, Caution],
  changeDetection: ChangeDetectionStrategy.OnPush,
  template: `
    <mat-toolbar>
      <mat-icon aria-hidden="true">set_meal</mat-icon>
      <span class="product">Seinework</span>
      <span class="tagline">food-web checks for harvest decisions</span>
    </mat-toolbar>
    <main>
      <router-outlet />
    </main>
    <footer><sw-caution /></footer>
  `,
  styles: `
    :host { display: flex; flex-direction: column; min-height: 100%; }
    mat-toolbar { gap: 12px; }
    .product { font-weight: 700; letter-spacing: 0.02em; }
    .tagline { font-size: 0.875rem; opacity: 0.85; }
    main { flex: 1; padding: 24px; max-width: 1200px; width: 100%; margin: 0 auto; box-sizing: border-box; }
    footer { padding: 0 24px 24px; max-width: 1200px; margin: 0 auto; }
  `,
})
export class App {}
