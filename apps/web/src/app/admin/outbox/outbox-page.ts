import { ChangeDetectionStrategy, Component, inject, type OnInit } from '@angular/core';
import { DatePipe } from '@angular/common';
import { MatButtonModule } from '@angular/material/button';
import { MatExpansionModule } from '@angular/material/expansion';
import { MatIconModule } from '@angular/material/icon';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { ListState } from '../list-state';
import { OutboxStore } from './outbox-store';

/** `/admin/outbox`: the e-mail the app has sent, as the local mail catcher received it. */
@Component({
  selector: 'sw-outbox-page',
  imports: [DatePipe, MatButtonModule, MatExpansionModule, MatIconModule, MatPaginatorModule, ListState],
  providers: [OutboxStore],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './outbox-page.html',
  styleUrls: ['../admin-page.scss', './outbox-page.scss'],
})
export class OutboxPage implements OnInit {
  protected readonly store = inject(OutboxStore);

  ngOnInit(): void {
    void this.store.load();
  }

  protected showPage(event: PageEvent): void {
    void this.store.showPage(event.pageIndex, event.pageSize);
  }
}
