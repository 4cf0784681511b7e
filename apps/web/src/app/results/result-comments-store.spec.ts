import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import type { CommentItem, CommentPage } from '@seinework/contracts';
import { ResultCommentsStore } from './result-comments-store';

const comment = (n: number, extra: Partial<CommentItem> = {}): CommentItem => ({
  id: `c-${n}`,
  optionId: 'o-1',
  audience: 'public',
  parentId: null,
  author: { id: 'u-1', name: 'Tamsin (demo)', role: 'stakeholder' },
  text: `Comment ${n}`,
  anchor: { kind: 'indicator', key: n % 2 === 0 ? 'totalCatch' : 'robustness' },
  hidden: false,
  hiddenReason: null,
  createdAt: '2026-11-20T10:00:00.000Z',
  editedAt: null,
  editable: false,
  ...extra,
});

const page = (items: CommentItem[], total: number, pageNumber: number): CommentPage => ({
  items,
  total,
  page: pageNumber,
  pageSize: 50,
  discussion: { audience: 'public', open: true, closedReason: null, closesAt: null, following: false },
});

describe('ResultCommentsStore', () => {
  let store: InstanceType<typeof ResultCommentsStore>;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [ResultCommentsStore, provideHttpClient(), provideHttpClientTesting()] });
    store = TestBed.inject(ResultCommentsStore);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  const answer = async (pageNumber: number, body: CommentPage) => {
    await vi.waitFor(() => {
      const request = http.expectOne((r) => r.url === '/api/options/o-1/comments' && r.params.get('page') === String(pageNumber));
      request.flush(body);
    });
  };

  it('reads every page of the discussion and counts the comments on each anchor', async () => {
    const first = Array.from({ length: 50 }, (_, i) => comment(i + 1));
    const second = [comment(51), comment(52), comment(53, { anchor: null })];
    const loading = store.load('o-1');
    await answer(1, page(first, 53, 1));
    await answer(2, page(second, 53, 2));
    await loading;

    expect(store.available()).toBe(true);
    expect(store.items()).toHaveLength(53);
    expect(store.countFor({ kind: 'indicator', key: 'totalCatch' })).toBe(26);
    expect(store.countFor({ kind: 'indicator', key: 'robustness' })).toBe(26);
    expect(store.countFor({ kind: 'compartment', key: 'cod' })).toBe(0);
    expect(store.anchoredCount()).toBe(52);
    expect(store.unanchoredCount()).toBe(1);
  });

  it('puts a reply with the comment it answers, and leaves out what the reader may not read', async () => {
    const loading = store.load('o-1');
    const items = [comment(2), comment(3, { anchor: null, parentId: 'c-2' }), comment(4, { text: null, hidden: true }), comment(5, { anchor: null })];
    await answer(1, page(items, 4, 1));
    await loading;
    expect(store.groups().map((g) => [g.token, g.comments.map((c) => c.id)])).toEqual([['indicator:totalCatch', ['c-2', 'c-3']]]);
    expect(store.unanchoredCount()).toBe(1);
  });

  it('treats a refusal (not shared with this reader) as no discussion, not as an error', async () => {
    const loading = store.load('o-1');
    await vi.waitFor(() => http.expectOne((r) => r.url === '/api/options/o-1/comments').flush({ error: 'No such option' }, { status: 404, statusText: 'Not Found' }));
    await loading;
    expect(store.available()).toBe(false);
    expect(store.error()).toBeNull();
  });

  it('says when the comments could not be read for another reason', async () => {
    const loading = store.load('o-1');
    await vi.waitFor(() => http.expectOne((r) => r.url === '/api/options/o-1/comments').flush({ error: 'The database is busy' }, { status: 503, statusText: 'Unavailable' }));
    await loading;
    expect(store.available()).toBe(false);
    expect(store.error()).toBe('The comments could not be loaded: The database is busy');
  });

  it('shows nothing for an option that was never shared', async () => {
    const loading = store.load('o-1');
    await answer(1, { ...page([], 0, 1), discussion: { audience: null, open: false, closedReason: 'Not shared', closesAt: null, following: false } });
    await loading;
    expect(store.available()).toBe(false);
  });
});
