import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import PDFDocument from 'pdfkit';
import type { ChartFigure } from '@seinework/contracts';

/**
 * The brief's page layout on pdfkit: A4 with margins, headings, paragraphs, tables that break
 * between rows (the header repeated on the next page), charts drawn as vector paths, and at the end
 * a footer with page numbers. The app's own Roboto (.woff from @fontsource; pdfkit reads no .woff2).
 */

const require = createRequire(import.meta.url);
const FONT_DIR = join(dirname(require.resolve('@fontsource/roboto/package.json')), 'files');
const FONT = { regular: 'roboto-latin-400-normal.woff', medium: 'roboto-latin-500-normal.woff', bold: 'roboto-latin-700-normal.woff' } as const;

export const INK = '#1b1b1f';
export const MUTED = '#4a5a62';
const RULE = '#b8bec1';
const HEAD_FILL = '#e6eef0';

export interface Column {
  title: string;
  width: number;
  align?: 'left' | 'right';
}

export interface BriefDocumentSettings {
  title: string;
  subject: string;
  /** CreationDate and the footer's date: the run's finish time, so one run gives the same bytes. */
  dated: Date;
  footer: string;
}

export class BriefDocument {
  readonly doc: PDFKit.PDFDocument;
  private readonly chunks: Buffer[] = [];
  private readonly finished: Promise<Buffer>;

  constructor(private readonly settings: BriefDocumentSettings) {
    this.doc = new PDFDocument({
      size: 'A4',
      margins: { top: 56, bottom: 64, left: 56, right: 56 },
      bufferPages: true,
      info: { Title: settings.title, Subject: settings.subject, Author: 'Seinework', Creator: 'Seinework', Producer: 'Seinework', CreationDate: settings.dated, ModDate: settings.dated },
      lang: 'en-GB',
      displayTitle: true,
    });
    this.doc.registerFont('regular', join(FONT_DIR, FONT.regular));
    this.doc.registerFont('medium', join(FONT_DIR, FONT.medium));
    this.doc.registerFont('bold', join(FONT_DIR, FONT.bold));
    this.doc.on('data', (chunk: Buffer) => this.chunks.push(chunk));
    this.finished = new Promise((resolve, reject) => {
      this.doc.on('end', () => resolve(Buffer.concat(this.chunks)));
      this.doc.on('error', reject);
    });
    this.doc.font('regular').fontSize(10).fillColor(INK);
  }

  get left(): number {
    return this.doc.page.margins.left;
  }

  get width(): number {
    return this.doc.page.width - this.doc.page.margins.left - this.doc.page.margins.right;
  }

  private get bottom(): number {
    return this.doc.page.height - this.doc.page.margins.bottom;
  }

  /** A new page unless `height` more points fit on this one. */
  ensure(height: number): void {
    if (this.doc.y + height > this.bottom) this.doc.addPage();
  }

  newPage(): void {
    this.doc.addPage();
  }

  title(text: string, subtitle?: string): void {
    this.doc.font('bold').fontSize(20).fillColor(INK).text(text, this.left, this.doc.y, { width: this.width });
    if (subtitle) this.doc.moveDown(0.2).font('regular').fontSize(11).fillColor(MUTED).text(subtitle, { width: this.width });
    this.doc.fillColor(INK).moveDown(0.8);
  }

  /** A section heading, kept with at least `keep` points of what follows it. */
  heading(text: string, keep = 80): void {
    this.ensure(keep + 28);
    this.doc.moveDown(0.6).font('bold').fontSize(13).fillColor('#00494c').text(text, this.left, this.doc.y, { width: this.width });
    this.doc.fillColor(INK).font('regular').fontSize(10).moveDown(0.3);
  }

  paragraph(text: string, options: { muted?: boolean; size?: number; bold?: boolean } = {}): void {
    this.doc
      .font(options.bold ? 'medium' : 'regular')
      .fontSize(options.size ?? 10)
      .fillColor(options.muted ? MUTED : INK);
    this.ensure(this.doc.heightOfString(text, { width: this.width }));
    this.doc.text(text, this.left, this.doc.y, { width: this.width });
    this.doc.fillColor(INK).moveDown(0.4);
  }

  bullets(items: readonly string[]): void {
    for (const item of items) {
      this.doc.font('regular').fontSize(10);
      const height = this.doc.heightOfString(item, { width: this.width - 14 });
      this.ensure(height);
      const y = this.doc.y;
      this.doc.text('•', this.left + 2, y, { lineBreak: false });
      this.doc.text(item, this.left + 14, y, { width: this.width - 14 });
      this.doc.moveDown(0.2);
    }
    this.doc.moveDown(0.3);
  }

  /** Label–value pairs in two columns. */
  facts(rows: readonly [string, string][]): void {
    const labelWidth = 130;
    for (const [label, value] of rows) {
      this.doc.font('regular').fontSize(9.5);
      const height = Math.max(this.doc.heightOfString(value, { width: this.width - labelWidth }), 12);
      this.ensure(height);
      const y = this.doc.y;
      this.doc.font('medium').fillColor(MUTED).text(label, this.left, y, { width: labelWidth - 8 });
      this.doc.font('regular').fillColor(INK).text(value, this.left + labelWidth, y, { width: this.width - labelWidth });
      this.doc.y = y + height + 3;
    }
    this.doc.moveDown(0.4);
  }

