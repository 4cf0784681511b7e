import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import type { OptionDetail, RunSummary } from '@seinework/contracts';
import type { Role } from '@seinework/contracts/permissions';
import { SessionStore } from '../auth/session-store';
import { OptionStore } from './option-store';

/** Stands in for the browser's EventSource: the test plays the server's events. */
class FakeEventSource {
  static readonly CLOSED = 2;
  static opened: FakeEventSource[] = [];
  readyState = 1;
  onerror: (() => void) | null = null;
  private readonly listeners = new Map<string, ((event: MessageEvent<string>) => void)[]>();

  constructor(readonly url: string) {
    FakeEventSource.opened.push(this);
  }

  addEventListener(type: string, listener: (event: MessageEvent<string>) => void): void {
    this.listeners.set(type, [...(this.listeners.get(type) ?? []), listener]);
  }

  close(): void {
    this.readyState = FakeEventSource.CLOSED;
  }

  send(type: 'progress' | 'status', run: RunSummary): void {
    for (const listener of this.listeners.get(type) ?? []) listener(new MessageEvent(type, { data: JSON.stringify(run) }));
  }
}

const run = (status: RunSummary['status'], done: number, id = 'r1'): RunSummary => ({
  id,
  optionId: 'o1',
  status,
  progress: { done, total: 1000 },
  draws: 1000,
  cv: 0.25,
  seed: 7,
  engineVersion: 'test',
  createdBy: 'Ana Lyst',
  createdAt: '2026-03-01T10:00:00Z',
  startedAt: status === 'queued' ? null : '2026-03-01T10:00:01Z',
  finishedAt: status === 'done' ? '2026-03-01T10:00:09Z' : null,
  error: null,
});

const detail: OptionDetail = {
  id: 'o1',
  webId: 'w1',
  versionId: 'v1',
  name: 'Cut the seine',
  purpose: '',
  response: 'bottom-up',
  adjustments: 1,
  frozen: true,
  createdBy: 'Ana Lyst',
  createdAt: '2026-03-01T09:00:00Z',
  latestRun: run('running', 0),
  shares: [],
  option: { name: 'Cut the seine', response: 'bottom-up', adjustments: [{ type: 'scale-catch', fleet: 'Seine', compartment: 'f', percent: -30 }] },
};

