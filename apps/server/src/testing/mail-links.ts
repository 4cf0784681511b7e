import type { OutboxMessage, Page } from '@seinework/contracts';
import type { TestAgent } from './test-app';

/** Reading e-mail back in tests: through the admin outbox API, as an administrator would. */

/** The outbox once it holds at least `count` messages (mail may still be on its way when a route answers). */
export async function waitForOutbox(admin: TestAgent, count: number, timeoutMs = 15_000): Promise<Page<OutboxMessage>> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const response = await admin.get('/api/admin/outbox').query({ pageSize: 200 });
    if (response.status !== 200) throw new Error(`GET /api/admin/outbox answered ${response.status}: ${JSON.stringify(response.body)}`);
    const page = response.body as Page<OutboxMessage>;
    // items, not total: on PostgreSQL the count and the page are two queries a new message can fall between
    if (page.items.length >= count) return page;
    if (Date.now() > deadline) throw new Error(`The outbox holds ${page.items.length} messages after ${timeoutMs} ms, expected ${count}`);
    await new Promise((resolve) => setTimeout(resolve, 25));
  }
}

/** The token of the first `<origin>/<path>/<token>` link in a message's text. */
export function linkToken(message: OutboxMessage, origin: string, path: 'invitation' | 'reset-password'): string {
  const escaped = `${origin}/${path}/`.replace(/[.*+?^${}()|[\]\\/]/g, '\\$&');
  const match = new RegExp(`${escaped}([A-Za-z0-9_-]+)`).exec(message.text);
  if (!match) throw new Error(`No ${path} link in the message "${message.subject}" to ${message.to}`);
  return match[1]!;
}
