import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Subject } from 'rxjs';
import type { RunSummary } from '@seinework/contracts';
import { OptionsApi } from '../options/options-api';
import { fixtureDocument, fixtureRun } from './result-fixture';
import { ResultsStore } from './results-store';

describe('ResultsStore', () => {
  let store: InstanceType<typeof ResultsStore>;
  let http: HttpTestingController;
  /** The run's server-sent events, as the browser's EventSource would deliver them (jsdom has none). */
  let events: Subject<RunSummary>;

  beforeEach(() => {
    events = new Subject<RunSummary>();
    TestBed.configureTestingModule({
      providers: [ResultsStore, provideHttpClient(), provideHttpClientTesting(), { provide: OptionsApi, useValue: { runEvents: () => events } }],
    });
    store = TestBed.inject(ResultsStore);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  const flushExtras = () => {
    http.expectOne('/api/options/option-1').flush({ id: 'option-1', purpose: 'Let the fish grow' });
  };

  it('reads the run with every table, then the baseline and its harvest sensitivity under the option’s rule', async () => {
    const doc = fixtureDocument({ totalCatch: { p5: 1, median: 2, p95: 3 } });
    const loading = store.load('run-1');
    expect(store.loading()).toBe(true);
    const request = http.expectOne((r) => r.url === '/api/runs/run-1');
    expect(request.request.params.get('tables')).toBe('all');
    request.flush(fixtureRun('done', doc));
    await Promise.resolve();
    flushExtras();
    await Promise.resolve();
    http.expectOne('/api/webs/web-1/versions/version-1').flush({ id: 'version-1', number: 3, web: { ...doc.web, name: 'Test bay' } });
    await new Promise((resolve) => setTimeout(resolve));
    const sensitivity = http.expectOne('/api/options/sensitivity');
    expect(sensitivity.request.method).toBe('POST');
    expect(sensitivity.request.body.response).toBe('bottom-up');
    expect(sensitivity.request.body.web.name).toBe('Test bay');
    const row = { fleet: 'Trawl', compartment: 'fish', catch: 2, perPercent: { totalCatch: 0.02 }, distanceFromPeakChange: -0.001, catchValueChange: 10 };
    sensitivity.flush({ response: 'bottom-up', rows: [row], byRobustness: [row], byCatchValue: [row] });
    await loading;

    expect(store.loading()).toBe(false);
    expect(store.error()).toBeNull();
    expect(store.notDone()).toBeNull();
    expect(store.optionName()).toBe('Halve the trawl');
    expect(store.webName()).toBe('Test bay');
    expect(store.versionNumber()).toBe(3);
    expect(store.purpose()).toBe('Let the fish grow');
    expect(store.indicators().find((r) => r.key === 'totalCatch')!.robust).toBe(true);
    expect(store.positions()[0].id).toBe('fish');
    expect(store.fleets()[0]).toMatchObject({ fleet: 'Trawl', catchBefore: 2, catchAfter: 4, fishingInBalance: 0.3 });
    expect(store.sensitivityRows()).toEqual([expect.objectContaining({ fleet: 'Trawl', compartmentName: 'Fish', totalCatch: 0.02 })]);
  });

  it('says "No such run" for a 404', async () => {
    const loading = store.load('gone');
    http.expectOne((r) => r.url === '/api/runs/gone').flush({ error: 'No such run' }, { status: 404, statusText: 'Not Found' });
    await loading;
    expect(store.error()).toMatch(/^No such run/);
    expect(store.run()).toBeNull();
    expect(store.doc()).toBeNull();
  });

  it('shows other refusals with the server’s message', async () => {
    const loading = store.load('run-1');
    http.expectOne((r) => r.url === '/api/runs/run-1').flush({ error: 'You may not read this run' }, { status: 403, statusText: 'Forbidden' });
    await loading;
    expect(store.error()).toBe('This run could not be loaded: You may not read this run');
  });

  it('explains a run that is not done, and asks for no sensitivity', async () => {
    const loading = store.load('run-1');
    http.expectOne((r) => r.url === '/api/runs/run-1').flush(fixtureRun('running'));
    await Promise.resolve();
    flushExtras();
    await Promise.resolve();
    http.expectOne('/api/webs/web-1/versions/version-1').flush({ id: 'version-1', number: 1, web: fixtureDocument().web });
    await loading;
    expect(store.doc()).toBeNull();
    expect(store.indicators()).toEqual([]);
    expect(store.notDone()).toBe('This run is running (40 of 100 draws). The result shows here as soon as it is done.');
    http.expectNone('/api/options/sensitivity');
  });

  it('follows an unfinished run live and shows its result once it is done', async () => {
    const loading = store.load('run-1');
    const running = fixtureRun('running');
    http.expectOne((r) => r.url === '/api/runs/run-1').flush(running);
    await Promise.resolve();
    flushExtras();
    await Promise.resolve();
    http.expectOne('/api/webs/web-1/versions/version-1').flush({ id: 'version-1', number: 1, web: fixtureDocument().web });
    await loading;
    expect(store.following()).toBe(true);

    events.next({ ...running, progress: { done: 70, total: 100 } });
    expect(store.notDone()).toBe('This run is running (70 of 100 draws). The result shows here as soon as it is done.');

    events.next({ ...running, status: 'done', progress: { done: 100, total: 100 } });
    const again = http.expectOne((r) => r.url === '/api/runs/run-1');
    expect(again.request.params.get('tables')).toBe('all');
    again.flush(fixtureRun('done', fixtureDocument()));
    await new Promise((resolve) => setTimeout(resolve));
    http.expectOne('/api/options/sensitivity').flush({ response: 'bottom-up', rows: [], byRobustness: [], byCatchValue: [] });
    await new Promise((resolve) => setTimeout(resolve));
    expect(store.following()).toBe(false);
    expect(store.notDone()).toBeNull();
    expect(store.doc()).not.toBeNull();
    expect(store.indicators().length).toBeGreaterThan(0);
  });

  it('says so, once, when a followed run finished but its result cannot be read', async () => {
    const loading = store.load('run-1');
    const running = fixtureRun('running');
    http.expectOne((r) => r.url === '/api/runs/run-1').flush(running);
    await Promise.resolve();
    flushExtras();
    await Promise.resolve();
    http.expectOne('/api/webs/web-1/versions/version-1').flush({ id: 'version-1', number: 1, web: fixtureDocument().web });
    await loading;
    events.next({ ...running, status: 'done', progress: { done: 100, total: 100 } });
    http.expectOne((r) => r.url === '/api/runs/run-1').flush({ error: 'Busy' }, { status: 503, statusText: 'Unavailable' });
    await new Promise((resolve) => setTimeout(resolve));
    expect(store.run()).toBeNull();
    expect(store.error()).toBe('The run finished, but its result could not be read: Busy. Reload the page to try again.');
  });

  it('falls back to asking for a reload when the run can no longer be followed', async () => {
    const loading = store.load('run-1');
    http.expectOne((r) => r.url === '/api/runs/run-1').flush(fixtureRun('queued'));
    await Promise.resolve();
    flushExtras();
    await Promise.resolve();
    http.expectOne('/api/webs/web-1/versions/version-1').flush({ id: 'version-1', number: 1, web: fixtureDocument().web });
    await loading;
    events.error(new Error('The run can no longer be followed.'));
    expect(store.following()).toBe(false);
    expect(store.notDone()).toMatch(/Reload the page when it is done\.$/);
  });

  it('says why a run failed', async () => {
    const loading = store.load('run-1');
    http.expectOne((r) => r.url === '/api/runs/run-1').flush(fixtureRun('failed'));
    await Promise.resolve();
    flushExtras();
    await Promise.resolve();
    http.expectOne('/api/webs/web-1/versions/version-1').flush({ id: 'version-1', number: 1, web: fixtureDocument().web });
    await loading;
    expect(store.notDone()).toBe('This run failed: the option web could not be balanced.');
  });
});
