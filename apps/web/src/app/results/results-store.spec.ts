import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { fixtureDocument, fixtureRun } from './result-fixture';
import { ResultsStore } from './results-store';

describe('ResultsStore', () => {
  let store: InstanceType<typeof ResultsStore>;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [ResultsStore, provideHttpClient(), provideHttpClientTesting()] });
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
    expect(store.notDone()).toBe('This run is running (40 of 100 draws). Reload the page when it is done.');
    http.expectNone('/api/options/sensitivity');
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
