import type { Web } from '@seinework/contracts';
import { webToCsv, webToXlsx, type WebPlace } from '@seinework/web-tables';

export const EXPORT_FORMATS = ['json', 'csv', 'xlsx'] as const;
export type ExportFormat = (typeof EXPORT_FORMATS)[number];

export interface ExportFile {
  readonly fileName: string;
  readonly contentType: string;
  readonly body: Buffer | string;
}

/** A version as a file to download: WEB.json, or our CSV or XLSX layout (which can be uploaded again). */
export async function exportFile(web: Web, details: WebPlace, versionNumber: number, format: ExportFormat): Promise<ExportFile> {
  const base = `${slug(web.name)}-v${versionNumber}`;
  switch (format) {
    case 'json':
      return { fileName: `${base}.json`, contentType: 'application/json; charset=utf-8', body: `${JSON.stringify(web, null, 2)}\n` };
    case 'csv':
      return { fileName: `${base}.csv`, contentType: 'text/csv; charset=utf-8', body: webToCsv(web, details) };
    case 'xlsx':
      return { fileName: `${base}.xlsx`, contentType: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet', body: await webToXlsx(web, details) };
  }
}

/** A file name safe in a Content-Disposition header on every system. */
function slug(name: string): string {
  return name.normalize('NFKD').replace(/[^\w-]+/g, '-').replace(/^-+|-+$/g, '').slice(0, 60).toLowerCase() || 'web';
}