  /** A table: rows never split across pages; the header row is repeated after a page break. */
  table(columns: readonly Column[], rows: readonly string[][], options: { size?: number } = {}): void {
    const size = options.size ?? 8.5;
    const total = columns.reduce((sum, c) => sum + c.width, 0);
    const widths = columns.map((c) => (c.width / total) * this.width);
    const pad = 3;
    const heightOf = (cells: readonly string[], font: string) => {
      this.doc.font(font).fontSize(size);
      return Math.max(...cells.map((cell, k) => this.doc.heightOfString(cell || ' ', { width: widths[k]! - 2 * pad }))) + 2 * pad;
    };
    const drawRow = (cells: readonly string[], font: string, header: boolean) => {
      const height = heightOf(cells, font);
      const y = this.doc.y;
      if (header) this.doc.rect(this.left, y, this.width, height).fill(HEAD_FILL);
      let x = this.left;
      this.doc.font(font).fontSize(size).fillColor(INK);
      cells.forEach((cell, k) => {
        this.doc.text(cell, x + pad, y + pad, { width: widths[k]! - 2 * pad, align: columns[k]!.align ?? 'left' });
        x += widths[k]!;
      });
      this.doc
        .moveTo(this.left, y + height)
        .lineTo(this.left + this.width, y + height)
        .lineWidth(header ? 0.8 : 0.4)
        .strokeColor(RULE)
        .stroke();
      this.doc.y = y + height;
    };
    const header = columns.map((c) => c.title);
    const headerHeight = heightOf(header, 'medium');
    this.ensure(headerHeight + (rows[0] ? heightOf(rows[0], 'regular') : 0));
    drawRow(header, 'medium', true);
    for (const row of rows) {
      if (this.doc.y + heightOf(row, 'regular') > this.bottom) {
        this.doc.addPage();
        drawRow(header, 'medium', true);
      }
      drawRow(row, 'regular', false);
    }
    this.doc.x = this.left;
    this.doc.moveDown(0.6);
  }

  /** A chart's shapes as vector paths, scaled to the text width. */
  chart(figure: ChartFigure): void {
    const scale = Math.min(1, this.width / figure.width);
    const height = figure.height * scale;
    this.ensure(height + 14);
    const x0 = this.left + (this.width - figure.width * scale) / 2;
    const y0 = this.doc.y;
    const doc = this.doc;
    doc.save();
    doc.translate(x0, y0).scale(scale);
    for (const shape of figure.shapes) {
      switch (shape.kind) {
        case 'line':
          doc.moveTo(shape.x1, shape.y1).lineTo(shape.x2, shape.y2).lineWidth(shape.width);
          if (shape.dash) doc.dash(3, { space: 2 });
          doc.strokeColor(shape.stroke).stroke();
          if (shape.dash) doc.undash();
          break;
        case 'polyline': {
          const [first, ...rest] = shape.points;
          if (!first) break;
          doc.moveTo(first[0], first[1]);
          for (const [px, py] of rest) doc.lineTo(px, py);
          doc.lineWidth(shape.width).lineJoin('round').strokeColor(shape.stroke).stroke();
          break;
        }
        case 'circle':
          doc.circle(shape.cx, shape.cy, shape.r).fillColor(shape.fill).fill();
          break;
        case 'rect':
          doc.rect(shape.x, shape.y, shape.w, shape.h).fillColor(shape.fill).fill();
          break;
        case 'text': {
          doc.font(shape.bold ? 'medium' : 'regular').fontSize(shape.size);
          const width = doc.widthOfString(shape.text);
          const x = shape.anchor === 'middle' ? shape.x - width / 2 : shape.anchor === 'end' ? shape.x - width : shape.x;
          doc.fillColor(shape.colour).text(shape.text, x, shape.y, { lineBreak: false, baseline: 'alphabetic' });
          break;
        }
      }
    }
    doc.restore();
    doc.fillColor(INK).font('regular').fontSize(10);
    doc.x = this.left;
    doc.y = y0 + height + 6;
    this.paragraph(figure.description, { muted: true, size: 8 });
  }

  /** Page numbers and the footer on every page, then the finished file. */
  async finish(): Promise<Buffer> {
    const range = this.doc.bufferedPageRange();
    for (let i = range.start; i < range.start + range.count; i++) {
      this.doc.switchToPage(i);
      const bottomMargin = this.doc.page.margins.bottom;
      // the footer sits in the bottom margin: without this pdfkit would start a new page for it
      this.doc.page.margins.bottom = 0;
      const y = this.doc.page.height - 40;
      this.doc.moveTo(this.left, y - 6).lineTo(this.left + this.width, y - 6).lineWidth(0.4).strokeColor(RULE).stroke();
      this.doc.font('regular').fontSize(7.5).fillColor(MUTED);
      this.doc.text(this.settings.footer, this.left, y, { width: this.width - 70, lineBreak: false });
      this.doc.text(`Page ${i + 1} of ${range.count}`, this.left + this.width - 70, y, { width: 70, align: 'right', lineBreak: false });
      this.doc.page.margins.bottom = bottomMargin;
    }
    this.doc.end();
    return this.finished;
  }
}
