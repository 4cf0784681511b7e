import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import type { BalancePreview, VersionDetail, Web } from '@seinework/contracts';
import { EditorStore } from './editor-store';

const web: Web = {
  name: 'Two boxes',
  unit: 'g C m-2 y-1',
  compartments: [
    { id: 'p', name: 'Plankton', kind: 'producer' },
    { id: 'f', name: 'Fish', kind: 'consumer' },
  ],
  flows: [{ from: 'p', to: 'f', value: 40 }],
  imports: [{ to: 'p', value: 100 }],
  exports: [{ from: 'f', value: 5, fleet: 'Seine', price: 900 }],
  respiration: [
    { from: 'p', value: 60 },
    { from: 'f', value: 30 },
  ],
};

const draft: VersionDetail = {
  id: 'v1',
  webId: 'w1',
  number: 1,
  status: 'draft',
  note: '',
  createdBy: 'Ana',
  createdAt: '2026-01-01T00:00:00Z',
  publishedBy: null,
  publishedAt: null,
  basedOn: null,
  web,
};

describe('EditorStore', () => {
  let store: InstanceType<typeof EditorStore>;
  let http: HttpTestingController;

  async function open(version: VersionDetail = draft): Promise<void> {
    const loading = store.load('w1', version.id);
    http.expectOne('/api/webs/w1').flush({ id: 'w1', name: 'Two boxes web', place: '', period: '', unit: web.unit, createdBy: 'Ana', createdAt: '', versions: [] });
    http.expectOne(`/api/webs/w1/versions/${version.id}`).flush(version);
    await loading;
  }

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [EditorStore, provideHttpClient(), provideHttpClientTesting()] });
    store = TestBed.inject(EditorStore);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('follows typing in the balance panel, and an unchanged draft may be published', async () => {
    await open();
    expect(store.webName()).toBe('Two boxes web');
    expect(store.unbalanced().map((b) => b.id)).toEqual(['f']);
    expect(store.publishable()).toBe('v1');
    const flow = store.tables().flows[0];
    store.setCell('flows', flow.key, 'value', '35');
    expect(store.unbalanced().map((b) => b.id)).toEqual(['p']);
    expect(store.dirty()).toBe(true);
    // unsaved edits are never published behind the person's back
    expect(store.publishable()).toBeNull();
    store.setCell('flows', flow.key, 'value', '3');
    store.setCell('respiration', store.tables().respiration[0].key, 'value', '97');
    store.setCell('respiration', store.tables().respiration[1].key, 'value', '-2');
    expect(store.cellProblems().map((p) => `${p.table} ${p.row} ${p.field}`)).toEqual(['respiration 2 value']);
  });

  it('previews a balancing, takes it into the tables, saves a draft based on the version opened and publishes that draft', async () => {
    await open();
    store.setBalanceMethod('output');
    const previewing = store.previewBalance();
    const request = http.expectOne('/api/webs/balance');
    expect(request.request.body.method).toBe('output');
    expect(request.request.body.web).toEqual(web);
    const balanced: Web = { ...web, flows: [{ from: 'p', to: 'f', value: 35 }], respiration: [{ from: 'p', value: 65 }, { from: 'f', value: 30 }] };
    request.flush({ method: 'output', wasBalanced: false, web: balanced, changes: [{ kind: 'flow', from: 'p', to: 'f', fleet: null, before: 40, after: 35 }] } satisfies BalancePreview);
    await previewing;
    expect(store.preview()?.changes).toHaveLength(1);
    expect(store.unbalanced()).toHaveLength(1);

    store.acceptBalance();
    expect(store.preview()).toBeNull();
    expect(store.unbalanced()).toEqual([]);
    expect(store.web()).toEqual(balanced);

    store.setNote('Balanced, keeping what goes out');
    const saving = store.saveDraft();
    const save = http.expectOne('/api/webs/w1/versions');
    expect(save.request.body).toEqual({ web: balanced, basedOn: 'v1', note: 'Balanced, keeping what goes out' });
    save.flush({ id: 'w1', versionId: 'v2' });
    await saving;
    expect(store.dirty()).toBe(false);
    expect(store.publishable()).toBe('v2');

    const publishing = store.publishSaved();
    http.expectOne('/api/webs/w1/versions/v2/publish').flush({ ...draft, id: 'v2', number: 2, status: 'published' });
    expect((await publishing)?.id).toBe('v2');
  });

  it('keeps the edits and says why when saving is refused', async () => {
    await open({ ...draft, status: 'published' });
    expect(store.publishable()).toBeNull();
    store.setCell('flows', store.tables().flows[0].key, 'value', '41');
    const saving = store.saveDraft();
    http.expectOne('/api/webs/w1/versions').flush({ error: 'web must be a WEB.json object', details: ['flows[0].value: too large'] }, { status: 400, statusText: 'Bad Request' });
    expect(await saving).toBeNull();
    expect(store.actionError()).toBe('The draft was not saved: web must be a WEB.json object: flows[0].value: too large');
    expect(store.dirty()).toBe(true);
    expect(store.web().flows[0].value).toBe(41);
  });
});
