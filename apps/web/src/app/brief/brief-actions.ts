import { ChangeDetectionStrategy, Component, input, ViewEncapsulation } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';

/**
 * The print page's own bar (print, download the PDF), and the print rules of a brief: A4, no
 * toolbar, navigation or app footer, black on white, sections that start on a new page, table rows
 * never split. The rules are global (the shell is outside the page) but apply only while a brief is shown.
 */
@Component({
  selector: 'sw-brief-actions',
  imports: [MatButtonModule, MatIconModule],
  changeDetection: ChangeDetectionStrategy.OnPush,
  encapsulation: ViewEncapsulation.None,
  template: `
    <div class="brief-actions" role="toolbar" aria-label="Brief">
      <button mat-flat-button type="button" (click)="print()">
        <mat-icon aria-hidden="true">print</mat-icon>
        Print
      </button>
      <a mat-stroked-button [href]="pdfUrl()" download>
        <mat-icon aria-hidden="true">download</mat-icon>
        Download PDF
      </a>
      <span class="hint">The printed page and the PDF carry the same content.</span>
    </div>
  `,
  styles: `
    .brief-actions { display: flex; flex-wrap: wrap; align-items: center; gap: 12px; margin: 0 0 24px; }
    .brief-actions .hint { color: var(--mat-sys-on-surface-variant); font-size: 0.875rem; }

    @page {
      size: A4;
      margin: 18mm 16mm 18mm;
      @bottom-left { content: 'Seinework brief'; font: 8pt Roboto, sans-serif; color: #4a5a62; }
      @bottom-right { content: 'Page ' counter(page) ' of ' counter(pages); font: 8pt Roboto, sans-serif; color: #4a5a62; }
    }

    @media print {
      body:has(.brief-document) {
        background: #fff !important;
        color: #000 !important;
      }
      body:has(.brief-document) mat-toolbar,
      body:has(.brief-document) .skip-link,
      body:has(.brief-document) sw-root > footer,
      body:has(.brief-document) nav,
      .brief-actions {
        display: none !important;
      }
      body:has(.brief-document) main {
        padding: 0 !important;
        margin: 0 !important;
        max-width: none !important;
      }
      .brief-document { color: #000; background: #fff; max-width: none; padding: 0; font-size: 10pt; }
      .brief-document .new-page { break-before: page; }
      .brief-document h2, .brief-document h3 { break-after: avoid; }
      .brief-document tr, .brief-document figure, .brief-document .keep { break-inside: avoid; }
      .brief-document thead { display: table-header-group; }
      .brief-document a { color: #000; text-decoration: none; }
    }
  `,
})
export class BriefActions {
  readonly pdfUrl = input.required<string>();

  protected print(): void {
    window.print();
  }
}
