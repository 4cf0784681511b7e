import type { APIRequestContext } from '@playwright/test';
import type { OutboxMessage, Page } from '@seinework/contracts';
import { DEMO_PASSWORD, demoEmail } from './fixtures';

/** Signs a request context in as the demo admin, so it may read the outbox. */
export async function asAdmin(request: APIRequestContext): Promise<APIRequestContext> {
  const response = await request.post('/api/auth/sign-in', { data: { email: demoEmail('admin'), password: DEMO_PASSWORD } });
  if (!response.ok()) throw new Error(`the demo admin could not sign in: ${response.status()} ${await response.text()}`);
  return request;
}

/**
 * The newest message to an address whose text carries a link to `path` (/invitation/ or
 * /reset-password/), read back through GET /api/admin/outbox; mail goes through SMTP to the local
 * catcher, so it may take a moment to arrive.
 */
export async function linkFromOutbox(admin: APIRequestContext, to: string, path: string): Promise<{ message: OutboxMessage; link: string }> {
  const pattern = new RegExp(`https?://[^\\s<>"]+${path.replace(/\//g, '\\/')}[A-Za-z0-9_-]+`);
  const deadline = Date.now() + 15_000;
  while (Date.now() < deadline) {
    const response = await admin.get('/api/admin/outbox', { params: { page: 1, pageSize: 50 } });
    if (!response.ok()) throw new Error(`GET /api/admin/outbox answered ${response.status()}: ${await response.text()}`);
    const outbox = (await response.json()) as Page<OutboxMessage>;
    for (const message of outbox.items) {
      const link = message.to.toLowerCase().includes(to.toLowerCase()) ? pattern.exec(message.text)?.[0] : undefined;
      if (link) return { message, link };
    }
    await new Promise((wait) => setTimeout(wait, 250));
  }
  throw new Error(`no message to ${to} with a ${path} link arrived in the outbox`);
}
