import { ChangeDetectionStrategy, Component, inject } from '@angular/core';
import { toSignal } from '@angular/core/rxjs-interop';
import { filter, map } from 'rxjs';
import { type ActivatedRouteSnapshot, NavigationEnd, Router, RouterLink, RouterLinkActive, RouterOutlet } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatToolbarModule } from '@angular/material/toolbar';
import { RoleLabelPipe } from '../auth/role-label';
import { SessionStore } from '../auth/session-store';
import { Caution } from '../shared/caution';

/** The frame of every page: the toolbar (mark, navigation, who is signed in), the page, the caution. */
@Component({
  selector: 'sw-shell',
  imports: [RouterOutlet, RouterLink, RouterLinkActive, MatToolbarModule, MatButtonModule, MatIconModule, MatMenuModule, RoleLabelPipe, Caution],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './shell.html',
  styleUrl: './shell.scss',
})
export class Shell {
  protected readonly session = inject(SessionStore);
  private readonly router = inject(Router);
  /** Whether the page shown says the caution itself (PAGE_CARRIES_CAUTION): then the footer does not repeat it. */
  protected readonly pageCarriesCaution = toSignal(
    this.router.events.pipe(
      filter((event) => event instanceof NavigationEnd),
      map(() => carriesCaution(this.router.routerState.snapshot.root)),
    ),
    { initialValue: false },
  );

  protected async signOut(): Promise<void> {
    await this.session.signOut();
    await this.router.navigateByUrl('/sign-in');
  }
}

function carriesCaution(route: ActivatedRouteSnapshot): boolean {
  let leaf = route;
  while (leaf.firstChild) leaf = leaf.firstChild;
  return leaf.data['pageCarriesCaution'] === true;
}
