import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import type { OptionSummary, RunSummary } from '@seinework/contracts';
import { OptionListStore } from './option-list-store';

function option(id: string, status: RunSummary['status'] | null): OptionSummary {
  return {
    id,
    webId: 'w1',
    versionId: 'v1',
    name: `Option ${id}`,
    purpose: '',
    response: 'bottom-up',
    adjustments: 1,
    frozen: status !== null,
    createdBy: 'Ana Lyst',
    createdAt: '2026-03-01T10:00:00Z',
    latestRun: status === null ? null : ({ id: `run-${id}`, status } as RunSummary),
    shares: [],
  };
}

describe('OptionListStore', () => {
  let store: InstanceType<typeof OptionListStore>;
  let http: HttpTestingController;

  beforeEach(async () => {
    TestBed.configureTestingModule({ providers: [OptionListStore, provideHttpClient(), provideHttpClientTesting()] });
    store = TestBed.inject(OptionListStore);
    http = TestBed.inject(HttpTestingController);
    const loading = store.load('w1', 'v1');
    http.expectOne('/api/webs/w1/versions/v1/options').flush({
      items: [option('a', 'done'), option('b', 'running'), option('c', null), ...['d', 'e', 'f', 'g', 'h', 'i'].map((id) => option(id, 'done'))],
      total: 9,
    });
    await loading;
  });

  afterEach(() => http.verify());

  it('compares the latest runs of 2 to 6 picked options with a finished run, in list order', () => {
    expect(store.canPick(store.options()[1])).toBe(false);
    expect(store.canPick(store.options()[2])).toBe(false);
    store.togglePick('d', true);
    expect(store.canCompare()).toBe(false);
    store.togglePick('a', true);
    expect(store.compareRuns()).toEqual(['run-a', 'run-d']);
    expect(store.canCompare()).toBe(true);
    store.togglePick('a', false);
    expect(store.compareRuns()).toEqual(['run-d']);
  });

  it('stops picking at six', () => {
    for (const id of ['a', 'd', 'e', 'f', 'g', 'h']) store.togglePick(id, true);
    expect(store.canCompare()).toBe(true);
    const ninth = store.options().find((o) => o.id === 'i')!;
    expect(store.canPick(ninth)).toBe(false);
    // one already picked can still be unticked
    expect(store.canPick(store.options()[0])).toBe(true);
  });
});
