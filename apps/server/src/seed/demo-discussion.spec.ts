import type { CommentPage, DiscussionSummary } from '@seinework/contracts';
import { createTestApp, TEST_ORIGIN, type TestApp } from '../testing/test-app';
import request from 'supertest';
import { DEMO_DISCUSSION_USERS, seedDemoDiscussion } from './demo-discussion';
import { DEMO_PUBLIC_COMMENT_DAYS, seedDemoOptions } from './demo-options';
import { DEMO_PASSWORD } from './demo-users';
import { seedDemoWebs } from './demo-webs';

let t: TestApp;
afterEach(() => t.close());

const FEW_DRAWS = { draws: 12, cv: 0.25, seed: 20261202 };

async function seeded(overrides: Parameters<typeof createTestApp>[0] = {}): Promise<TestApp> {
  t = await createTestApp(overrides);
  // the demo users are in the test database already; the rest in one transaction, as seedDemo does
  await t.database.db.transaction(async (tx) => {
    await seedDemoWebs(tx);
    await seedDemoOptions(tx, FEW_DRAWS);
    await seedDemoDiscussion(tx);
  });
  return t;
}

async function signIn(email: string) {
  const agent = request.agent(t.app).set('Origin', TEST_ORIGIN);
  const response = await agent.post('/api/auth/sign-in').send({ email, password: DEMO_PASSWORD });
  return { agent, status: response.status };
}

describe('the demo discussion', () => {
  it('opens the forage-fish cut for public comment for 30 days, with invented stakeholders, an analyst reply and one comment hidden by staff', async () => {
    await seeded();
    const [tamsin, , maelis] = DEMO_DISCUSSION_USERS;
    const { agent, status } = await signIn(tamsin!.email);
    expect(status).toBe(200);
    const discussions = (await agent.get('/api/discussions')).body.items as DiscussionSummary[];
    expect(discussions).toHaveLength(1);
    const [discussion] = discussions;
    expect(discussion).toMatchObject({ optionName: 'Cut the forage-fish quota by 40 %', audience: 'public', open: true, comments: 5 });
    const days = (Date.parse(discussion!.closesAt!) - Date.parse(discussion!.sharedAt)) / 86_400_000;
    expect(days).toBeCloseTo(DEMO_PUBLIC_COMMENT_DAYS, 3);

    const page = (await agent.get(`/api/options/${discussion!.optionId}/comments`)).body as CommentPage;
    expect(page.items.map((c) => c.author.name)).toEqual(['Tamsin Vellacott (demo)', 'Orrin Blakewell (demo)', 'Ana Demo (analyst)', 'Maelis Trego (demo)', 'Maelis Trego (demo)']);
    const [, crew, answer, quay] = page.items;
    expect(answer!.parentId).toBe(crew!.id);
    expect(quay).toMatchObject({ hidden: true, text: null, hiddenReason: null });
    expect(page.items.filter((c) => c.hidden)).toHaveLength(1);
    expect(page.discussion).toMatchObject({ open: true, following: true, audience: 'public' });

    const author = (await signIn(maelis!.email)).agent;
    const own = ((await author.get(`/api/options/${discussion!.optionId}/comments`)).body as CommentPage).items[3];
    expect(own).toMatchObject({ hidden: true, text: expect.stringContaining('quay'), hiddenReason: expect.stringContaining('private person') });

    // the demo stakeholder and council member read it too; the council's three options stay as they were
    const sten = await t.signInAs('stakeholder');
    expect(((await sten.get(`/api/options/${discussion!.optionId}/comments`)).body as CommentPage).total).toBe(5);
    const council = await t.signInAs('council');
    const councilDiscussions = (await council.get('/api/discussions')).body.items as DiscussionSummary[];
    expect(councilDiscussions.filter((d) => d.audience === 'council')).toHaveLength(3);
    expect(councilDiscussions.filter((d) => d.audience === 'public')).toHaveLength(1);
  }, 120_000);

  it('keeps its invented stakeholders out in production, like every demo account', async () => {
    await seeded({ demoMode: false });
    for (const person of DEMO_DISCUSSION_USERS) expect((await signIn(person.email)).status).toBe(401);
  }, 120_000);
});
