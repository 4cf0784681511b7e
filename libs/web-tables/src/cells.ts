import type { Cell } from './raw-table';
import type { ProblemList } from './problems';

/**
 * Reading one cell as text or as a number, reporting what is wrong against its row and column.
 * Text written by our CSV export starts with ' where it would otherwise read as a spreadsheet
 * formula (=, +, -, @); that guard is taken off again here.
 */

const FORMULA_GUARD = /^'(?=[=+\-@\t\r])/;

export function cellText(cell: Cell | undefined): string | undefined {
  if (cell === null || cell === undefined) return undefined;
  const text = String(cell).trim().replace(FORMULA_GUARD, '');
  return text === '' ? undefined : text;
}

export interface CellAt {
  readonly table: string;
  readonly row: number;
  readonly column: string;
}

/** A non-negative finite number, or undefined when empty; problems go to the list. */
export function cellNumber(cell: Cell | undefined, at: CellAt, problems: ProblemList): number | undefined | 'invalid' {
  if (cell === null || cell === undefined) return undefined;
  let value: number;
  if (typeof cell === 'number') value = cell;
  else {
    const text = cellText(cell);
    if (text === undefined) return undefined;
    value = /^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(text) ? Number(text) : Number.NaN;
    if (Number.isNaN(value)) {
      problems.add(at.table, at.row, at.column, `"${text}" is not a number`);
      return 'invalid';
    }
  }
  if (!Number.isFinite(value)) {
    problems.add(at.table, at.row, at.column, `${value} is not a finite number`);
    return 'invalid';
  }
  if (value < 0) {
    problems.add(at.table, at.row, at.column, `${at.column} must not be negative (got ${value})`);
    return 'invalid';
  }
  return value === 0 ? 0 : value;
}
