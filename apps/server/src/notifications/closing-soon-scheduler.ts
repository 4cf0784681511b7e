import type { Notifications } from './notification-service';

/**
 * Looks for public comment periods closing within a day: once at start, then every hour (the
 * timer is unref'd, so it never keeps the process alive; main.ts stops it when the server closes).
 * `runOnce` is what each tick does, for tests.
 */

export const CLOSING_SOON_INTERVAL_MS = 60 * 60 * 1000;

export interface ClosingSoonScheduler {
  start(): void;
  stop(): void;
  runOnce(now?: Date): Promise<number>;
}

export function closingSoonScheduler(notifications: Notifications, intervalMs = CLOSING_SOON_INTERVAL_MS, log: (message: string) => void = (m) => console.error(m)): ClosingSoonScheduler {
  let timer: NodeJS.Timeout | undefined;
  const tick = () => {
    notifications.closingSoon().catch((error: unknown) => log(`Closing-soon notices: ${error instanceof Error ? error.message : String(error)}`));
  };
  return {
    start() {
      if (timer) return;
      tick();
      timer = setInterval(tick, intervalMs);
      timer.unref();
    },
    stop() {
      if (timer) clearInterval(timer);
      timer = undefined;
    },
    runOnce: (now) => notifications.closingSoon(now),
  };
}
