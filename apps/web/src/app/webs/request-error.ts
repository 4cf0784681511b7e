import { HttpErrorResponse } from '@angular/common/http';
import type { UploadProblem } from '@seinework/contracts';

/** The readable message of a failed request: the server's `{error, details?}` body when there is one. */
export function errorMessage(error: unknown): string {
  if (error instanceof HttpErrorResponse) {
    if (error.status === 0) return 'The server could not be reached. Check the connection and try again.';
    const body = error.error as { error?: unknown; details?: unknown } | null;
    const main = typeof body?.error === 'string' ? body.error : error.statusText || `error ${error.status}`;
    const details = Array.isArray(body?.details) ? body.details.filter((d): d is string => typeof d === 'string') : [];
    return details.length > 0 ? `${main}: ${details.join('; ')}` : main;
  }
  return error instanceof Error ? error.message : String(error);
}

/** The row-by-row problems of a refused upload (422 with `{table,row,column,problem}` details), if any. */
export function uploadProblems(error: unknown): UploadProblem[] {
  if (!(error instanceof HttpErrorResponse) || error.status !== 422) return [];
  const details = (error.error as { details?: unknown } | null)?.details;
  if (!Array.isArray(details)) return [];
  return details.map((d): UploadProblem =>
    typeof d === 'string'
      ? { table: 'web', row: null, column: null, problem: d }
      : {
          table: String(d?.table ?? 'web'),
          row: typeof d?.row === 'number' ? d.row : null,
          column: typeof d?.column === 'string' ? d.column : null,
          problem: String(d?.problem ?? ''),
        },
  );
}
