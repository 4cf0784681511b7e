import type { UploadProblem } from '@seinework/contracts';
import { checkWithEngine } from './engine-check';
import { MAX_UPLOAD_BYTES, MAX_UPLOAD_FILES, MAX_UPLOAD_ROWS } from './limits';
import { ProblemList } from './problems';
import { readCsvFiles, type TablesFound } from './read-csv';
import { readXlsx } from './read-xlsx';
import { tablesToWeb, type WebFields, type WebRead } from './tables-to-web';

/**
 * One upload to WEB.json: a WEB.json file, an XLSX workbook, or CSV (one combined file or one per
 * table). The kind is told by the bytes, not the name: a zip is a workbook, text starting with
 * "{" is WEB.json, other text is CSV. Sizes are limited before anything is parsed.
 */

export interface UploadFile {
  readonly name: string;
  readonly data: Uint8Array | ArrayBuffer | string;
}

type FileKind = 'xlsx' | 'json' | 'csv' | 'unknown';

export async function readUpload(files: readonly UploadFile[], fields: WebFields = {}): Promise<WebRead> {
  const refused = (problems: ProblemList): WebRead => ({ place: fields.place?.trim() ?? '', period: fields.period?.trim() ?? '', problems: problems.items, warnings: [] });
  const problems = new ProblemList();
  if (files.length === 0) problems.add('file', null, null, 'no file was sent: send a WEB.json file, an XLSX workbook or CSV in the field "file"');
  if (files.length > MAX_UPLOAD_FILES) problems.add('file', null, null, `${files.length} files were sent: at most ${MAX_UPLOAD_FILES} (one per table)`);
  const bytes = files.map((f) => toBytes(f.data));
  const total = bytes.reduce((sum, b) => sum + b.byteLength, 0);
  if (total > MAX_UPLOAD_BYTES) problems.add('file', null, null, `the upload is ${megabytes(total)} MB: at most ${megabytes(MAX_UPLOAD_BYTES)} MB`);
  if (!problems.empty) return refused(problems);

  const kinds = bytes.map(kindOf);
  kinds.forEach((kind, i) => {
    if (kind === 'unknown') problems.add(files[i].name, null, null, 'this is not a WEB.json file, an XLSX workbook or a CSV file (an old .xls workbook must be saved as .xlsx)');
  });
  if (files.length > 1 && kinds.some((k) => k !== 'csv')) problems.add('file', null, null, 'several files can only be CSV tables: send a workbook or a WEB.json file on its own');
  if (!problems.empty) return refused(problems);

  if (kinds[0] === 'json') return readJson(files[0].name, decodeText(bytes[0]), fields);
  const found: TablesFound =
    kinds[0] === 'xlsx' ? await readXlsx(bytes[0], files[0].name) : readCsvFiles(files.map((f, i) => ({ name: f.name, text: decodeText(bytes[i]) })));
  const rows = found.tables.reduce((sum, t) => sum + t.rows.length, 0);
  if (rows > MAX_UPLOAD_ROWS) found.problems.add('file', null, null, `the upload has ${rows} rows: at most ${MAX_UPLOAD_ROWS}`);
  if (!found.problems.empty) return refused(found.problems);
  return tablesToWeb(found.tables, fields);
}

function readJson(fileName: string, text: string, fields: WebFields): WebRead {
  const place = fields.place?.trim() ?? '';
  const period = fields.period?.trim() ?? '';
  let input: unknown;
  try {
    input = JSON.parse(text);
  } catch (error) {
    const problem: UploadProblem = { table: fileName, row: null, column: null, problem: `the file is not valid JSON: ${(error as Error).message}` };
    return { place, period, problems: [problem], warnings: [] };
  }
  if (typeof input === 'object' && input !== null && !Array.isArray(input)) {
    const name = fields.name?.trim();
    const unit = fields.unit?.trim();
    input = { ...input, ...(name ? { name } : {}), ...(unit ? { unit } : {}) };
  }
  const checked = checkWithEngine(input, {});
  return { web: checked.web, place, period, problems: checked.problems, warnings: checked.warnings };
}

function toBytes(data: UploadFile['data']): Uint8Array {
  if (typeof data === 'string') return new TextEncoder().encode(data);
  return data instanceof Uint8Array ? data : new Uint8Array(data);
}

function kindOf(bytes: Uint8Array): FileKind {
  if (bytes[0] === 0x50 && bytes[1] === 0x4b && bytes[2] === 0x03 && bytes[3] === 0x04) return 'xlsx';
  if (bytes.includes(0)) return 'unknown';
  const text = decodeText(bytes.subarray(0, 4096));
  if (/^\s*\{/.test(text)) return 'json';
  // Text with a control character other than tab, CR or LF (or a decoding failure) is some binary file.
  return /[\u0001-\u0008\u000b\u000c\u000e-\u001f\ufffd]/.test(text) ? 'unknown' : 'csv';
}

/** UTF-8 (with or without BOM); a file that is not UTF-8 is read as Windows-1252, as older spreadsheets save CSV. */
function decodeText(bytes: Uint8Array): string {
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes).replace(/^\uFEFF/, '');
  } catch {
    return new TextDecoder('windows-1252').decode(bytes);
  }
}

function megabytes(bytes: number): string {
  return (bytes / 1024 / 1024).toFixed(1);
}