describe('OptionStore', () => {
  let store: InstanceType<typeof OptionStore>;
  let http: HttpTestingController;

  beforeEach(() => {
    FakeEventSource.opened = [];
    vi.stubGlobal('EventSource', FakeEventSource);
    TestBed.configureTestingModule({ providers: [OptionStore, provideHttpClient(), provideHttpClientTesting()] });
    signedInAs('analyst');
    store = TestBed.inject(OptionStore);
    http = TestBed.inject(HttpTestingController);
  });

  function signedInAs(role: Role): void {
    TestBed.inject(SessionStore).signedInAs({ id: `${role}-1`, email: `${role}@demo.test`, name: `Demo ${role}`, role });
  }

  afterEach(() => {
    http.verify();
    vi.unstubAllGlobals();
  });

  async function loadWithRunning(): Promise<FakeEventSource> {
    const loading = store.load('o1');
    http.expectOne('/api/options/o1').flush(detail);
    http.expectOne('/api/options/o1/runs').flush({ items: [run('running', 0)], total: 1 });
    await vi.waitFor(() => http.expectOne('/api/webs/w1/versions/v1').flush({ id: 'v1', webId: 'w1', number: 1, web: { name: 'Test', unit: 'u', compartments: [], flows: [], imports: [], exports: [], respiration: [] } }));
    await loading;
    expect(FakeEventSource.opened.map((s) => s.url)).toEqual(['/api/runs/r1/events']);
    return FakeEventSource.opened[0];
  }

  it('follows an unfinished run: each progress event updates the live run and its row', async () => {
    const source = await loadWithRunning();
    expect(store.following()).toBe(true);
    source.send('progress', run('running', 300));
    expect(store.liveRun()!.progress).toEqual({ done: 300, total: 1000 });
    expect(store.runs()[0].progress.done).toBe(300);
    source.send('progress', run('running', 650));
    expect(store.liveRun()!.progress.done).toBe(650);
    expect(source.readyState).not.toBe(FakeEventSource.CLOSED);
  });

  it('closes the stream once the run is done, and keeps the finished run', async () => {
    const source = await loadWithRunning();
    source.send('status', run('done', 1000));
    expect(source.readyState).toBe(FakeEventSource.CLOSED);
    expect(store.following()).toBe(false);
    expect(store.liveRun()!.status).toBe('done');
    expect(store.doneRuns().map((r) => r.id)).toEqual(['r1']);
  });

  it('asks a stakeholder’s browser for no list of runs (refused to them): the run the public share shows is the one listed', async () => {
    signedInAs('stakeholder');
    const shown = run('done', 1000);
    const loading = store.load('o1');
    http.expectOne('/api/options/o1').flush({ ...detail, latestRun: shown });
    await vi.waitFor(() => http.expectOne('/api/webs/w1/versions/v1').flush({ id: 'v1', webId: 'w1', number: 1, web: { name: 'Test', unit: 'u', compartments: [], flows: [], imports: [], exports: [], respiration: [] } }));
    await loading;
    http.expectNone('/api/options/o1/runs');
    expect(store.error()).toBeNull();
    expect(store.runs()).toEqual([shown]);
    expect(FakeEventSource.opened).toEqual([]);
  });

  it('stops following the run of the option shown before when another option opens', async () => {
    const source = await loadWithRunning();
    const loading = store.load('o2');
    http.expectOne('/api/options/o2').flush({ ...detail, id: 'o2', latestRun: null });
    http.expectOne('/api/options/o2/runs').flush({ items: [], total: 0 });
    await vi.waitFor(() => http.expectOne('/api/webs/w1/versions/v1').flush({ id: 'v1', webId: 'w1', number: 1, web: { name: 'Test', unit: 'u', compartments: [], flows: [], imports: [], exports: [], respiration: [] } }));
    await loading;
    expect(source.readyState).toBe(FakeEventSource.CLOSED);
    expect(store.following()).toBe(false);
    expect(store.liveRun()).toBeNull();
    expect(store.detail()!.id).toBe('o2');
  });

  it('keeps the option shown, and says why, when its baseline cannot be read', async () => {
    const loading = store.load('o1');
    http.expectOne('/api/options/o1').flush({ ...detail, latestRun: null });
    http.expectOne('/api/options/o1/runs').flush({ items: [], total: 0 });
    await vi.waitFor(() => http.expectOne('/api/webs/w1/versions/v1').flush({ error: 'Busy' }, { status: 503, statusText: 'Unavailable' }));
    await loading;
    expect(store.error()).toBeNull();
    expect(store.detail()!.name).toBe('Cut the seine');
    expect(store.actionError()).toBe('The baseline could not be read, so compartments and fleets show by their ids: Busy');
  });

  it('starts a run with the settings given and follows it', async () => {
    const source = await loadWithRunning();
    source.send('status', run('cancelled', 10));
    const starting = store.startRun({ draws: 1000, cv: 0.3, seed: 9 });
    const request = http.expectOne('/api/options/o1/runs');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ draws: 1000, cv: 0.3, seed: 9 });
    request.flush(run('queued', 0, 'r2'));
    await starting;
    expect(store.runs().map((r) => r.id)).toEqual(['r2', 'r1']);
    expect(FakeEventSource.opened.at(-1)!.url).toBe('/api/runs/r2/events');
    FakeEventSource.opened.at(-1)!.send('status', run('running', 0, 'r2'));
    expect(store.liveRun()!.status).toBe('running');
  });
});
