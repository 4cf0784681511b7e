import { randomUUID } from 'node:crypto';
import type { ComparisonBrief, OptionBrief } from '@seinework/contracts';
import { comments } from '../db/schema';
import { createOption, forageCut, gillnetClosure, publishedBaseline, userId, type Baseline } from '../options/test-options';
import { createTestApp, type TestAgent, type TestApp } from '../testing/test-app';
import { formatNumber } from './brief-words';
import { pdfText } from './pdf-text';

let t: TestApp;
let baseline: Baseline;
let forage: string;
let gillnet: string;
let forageRun: string;
let gillnetRun: string;
let staff: TestAgent;

/** A body-less binary answer (supertest leaves PDFs unparsed otherwise). */
const binary = (agent: TestAgent, url: string) =>
  agent
    .get(url)
    .buffer(true)
    .parse((response, done) => {
      const chunks: Buffer[] = [];
      response.on('data', (chunk: Buffer) => chunks.push(chunk));
      response.on('end', () => done(null, Buffer.concat(chunks)));
    });

async function finishedRun(optionId: string, body: object): Promise<string> {
  const started = await baseline.analyst.post(`/api/options/${optionId}/runs`).send(body);
  expect(started.status).toBe(202);
  await t.runQueue.drain();
  return started.body.id as string;
}

beforeAll(async () => {
  t = await createTestApp();
  baseline = await publishedBaseline(t);
  forage = await createOption(baseline, { ...forageCut, purpose: 'Leave more forage fish for the predators and seabirds.' });
  gillnet = await createOption(baseline, gillnetClosure);
  forageRun = await finishedRun(forage, { draws: 24, cv: 0.2, seed: 7 });
  gillnetRun = await finishedRun(gillnet, { draws: 24, cv: 0.2, seed: 7 });
  for (const id of [forage, gillnet]) expect((await baseline.analyst.post(`/api/options/${id}/shares`).send({ audience: 'council' })).status).toBe(201);
  const council = await t.signInAs('council');
  expect((await council.post(`/api/options/${forage}/preferences`).send({ reason: 'The seabirds need the forage fish.', comparedRuns: [forageRun, gillnetRun] })).status).toBe(201);
  // the discussion: two shown comments and a reply, one hidden comment; two point at an indicator
  const author = await userId(t.database.db, 'stakeholder');
  const first = randomUUID();
  const anchor = { kind: 'indicator' as const, key: 'totalCatch' };
  await t.database.db.insert(comments).values([
    { id: first, optionId: forage, authorId: author, text: 'What does this do to our landings?', anchor },
    { id: randomUUID(), optionId: forage, authorId: author, parentId: first, text: 'And to the price?', anchor },
    { id: randomUUID(), optionId: forage, authorId: author, text: 'A general remark.' },
    { id: randomUUID(), optionId: forage, authorId: author, text: 'Rude words', anchor, hiddenAt: new Date(), hiddenBy: await userId(t.database.db, 'staff'), hiddenReason: 'abusive' },
  ]);
  staff = await t.signInAs('staff');
}, 180_000);
afterAll(() => t.close());

