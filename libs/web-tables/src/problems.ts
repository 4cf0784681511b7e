import type { UploadProblem } from '@seinework/contracts';

/** Collects the problems of an upload in the order they are found. */
export class ProblemList {
  readonly items: UploadProblem[] = [];

  add(table: string, row: number | null, column: string | null, problem: string): void {
    this.items.push({ table, row, column, problem });
  }

  get empty(): boolean {
    return this.items.length === 0;
  }
}
