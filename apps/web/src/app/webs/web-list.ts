import { ChangeDetectionStrategy, Component, OnInit, inject } from '@angular/core';
import { DatePipe } from '@angular/common';
import { Router, RouterLink } from '@angular/router';
import { MatButtonModule } from '@angular/material/button';
import { MatFormFieldModule } from '@angular/material/form-field';
import { MatIconModule } from '@angular/material/icon';
import { MatInputModule } from '@angular/material/input';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { MatSortModule, type Sort } from '@angular/material/sort';
import { MatTableModule } from '@angular/material/table';
import type { WebListQuery } from '@seinework/contracts';
import { SessionStore } from '../auth/session-store';
import { VersionStatusChip } from './version-status';
import { WebListStore } from './web-list-store';

const FILTER_PAUSE_MS = 300;

/** Every web the signed-in person may read, newest change first. */
@Component({
  selector: 'sw-web-list',
  imports: [
    DatePipe,
    RouterLink,
    MatButtonModule,
    MatFormFieldModule,
    MatIconModule,
    MatInputModule,
    MatPaginatorModule,
    MatProgressBarModule,
    MatSortModule,
    MatTableModule,
    VersionStatusChip,
  ],
  providers: [WebListStore],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './web-list.html',
  styleUrl: './web-list.scss',
})
export class WebList implements OnInit {
  protected readonly store = inject(WebListStore);
  protected readonly session = inject(SessionStore);
  protected readonly columns = ['name', 'place', 'period', 'latest', 'published', 'updatedAt'];
  private readonly router = inject(Router);
  private filterTimer: ReturnType<typeof setTimeout> | undefined;

  ngOnInit(): void {
    this.store.load();
  }

  protected sortWebs(sort: Sort): void {
    // Material's third click clears the sort: go back to the server's default (newest change first).
    if (!sort.direction) this.store.sortBy('updatedAt', 'desc');
    else this.store.sortBy(sort.active as WebListQuery['sort'], sort.direction);
  }

  protected filterWebs(text: string): void {
    clearTimeout(this.filterTimer);
    this.filterTimer = setTimeout(() => this.store.filterBy(text), FILTER_PAUSE_MS);
  }

  protected async createFromJson(input: HTMLInputElement): Promise<void> {
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    const created = await this.store.createFromJson(file.name, await file.text());
    if (created) this.router.navigate(['/webs', created.id], { queryParams: { version: created.versionId } });
  }

  protected showPage(event: PageEvent): void {
    this.store.showPage(event.pageIndex + 1, event.pageSize);
  }
}