describe('the brief of an option', () => {
  it('is a PDF with the option, its indicators before and after, the record and the caution', async () => {
    const response = await binary(staff, `/api/options/${forage}/brief.pdf`);
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('application/pdf');
    expect(response.headers['content-disposition']).toMatch(/^attachment; filename="brief-cut-the-forage-fish-quota-by-40-[0-9a-f]{8}\.pdf"$/);
    const bytes = response.body as Buffer;
    expect(bytes.subarray(0, 5).toString()).toBe('%PDF-');
    const brief = (await staff.get(`/api/options/${forage}/brief`)).body as OptionBrief;
    expect(brief.run.id).toBe(forageRun);
    const { text, pages } = await pdfText(bytes);
    expect(pages.length).toBeGreaterThanOrEqual(2);
    expect(text).toContain('Cut the forage-fish quota by 40 %');
    expect(text).toContain('Leave more forage fish for the predators and seabirds.');
    expect(text).toContain('Cut the Purse seine catch of Small pelagic forage fish by 40 %.');
    expect(text).toContain(forageRun);
    expect(text).toContain('seed 7');
    for (const key of ['relativeAscendency', 'totalCatch', 'meanTrophicLevelOfCatch']) {
      const row = brief.indicators.find((i) => i.key === key)!;
      expect(text).toContain(row.label);
      expect(text).toContain(formatNumber(row.baseline));
      expect(text).toContain(formatNumber(row.option));
    }
    expect(text).toContain('Steady-state network results are indicative, carry data uncertainty');
    expect(text).toContain('The seabirds need the forage fish.');
    expect(text).toContain('3 comments on this option (1 of them a reply)');
    expect(text).toContain('Total catch (indicator) 2');
    expect(text).not.toContain('Rude words');
    expect(text).toContain('Where the web sits on the fitness curve');
    expect(text).toContain('Page 1 of');
  });

  it('carries the charts as vector shapes, the ten largest changes in dependence and each fleet', async () => {
    const brief = (await staff.get(`/api/options/${forage}/brief`)).body as OptionBrief;
    expect(brief.fitnessCurve.shapes.some((s) => s.kind === 'polyline')).toBe(true);
    // each web once on the curve and once in the legend
    expect(brief.fitnessCurve.shapes.filter((s) => s.kind === 'circle')).toHaveLength(4);
    expect(brief.trophicLadder.shapes.filter((s) => s.kind === 'circle').length).toBeGreaterThanOrEqual(6);
    expect(brief.dependence).toHaveLength(10);
    const sizes = brief.dependence.map((d) => Math.abs(d.change));
    expect([...sizes].sort((a, b) => b - a)).toEqual(sizes);
    const purse = brief.fleets.find((f) => f.fleet === 'Purse seine')!;
    expect(purse.catchAfter).toBeCloseTo(purse.catchBefore * 0.6, 9);
    expect(purse.impacts).toHaveLength(brief.mainCompartments.length);
    expect(brief.indicators.find((i) => i.key === 'totalCatch')!.band).not.toBeNull();
    expect(brief.comments).toEqual({ total: 3, replies: 1, byAnchor: [{ kind: 'indicator', key: 'totalCatch', label: 'Total catch', count: 2 }] });
  });

  it('gives the same bytes for the same run, dated by the run', async () => {
    const a = await binary(staff, `/api/options/${forage}/brief.pdf?run=${forageRun}`);
    const again = await binary(await t.signInAs('analyst'), `/api/options/${forage}/brief.pdf`);
    expect(Buffer.compare(a.body as Buffer, again.body as Buffer)).toBe(0);
    const brief = (await staff.get(`/api/options/${forage}/brief`)).body as OptionBrief;
    const { info } = await pdfText(a.body as Buffer);
    const stamp = new Date(brief.run.finishedAt).toISOString().replace(/[-:T]/g, '').slice(0, 14);
    expect(String(info['CreationDate'])).toContain(stamp);
  });

  it('is for analysts, staff and admins (council and stakeholders 403, signed out 401)', async () => {
    for (const role of ['analyst', 'staff', 'admin'] as const) expect((await binary(await t.signInAs(role), `/api/options/${forage}/brief.pdf`)).status).toBe(200);
    for (const role of ['council', 'stakeholder'] as const) expect((await (await t.signInAs(role)).get(`/api/options/${forage}/brief.pdf`)).status).toBe(403);
    expect((await t.anonymous().get(`/api/options/${forage}/brief.pdf`)).status).toBe(401);
  });

  it('answers 404 for an option the reader may not see, 409 without a finished run, 404 for a run of another option', async () => {
    const unshared = await createOption(baseline, { ...forageCut, name: 'Not shared' });
    expect((await staff.get(`/api/options/${unshared}/brief.pdf`)).status).toBe(404);
    expect((await staff.get('/api/options/no-such-option/brief.pdf')).status).toBe(404);
    const refused = await baseline.analyst.get(`/api/options/${unshared}/brief.pdf`);
    expect(refused.status).toBe(409);
    expect(refused.body.error).toMatch(/no finished run/);
    expect((await staff.get(`/api/options/${forage}/brief.pdf?run=${gillnetRun}`)).status).toBe(404);
    expect((await staff.get(`/api/options/${forage}/brief.pdf?colour=red`)).status).toBe(400);
  });

  it('without ?run= is about the run the option is shared with, else its latest finished run', async () => {
    const option = await createOption(baseline, { ...forageCut, name: 'Shared with its first run' });
    const first = await finishedRun(option, { draws: 0, seed: 1 });
    const second = await finishedRun(option, { draws: 0, seed: 2 });
    const shared = await baseline.analyst.post(`/api/options/${option}/shares`).send({ audience: 'council', runId: first });
    expect(shared.status).toBe(201);
    expect(((await staff.get(`/api/options/${option}/brief`)).body as OptionBrief).run.id).toBe(first);
    expect((await baseline.analyst.delete(`/api/shares/${shared.body.id}`)).status).toBe(204);
    expect(((await baseline.analyst.get(`/api/options/${option}/brief`)).body as OptionBrief).run.id).toBe(second);
  });
});

