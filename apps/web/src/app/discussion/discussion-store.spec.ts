import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import type { CommentItem, CommentPage } from '@seinework/contracts';
import { DiscussionStore, threads } from './discussion-store';

function comment(id: string, parentId: string | null = null, extra: Partial<CommentItem> = {}): CommentItem {
  return {
    id,
    optionId: 'o1',
    parentId,
    author: { id: 'u1', name: 'Ada Example', role: 'stakeholder' },
    text: `text of ${id}`,
    anchor: null,
    hidden: false,
    hiddenReason: null,
    createdAt: '2026-12-01T10:00:00Z',
    editedAt: null,
    editable: false,
    audience: 'public',
    ...extra,
  };
}

function page(items: CommentItem[], total = items.length, pageNumber = 1): CommentPage {
  return { items, total, page: pageNumber, pageSize: 50, discussion: { audience: 'public', open: true, closedReason: null, closesAt: null, following: false } };
}

describe('threads', () => {
  it('puts replies under their parent in order, and marks a reply whose parent is on an earlier page', () => {
    const result = threads([comment('a'), comment('b'), comment('r1', 'a'), comment('r2', 'b'), comment('r3', 'a'), comment('late', 'gone')]);
    expect(result.map((t) => [t.comment.id, t.replies.map((r) => r.id), t.orphan])).toEqual([
      ['a', ['r1', 'r3'], false],
      ['b', ['r2'], false],
      ['late', [], true],
    ]);
  });
});

describe('DiscussionStore', () => {
  let store: InstanceType<typeof DiscussionStore>;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [DiscussionStore, provideHttpClient(), provideHttpClientTesting()] });
    store = TestBed.inject(DiscussionStore);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  async function loaded(total: number): Promise<void> {
    const loading = store.load('o1');
    http.expectOne('/api/options/o1').flush({ id: 'o1', webId: 'w1', versionId: 'v1', name: 'Cut', shares: [], latestRun: null });
    http.expectOne((r) => r.url === '/api/options/o1/comments' && r.params.get('page') === '1').flush(page([comment('a')], total));
    await Promise.resolve();
    await Promise.resolve();
    http.expectOne('/api/webs/w1/versions/v1').flush({ web: { compartments: [{ id: 'fish', name: 'Forage fish', kind: 'consumer' }] } });
    await loading;
  }

  it('loads the option, its first page of comments and the baseline for compartment names', async () => {
    await loaded(1);
    expect(store.option()?.name).toBe('Cut');
    expect(store.threads().map((t) => t.comment.id)).toEqual(['a']);
    expect(store.web()?.compartments[0]?.name).toBe('Forage fish');
  });

  it('posts a comment and shows the page it lands on (the last one)', async () => {
    await loaded(50);
    const posting = store.post({ text: 'Hello', anchor: { kind: 'indicator', key: 'totalCatch' } });
    const sent = http.expectOne((r) => r.method === 'POST' && r.url === '/api/options/o1/comments');
    expect(sent.request.body).toEqual({ text: 'Hello', anchor: { kind: 'indicator', key: 'totalCatch' } });
    sent.flush({ id: 'c51' }, { status: 201, statusText: 'Created' });
    await Promise.resolve();
    http.expectOne((r) => r.url === '/api/options/o1/comments' && r.params.get('page') === '2').flush(page([comment('c51')], 51, 2));
    expect(await posting).toBe(true);
    expect(store.notice()).toEqual({ kind: 'done', text: 'Your comment was posted.' });
    expect(store.pageCount()).toBe(2);
  });

  it('counts a comment that went through as posted even when the list cannot be read again (no reason to post it twice)', async () => {
    await loaded(1);
    const posting = store.post({ text: 'Posted once' });
    http.expectOne((r) => r.method === 'POST').flush({ id: 'c2' }, { status: 201, statusText: 'Created' });
    await vi.waitFor(() => http.expectOne((r) => r.method === 'GET' && r.url === '/api/options/o1/comments').flush({ error: 'Busy' }, { status: 503, statusText: 'Unavailable' }));
    expect(await posting).toBe(true);
    expect(store.notice()).toEqual({ kind: 'done', text: 'Your comment was posted. The comments could not be read again (Busy): reload the page to see them.' });
  });

  it('keeps the discussion shown when another page of comments cannot be loaded', async () => {
    await loaded(60);
    const paging = store.showPage(2);
    expect(store.loading()).toBe(true);
    http.expectOne((r) => r.url === '/api/options/o1/comments' && r.params.get('page') === '2').flush({ error: 'Busy' }, { status: 503, statusText: 'Unavailable' });
    await paging;
    expect(store.loading()).toBe(false);
    expect(store.error()).toBeNull();
    expect(store.option()?.name).toBe('Cut');
    expect(store.threads().map((t) => t.comment.id)).toEqual(['a']);
    expect(store.notice()).toEqual({ kind: 'problem', text: 'That page of comments could not be loaded: Busy' });
  });

  it('keeps the server’s refusal as a notice and the page as it was', async () => {
    await loaded(1);
    const posting = store.post({ text: 'Too late' });
    http
      .expectOne((r) => r.method === 'POST')
      .flush({ error: 'Public comment on this option closed on 1 December 2026' }, { status: 403, statusText: 'Forbidden' });
    expect(await posting).toBe(false);
    expect(store.notice()).toEqual({ kind: 'problem', text: 'Public comment on this option closed on 1 December 2026' });
    expect(store.threads().map((t) => t.comment.id)).toEqual(['a']);
  });
});
