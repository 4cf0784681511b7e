/** A compared run as the comparison's parts show it: its letter (A, B, …) and its option. */
export interface ComparedRun {
  readonly runId: string;
  readonly letter: string;
  readonly optionId: string;
  readonly optionName: string;
}
