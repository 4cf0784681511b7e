import { randomUUID } from 'node:crypto';
import { and, eq, isNull } from 'drizzle-orm';
import type { CommentAnchor, Role } from '@seinework/contracts';
import { recordAudit } from '../audit/audit-log';
import { hashPassword } from '../auth/passwords';
import type { Db } from '../db/database';
import { comments, follows, shares, users } from '../db/schema';
import { DEMO_PASSWORD, DEMO_EMAIL_DOMAIN, demoEmail } from './demo-users';

/**
 * The demo's public comment (invented people, invented words): three stakeholder accounts with
 * clearly invented names (demo accounts like the others: the password of the README, refused at
 * sign-in and never seeded in production), a short discussion of the option open for public
 * comment, a reply by the demo analyst, and one comment hidden by the demo staff member with a reason.
 */

export interface DemoPerson {
  readonly email: string;
  readonly name: string;
  readonly role: Role;
}

export const DEMO_DISCUSSION_USERS: readonly DemoPerson[] = [
  { email: `tamsin.vellacott${DEMO_EMAIL_DOMAIN}`, name: 'Tamsin Vellacott (demo)', role: 'stakeholder' },
  { email: `orrin.blakewell${DEMO_EMAIL_DOMAIN}`, name: 'Orrin Blakewell (demo)', role: 'stakeholder' },
  { email: `maelis.trego${DEMO_EMAIL_DOMAIN}`, name: 'Maelis Trego (demo)', role: 'stakeholder' },
];

interface DemoComment {
  readonly key: string;
  readonly by: string;
  readonly text: string;
  readonly replyTo?: string;
  readonly anchor?: CommentAnchor;
  /** Hidden by the demo staff member, with this reason. */
  readonly hiddenReason?: string;
}

const DISCUSSION: readonly DemoComment[] = [
  {
    key: 'skipper',
    by: 'tamsin.vellacott',
    text: 'I take day boats out to the headland. The seabirds and the bass follow the sprat shoals in, and in the lean years both stay offshore. Leaving more forage fish in the bay sounds right to me.',
    anchor: { kind: 'compartment', key: 'seabirds' },
  },
  {
    key: 'crew',
    by: 'orrin.blakewell',
    text: 'Forty per cent off the purse-seine quota is forty per cent off our wages in one season. Could the cut come in steps, say ten per cent a year, so the crews can plan?',
    anchor: { kind: 'indicator', key: 'totalCatch' },
  },
  {
    key: 'answer',
    by: 'analyst',
    replyTo: 'crew',
    text: 'A fair question. This run compares the bay with the full cut in place against today; it says nothing about the years in between. A stepped cut would be a few options, one per step, and we can prepare them if the council asks for it.',
  },
  {
    key: 'quay',
    by: 'maelis.trego',
    text: 'Everyone on the quay knows which skipper has been landing over his quota for years. Deal with him first.',
    hiddenReason: 'Accuses a private person who can be recognised; please comment on the option, not on people.',
  },
  {
    key: 'survey',
    by: 'maelis.trego',
    text: 'The colony count on the north cliffs has fallen three summers running. Will the council see how the forage-fish compartment changes under this option, not only the total catch?',
    anchor: { kind: 'compartment', key: 'forage-fish' },
  },
];

/** Stores the demo discussion on the option open for public comment (seed/demo-options.ts must have run). */
export async function seedDemoDiscussion(db: Db): Promise<void> {
  const [share] = await db
    .select()
    .from(shares)
    .where(and(eq(shares.audience, 'public'), isNull(shares.withdrawnAt)));
  const [analyst] = await db.select({ id: users.id }).from(users).where(eq(users.email, demoEmail('analyst')));
  const [staff] = await db.select({ id: users.id }).from(users).where(eq(users.email, demoEmail('staff')));
  if (!share || !analyst || !staff) throw new Error('The demo users and the option open for public comment must be seeded before its discussion');
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const people = new Map<string, string>([['analyst', analyst.id]]);
  for (const person of DEMO_DISCUSSION_USERS) {
    const id = randomUUID();
    await db.insert(users).values({ id, email: person.email, name: person.name, role: person.role, passwordHash });
    await recordAudit(db, { actorId: null, action: 'user.created', subject: `user:${id}`, detail: `Demo account ${person.email} (${person.role})` });
    people.set(person.email.slice(0, -DEMO_EMAIL_DOMAIN.length), id);
  }
  const ids = new Map<string, string>();
  // a second apart, after the share (never in the future of a reader who opens it at once): one transaction would give every row the same now()
  const start = share.sharedAt.getTime();
  for (const [position, demo] of DISCUSSION.entries()) {
    const id = randomUUID();
    ids.set(demo.key, id);
    const authorId = people.get(demo.by)!;
    const createdAt = new Date(start + (position + 1) * 1000);
    await db.insert(comments).values({
      id,
      optionId: share.optionId,
      shareId: share.id,
      parentId: demo.replyTo ? ids.get(demo.replyTo)! : null,
      authorId,
      text: demo.text,
      anchor: demo.anchor ?? null,
      createdAt,
      ...(demo.hiddenReason ? { hiddenAt: createdAt, hiddenBy: staff.id, hiddenReason: demo.hiddenReason } : {}),
    });
    await db.insert(follows).values({ optionId: share.optionId, userId: authorId }).onConflictDoNothing();
    await recordAudit(db, { actorId: authorId, action: 'comment.posted', subject: `comment:${id}`, detail: 'Demo comment (public comment)' });
    if (demo.hiddenReason) await recordAudit(db, { actorId: staff.id, action: 'comment.hidden', subject: `comment:${id}`, detail: `Demo comment hidden. Reason: ${demo.hiddenReason}` });
  }
}