describe('the brief of a comparison', () => {
  it('is a PDF with the compared options, the indicators side by side, the preferences and the caution', async () => {
    const url = `/api/comparisons/brief.pdf?runs=${forageRun},${gillnetRun}`;
    const response = await binary(staff, url);
    expect(response.status).toBe(200);
    expect(response.headers['content-type']).toBe('application/pdf');
    expect(response.headers['content-disposition']).toMatch(/^attachment; filename="comparison-[a-z0-9-]+\.pdf"$/);
    const brief = (await staff.get(`/api/comparisons/brief?runs=${forageRun},${gillnetRun}`)).body as ComparisonBrief;
    expect(brief.options.map((o) => o.optionName)).toEqual([forageCut.name, gillnetClosure.name]);
    const { text } = await pdfText(response.body as Buffer);
    expect(text).toContain(`A. ${forageCut.name}`);
    expect(text).toContain(`B. ${gillnetClosure.name}`);
    expect(text).toContain('Indicators side by side');
    const catchRow = brief.indicators.find((i) => i.key === 'totalCatch')!;
    expect(text).toContain(formatNumber(catchRow.baseline));
    expect(text).toContain('The seabirds need the forage fish.');
    expect(text).toContain('Steady-state network results are indicative');
    expect(brief.fitnessCurve.shapes.filter((s) => s.kind === 'circle')).toHaveLength(6);
    expect(Buffer.compare(response.body as Buffer, (await binary(staff, url)).body as Buffer)).toBe(0);
  });

  it('refuses a bad list of runs as GET /api/comparisons does', async () => {
    expect((await staff.get(`/api/comparisons/brief.pdf?runs=${forageRun}`)).status).toBe(400);
    expect((await staff.get(`/api/comparisons/brief.pdf?runs=${forageRun},${forageRun}`)).status).toBe(400);
    expect((await staff.get(`/api/comparisons/brief.pdf?runs=${Array.from({ length: 7 }, (_, k) => `r${k}`).join(',')}`)).status).toBe(400);
    expect((await staff.get('/api/comparisons/brief.pdf')).status).toBe(400);
    expect((await staff.get(`/api/comparisons/brief.pdf?runs=${forageRun},no-such-run`)).status).toBe(404);
    expect((await (await t.signInAs('council')).get(`/api/comparisons/brief.pdf?runs=${forageRun},${gillnetRun}`)).status).toBe(403);
  });
});
