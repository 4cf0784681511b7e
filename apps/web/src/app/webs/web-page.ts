import { ChangeDetectionStrategy, Component, effect, inject, input, untracked } from '@angular/core';
import { DatePipe } from '@angular/common';
import { Title } from '@angular/platform-browser';
import { Router, RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatDialog } from '@angular/material/dialog';
import { MatIconModule } from '@angular/material/icon';
import { MatMenuModule } from '@angular/material/menu';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatTableModule } from '@angular/material/table';
import type { VersionSummary } from '@seinework/contracts';
import { SessionStore } from '../auth/session-store';
import { FitnessCurve } from '../shared/fitness-curve';
import { OptionList } from '../options/option-list';
import { CloneDialog, type CloneDetails } from './clone-dialog';
import { HeadlineIndicators } from './headline-indicators';
import { TrophicPositions } from './trophic-positions';
import { VersionStatusChip } from './version-status';
import { WebDiagram } from './web-diagram';
import { WebPageStore } from './web-page-store';

/** One web: its history of versions and what the selected version says about the web. */
@Component({
  selector: 'sw-web-page',
  imports: [
    DatePipe,
    RouterLink,
    MatButtonModule,
    MatIconModule,
    MatMenuModule,
    MatProgressBarModule,
    MatTableModule,
    FitnessCurve,
    HeadlineIndicators,
    OptionList,
    TrophicPositions,
    VersionStatusChip,
    WebDiagram,
  ],
  providers: [WebPageStore],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './web-page.html',
  styleUrl: './web-page.scss',
})
export class WebPage {
  /** Route parameter `:id`. */
  readonly id = input.required<string>();
  /** Query parameter `?version=`: the version to show, else the newest published one. */
  readonly version = input<string>();

  protected readonly store = inject(WebPageStore);
  protected readonly session = inject(SessionStore);
  private readonly router = inject(Router);
  private readonly dialog = inject(MatDialog);
  protected readonly columns = ['number', 'status', 'note', 'created', 'published', 'basedOn', 'actions'];

  private readonly title = inject(Title);

  constructor() {
    effect(() => {
      const id = this.id();
      untracked(() => this.store.load(id, this.version()));
    });
    // the browser tab and history name the web, not just "Web"
    effect(() => {
      const name = this.store.detail()?.name;
      if (name) this.title.setTitle(`${name} — Seinework`);
    });
  }

  protected showVersion(version: VersionSummary): void {
    this.store.selectVersion(version.id);
    this.router.navigate([], { queryParams: { version: version.id }, replaceUrl: true });
  }

  protected numberOf(versionId: string | null): number | null {
    return this.store.detail()?.versions.find((v) => v.id === versionId)?.number ?? null;
  }

  protected editAsNewDraft(version: VersionSummary): void {
    this.router.navigate(['/webs', this.id(), 'versions', version.id, 'edit']);
  }

  protected async publishVersion(version: VersionSummary): Promise<void> {
    await this.store.publish(version.id);
  }

  protected cloneVersion(version: VersionSummary): void {
    const detail = this.store.detail();
    if (!detail) return;
    this.dialog
      .open<CloneDialog, unknown, CloneDetails>(CloneDialog, {
        data: { webName: detail.name, versionNumber: version.number, place: detail.place, period: detail.period },
        width: 'min(520px, 95vw)',
      })
      .afterClosed()
      .subscribe(async (details) => {
        if (!details) return;
        const created = await this.store.clone(version.id, details);
        if (created) this.router.navigate(['/webs', created.id], { queryParams: { version: created.versionId } });
      });
  }
}
