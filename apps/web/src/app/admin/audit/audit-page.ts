import { ChangeDetectionStrategy, Component, inject, type OnInit } from '@angular/core';
import { DatePipe } from '@angular/common';
import { MatPaginatorModule, type PageEvent } from '@angular/material/paginator';
import { MatTableModule } from '@angular/material/table';
import { ListState } from '../list-state';
import { actionInWords, subjectInWords } from './audit-wording';
import { AuditStore } from './audit-store';

/** `/admin/audit`: the audit log, one row per change. */
@Component({
  selector: 'sw-audit-page',
  imports: [DatePipe, MatPaginatorModule, MatTableModule, ListState],
  providers: [AuditStore],
  changeDetection: ChangeDetectionStrategy.OnPush,
  templateUrl: './audit-page.html',
  styleUrl: '../admin-page.scss',
})
export class AuditPage implements OnInit {
  protected readonly store = inject(AuditStore);
  protected readonly columns = ['at', 'actor', 'action', 'subject', 'detail'];
  protected readonly actionInWords = actionInWords;
  protected readonly subjectInWords = subjectInWords;

  ngOnInit(): void {
    void this.store.showPage(0, 50);
  }

  protected showPage(event: PageEvent): void {
    void this.store.showPage(event.pageIndex, event.pageSize);
  }
}
