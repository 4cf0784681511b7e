import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import type { OptionSummary, PreferenceSummary, WebDetail, WebSummary } from '@seinework/contracts';
import { CompareStore } from './compare-store';
import { COMPARISON } from './test-comparison';

const webSummary: WebSummary = {
  id: 'w1',
  name: 'Test bay',
  place: 'North shore',
  period: '2020',
  unit: 'g C m-2 y-1',
  latestVersion: { id: 'v3', number: 3, status: 'draft', createdAt: '2026-03-03T00:00:00Z' },
  published: { id: 'v2', number: 2, publishedBy: 'Ana Lyst', publishedAt: '2026-03-02T00:00:00Z' },
  updatedAt: '2026-03-03T00:00:00Z',
};

const version = (id: string, number: number, status: 'draft' | 'published') => ({
  id,
  number,
  status,
  note: '',
  createdBy: 'Ana Lyst',
  createdAt: '2026-03-01T10:00:00Z',
  publishedBy: null,
  publishedAt: null,
  basedOn: null,
});

const webDetail: WebDetail = {
  id: 'w1',
  name: 'Test bay',
  place: 'North shore',
  period: '2020',
  unit: 'g C m-2 y-1',
  createdBy: 'Ana Lyst',
  createdAt: '2026-03-01T10:00:00Z',
  versions: [version('v3', 3, 'draft'), version('v2', 2, 'published'), version('v1', 1, 'published')],
};

function option(id: string, runId: string, status: 'done' | 'running'): OptionSummary {
  const run = COMPARISON.runs[0];
  return {
    id,
    webId: 'w1',
    versionId: 'v2',
    name: `Option ${id}`,
    purpose: '',
    response: 'bottom-up',
    adjustments: 1,
    frozen: true,
    createdBy: 'Ana Lyst',
    createdAt: '2026-03-01T10:00:00Z',
    latestRun: { ...run, id: runId, optionId: id, status },
    shares: [],
  };
}

describe('CompareStore', () => {
  let store: InstanceType<typeof CompareStore>;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [CompareStore, provideHttpClient(), provideHttpClientTesting()] });
    store = TestBed.inject(CompareStore);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  const settle = () => new Promise((resolve) => setTimeout(resolve));

  it('with one published web, opens it on its newest published version and lists its options', async () => {
    const loading = store.loadWebs();
    http.expectOne((r) => r.url === '/api/webs').flush({ items: [webSummary, { ...webSummary, id: 'w2', published: null }], total: 2 });
    await settle();
    expect(store.webs().map((w) => w.id)).toEqual(['w1']);
    http.expectOne('/api/webs/w1').flush(webDetail);
    await settle();
    expect(store.publishedVersions().map((v) => v.id)).toEqual(['v2', 'v1']);
    http.expectOne('/api/webs/w1/versions/v2/options').flush({ items: [option('o1', 'r1', 'done'), option('o2', 'r2', 'running')], total: 2 });
    await loading;
    expect(store.versionId()).toBe('v2');
    expect(store.options()).toHaveLength(2);
    expect(store.notReady()).toBe(1);
  });

  it('ticks two to six runs, no more', () => {
    expect(store.canCompare()).toBe(false);
    for (const id of ['a', 'b']) store.togglePick(id);
    expect(store.canCompare()).toBe(true);
    for (const id of ['c', 'd', 'e', 'f', 'g']) store.togglePick(id);
    expect(store.picked()).toEqual(['a', 'b', 'c', 'd', 'e', 'f']);
    store.togglePick('a');
    expect(store.picked()).toEqual(['b', 'c', 'd', 'e', 'f']);
  });

  it('loads the comparison the URL names, and the web it stands on', async () => {
    const comparing = store.compare(['r1', 'r2']);
    expect(store.loading()).toBe(true);
    const request = http.expectOne((r) => r.url === '/api/comparisons');
    expect(request.request.params.get('runs')).toBe('r1,r2');
    request.flush(COMPARISON);
    await settle();
    http.expectOne('/api/webs/w1').flush(webDetail);
    await comparing;
    expect(store.loading()).toBe(false);
    expect(store.comparison()!.runs.map((r) => r.optionName)).toEqual(['Cut the forage-fish quota', 'Close the gillnets']);
    expect(store.comparedWeb()!.name).toBe('Test bay');
    expect(store.picked()).toEqual(['r1', 'r2']);
  });

  it("says why runs cannot be compared, in the server's words", async () => {
    const comparing = store.compare(['r1', 'r9']);
    http
      .expectOne((r) => r.url === '/api/comparisons')
      .flush(
        { error: 'Compared runs must stand on one baseline (one published version)', details: ['run r9 ("Other") is on version v1'] },
        { status: 422, statusText: 'Unprocessable Entity' },
      );
    await comparing;
    expect(store.error()).toBe('These runs could not be compared: Compared runs must stand on one baseline (one published version): run r9 ("Other") is on version v1');
    expect(store.comparison()).toBeNull();
  });

  async function compared(): Promise<void> {
    const comparing = store.compare(['r1', 'r2']);
    http.expectOne((r) => r.url === '/api/comparisons').flush(COMPARISON);
    await settle();
    http.expectOne('/api/webs/w1').flush(webDetail);
    await comparing;
  }

  it('records a preference with the compared runs and shows the list as the server now has it', async () => {
    await compared();
    const recording = store.recordPreference('o2', 'Fewer seabirds caught.');
    expect(store.recording()).toBe(true);
    const post = http.expectOne('/api/options/o2/preferences');
    expect(post.request.method).toBe('POST');
    expect(post.request.body).toEqual({ reason: 'Fewer seabirds caught.', comparedRuns: ['r1', 'r2'] });
    post.flush({ id: 'p1' }, { status: 201, statusText: 'Created' });
    await settle();
    const preference: PreferenceSummary = { id: 'p1', optionId: 'o2', optionName: 'Close the gillnets', member: 'Cole', reason: 'Fewer seabirds caught.', createdAt: '2026-03-04T10:00:00Z' };
    http.expectOne((r) => r.url === '/api/comparisons').flush({ ...COMPARISON, preferences: [preference] });
    expect(await recording).toBe(true);
    expect(store.comparison()!.preferences).toEqual([preference]);
    expect(store.recording()).toBe(false);
    expect(store.recordedOptionId()).toBe('o2');
    expect(store.recordError()).toBeNull();
  });

  it('shows a refused preference readably and keeps the comparison', async () => {
    await compared();
    const recording = store.recordPreference('o1', 'x');
    http
      .expectOne('/api/options/o1/preferences')
      .flush({ error: 'This option is not shared for council review: preferences are recorded on shared options only' }, { status: 409, statusText: 'Conflict' });
    expect(await recording).toBe(false);
    expect(store.recordError()).toBe('Your preference was not recorded: This option is not shared for council review: preferences are recorded on shared options only');
    expect(store.recordedOptionId()).toBeNull();
    expect(store.comparison()).not.toBeNull();
  });
});
