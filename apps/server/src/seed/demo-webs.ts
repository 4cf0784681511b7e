import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { eq } from 'drizzle-orm';
import type { CurrentUser } from '@seinework/contracts';
import type { Db } from '../db/database';
import { users } from '../db/schema';
import { checkedWeb, WebService } from '../webs/web-service';
import { demoEmail } from './demo-users';

/** The demo baseline of seeds/ (invented data), published as version 1 by the demo analyst. */
export const DEMO_WEB_PATH = resolve(import.meta.dirname, '../../../../seeds/brannock-bay.json');
export const DEMO_WEB_PLACE = 'Brannock Bay (invented)';
export const DEMO_WEB_PERIOD = '2019–2023 average';

/** Creates the demo web with its published baseline; the demo users must exist. */
export async function seedDemoWebs(db: Db, webPath = DEMO_WEB_PATH): Promise<void> {
  const [analyst] = await db.select().from(users).where(eq(users.email, demoEmail('analyst')));
  if (!analyst) throw new Error('The demo analyst must be seeded before the demo web');
  const user: CurrentUser = { id: analyst.id, email: analyst.email, name: analyst.name, role: analyst.role };
  const web = checkedWeb(JSON.parse(readFileSync(webPath, 'utf8')));
  const service = new WebService(db);
  const { id, versionId } = await service.create(user, { web, place: DEMO_WEB_PLACE, period: DEMO_WEB_PERIOD, note: 'Demo baseline (invented data)' });
  await service.publish(user, id, versionId);
}
