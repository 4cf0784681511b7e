import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import type { Page, WebSummary } from '@seinework/contracts';
import { WebListStore } from './web-list-store';

function summary(id: string, name: string): WebSummary {
  return {
    id,
    name,
    place: 'Test bay',
    period: '2020',
    unit: 'g C m-2 y-1',
    latestVersion: { id: `${id}-v1`, number: 1, status: 'draft', createdAt: '2026-01-01T00:00:00Z' },
    published: null,
    updatedAt: '2026-01-01T00:00:00Z',
  };
}

describe('WebListStore', () => {
  let store: InstanceType<typeof WebListStore>;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [WebListStore, provideHttpClient(), provideHttpClientTesting()] });
    store = TestBed.inject(WebListStore);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('asks the server for the first page, newest change first, and holds what it answers', async () => {
    const loading = store.load();
    expect(store.loading()).toBe(true);
    const request = http.expectOne((r) => r.url === '/api/webs');
    expect(request.request.params.toString()).toBe('page=1&pageSize=20&sort=updatedAt&direction=desc');
    request.flush({ items: [summary('a', 'Alpha')], total: 41 } satisfies Page<WebSummary>);
    await loading;
    expect(store.loading()).toBe(false);
    expect(store.items().map((w) => w.name)).toEqual(['Alpha']);
    expect(store.total()).toBe(41);
  });

  it('sorts and filters on the server and goes back to the first page', async () => {
    const paging = store.showPage(3, 10);
    http.expectOne((r) => r.params.get('page') === '3' && r.params.get('pageSize') === '10').flush({ items: [], total: 41 });
    await paging;

    const sorting = store.sortBy('name', 'asc');
    const sorted = http.expectOne((r) => r.url === '/api/webs');
    expect(sorted.request.params.toString()).toBe('page=1&pageSize=10&sort=name&direction=asc');
    sorted.flush({ items: [], total: 41 });
    await sorting;

    const filtering = store.filterBy('  bay ');
    const filtered = http.expectOne((r) => r.url === '/api/webs');
    expect(filtered.request.params.get('filter')).toBe('bay');
    expect(filtered.request.params.get('page')).toBe('1');
    filtered.flush({ items: [summary('b', 'Bay web')], total: 1 });
    await filtering;
    expect(store.total()).toBe(1);
  });

  it('keeps only the answer to the last request when answers cross', async () => {
    const first = store.filterBy('a');
    const second = store.filterBy('ab');
    const [older, newer] = http.match((r) => r.url === '/api/webs');
    newer.flush({ items: [summary('ab', 'Abbey')], total: 1 });
    older.flush({ items: [summary('a1', 'A'), summary('a2', 'AA')], total: 2 });
    await Promise.all([first, second]);
    expect(store.items().map((w) => w.name)).toEqual(['Abbey']);
  });

  it("says why the list could not be loaded, in the server's words", async () => {
    const loading = store.load();
    http.expectOne((r) => r.url === '/api/webs').flush({ error: 'pageSize must be at most 100' }, { status: 400, statusText: 'Bad Request' });
    await loading;
    expect(store.error()).toBe('The list of webs could not be loaded: pageSize must be at most 100');
    expect(store.loading()).toBe(false);
  });
});
