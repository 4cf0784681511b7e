/**
 * Notices go out after the change that caused them is committed, one after another, off the
 * request: the request answers at once, and a mail server that is slow or down delays or loses the
 * notice, never the change (a failure is logged and the queue goes on).
 */
export class NoticeQueue {
  private tail: Promise<void> = Promise.resolve();
  private pending = 0;

  constructor(private readonly log: (message: string) => void = (message) => console.error(message)) {}

  /** Queues a task (which may send several messages); never throws. */
  add(what: string, task: () => Promise<void>): void {
    this.pending++;
    this.tail = this.tail
      .then(task)
      .catch((error: unknown) => this.log(`Notice not sent (${what}): ${error instanceof Error ? error.message : String(error)}`))
      .finally(() => {
        this.pending--;
      });
  }

  /** Resolves once every task queued so far has run (tests, and a clean stop). */
  async idle(): Promise<void> {
    while (this.pending > 0) await this.tail;
  }
}
