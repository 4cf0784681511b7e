import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import type { OptionPreview, VersionDetail } from '@seinework/contracts';
import { OptionForm } from './option-form';
import { OptionFormStore, PREVIEW_DELAY_MS } from './option-form-store';

const web: VersionDetail['web'] = {
  name: 'Test bay',
  unit: 'g C m-2 y-1',
  compartments: [
    { id: 'p', name: 'Plankton', kind: 'producer' },
    { id: 'f', name: 'Fish', kind: 'consumer' },
    { id: 'b', name: 'Birds', kind: 'consumer' },
  ],
  flows: [
    { from: 'p', to: 'f', value: 10 },
    { from: 'f', to: 'b', value: 1 },
  ],
  imports: [{ to: 'p', value: 100 }],
  exports: [
    { from: 'f', value: 1, fleet: 'Seine' },
    { from: 'b', value: 0.1, fleet: 'Net' },
  ],
  respiration: [
    { from: 'p', value: 90 },
    { from: 'f', value: 8 },
    { from: 'b', value: 0.9 },
  ],
};

const version: VersionDetail = {
  id: 'v1',
  webId: 'w1',
  number: 1,
  status: 'published',
  note: '',
  createdBy: 'Ana Lyst',
  createdAt: '2026-03-01T10:00:00Z',
  publishedBy: 'Ana Lyst',
  publishedAt: '2026-03-02T10:00:00Z',
  basedOn: null,
  web,
};

const PREVIEW_URL = '/api/webs/w1/versions/v1/options/preview';
const pause = () => new Promise((resolve) => setTimeout(resolve, PREVIEW_DELAY_MS + 50));

describe('OptionForm', () => {
  let fixture: ComponentFixture<OptionForm>;
  let http: HttpTestingController;
  let store: InstanceType<typeof OptionFormStore>;

  beforeEach(async () => {
    TestBed.configureTestingModule({ imports: [OptionForm], providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    fixture = TestBed.createComponent(OptionForm);
    fixture.componentRef.setInput('web', 'w1');
    fixture.componentRef.setInput('version', 'v1');
    fixture.detectChanges();
    http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/webs/w1/versions/v1').flush(version);
    await fixture.whenStable();
    store = fixture.debugElement.injector.get(OptionFormStore);
    fixture.detectChanges();
  });

  afterEach(() => http.verify());

  const group = (n: number) => fixture.nativeElement.querySelectorAll('fieldset')[n - 1] as HTMLFieldSetElement;
  const labels = (n: number) => Array.from(group(n).querySelectorAll('mat-label')).map((l) => l.textContent!.trim());

  it('shows a refusal against the adjustment the engine names, and others above the preview', async () => {
    store.setName('Two changes');
    store.changeAdjustment(0, { type: 'scale-catch', fleet: 'Seine', compartment: 'f', percent: -30, amount: null });
    store.addAdjustment();
    store.changeAdjustment(1, { type: 'set-catch', fleet: 'Net', compartment: 'b', percent: null, amount: 500 });
    await pause();
    const request = http.expectOne(PREVIEW_URL);
    expect(request.request.body).toEqual({
      name: 'Two changes',
      response: 'bottom-up',
      adjustments: [
        { type: 'scale-catch', fleet: 'Seine', compartment: 'f', percent: -30 },
        { type: 'set-catch', fleet: 'Net', compartment: 'b', amount: 500 },
      ],
    });
    request.flush(
      {
        error: 'The engine refuses this harvest option on this baseline: see adjustments[1]',
        details: [
          { adjustment: 1, problem: 'adjustments[1] (set-catch fleet "Net" on "b" to 500): "b" cannot supply a catch of 500' },
          { adjustment: null, problem: 'catch of "f" by fleet "Seine" cannot be met' },
        ],
      },
      { status: 422, statusText: 'Unprocessable Entity' },
    );
    await fixture.whenStable();
    fixture.detectChanges();

    expect(group(1).querySelector('[role=alert]')).toBeNull();
    expect(group(2).getAttribute('aria-invalid')).toBe('true');
    expect(group(2).querySelector('[role=alert]')!.textContent).toContain('"b" cannot supply a catch of 500');
    const whole = fixture.nativeElement.querySelector('.option-problems') as HTMLElement;
    expect(whole.textContent).toContain('catch of "f" by fleet "Seine" cannot be met');
    expect(whole.textContent).not.toContain('cannot supply a catch of 500');
    expect(fixture.nativeElement.querySelector('sw-option-preview')).toBeNull();
  });

  it('does not ask the engine again for typing what the preview does not use (purpose, draws), and drops an answer the form has moved past', async () => {
    store.setName('Purpose only');
    store.changeAdjustment(0, { type: 'scale-catch', fleet: 'Seine', compartment: 'f', percent: -30, amount: null });
    await pause();
    const first = http.expectOne(PREVIEW_URL);
    store.setPurpose('Why the council should look at it');
    store.setUncertainty({ draws: 2000 });
    await pause();
    http.expectNone(PREVIEW_URL);
    // the adjustment is left incomplete while the answer is still coming: that answer is not shown
    store.changeAdjustment(0, { type: 'scale-catch', fleet: 'Seine', compartment: 'f', percent: null, amount: null });
    fixture.detectChanges();
    expect(first.cancelled).toBe(true);
    await pause();
    http.expectNone(PREVIEW_URL);
    expect(store.preview()).toBeNull();
    expect(store.checking()).toBe(false);
  });

  it('asks the engine once after typing pauses, and shows its preview', async () => {
    store.changeAdjustment(0, { type: 'scale-catch', fleet: 'Seine', compartment: 'f', percent: -10, amount: null });
    store.changeAdjustment(0, { type: 'scale-catch', fleet: 'Seine', compartment: 'f', percent: -20, amount: null });
    store.setName('Cut');
    await pause();
    const request = http.expectOne(PREVIEW_URL);
    expect(request.request.body.adjustments[0].percent).toBe(-20);
    request.flush({
      indicators: [{ key: 'totalCatch', baseline: 1.1, option: 0.9, difference: -0.2 }],
      fleets: [{ fleet: 'Seine', baseline: { catch: 1, meanTrophicLevelOfCatch: 2, primaryProductionRequired: 10, tonnes: null, value: null }, option: { catch: 0.8, meanTrophicLevelOfCatch: 2, primaryProductionRequired: 8, tonnes: null, value: null }, fishingInBalance: -0.1 }],
    } satisfies OptionPreview);
    await fixture.whenStable();
    fixture.detectChanges();
    const rows = Array.from(fixture.nativeElement.querySelectorAll('sw-option-preview tbody tr')).map((r) => (r as HTMLElement).textContent);
    expect(rows[0]).toContain('Total catch (g C m-2 y-1)');
    expect(rows[0]).toContain('−0.200');
    expect(rows[1]).toContain('Seine');
    expect(rows[1]).toContain('0.800');
  });

  it('asks for the fields each kind of adjustment needs, and names what is missing before asking the engine', async () => {
    expect(labels(1)).toEqual(['Kind', 'Fleet', 'Compartment', 'Change (%)']);

    store.changeAdjustment(0, { type: 'close-fleet', fleet: '', compartment: '', percent: null, amount: null });
    fixture.detectChanges();
    expect(labels(1)).toEqual(['Kind', 'Fleet']);

    store.changeAdjustment(0, { type: 'set-catch', fleet: 'Seine', compartment: '', percent: null, amount: null });
    fixture.detectChanges();
    expect(labels(1)).toEqual(['Kind', 'Fleet', 'Compartment', 'Catch (g C m-2 y-1)']);
    expect(group(1).querySelector('.missing')!.textContent).toContain('Choose a compartment.');
    expect(group(1).querySelector('[role=alert]')).toBeNull();

    store.changeAdjustment(0, { type: 'scale-production', fleet: 'Seine', compartment: '', percent: null, amount: null });
    fixture.detectChanges();
    expect(labels(1)).toEqual(['Kind', 'Producer', 'Change (%)']);

    store.changeAdjustment(0, { type: 'open-fishery', fleet: 'Dredge', compartment: '', percent: null, amount: null });
    fixture.detectChanges();
    expect(labels(1)).toEqual(['Kind', 'Fleet', 'Compartment', 'Catch (g C m-2 y-1)']);
    await pause();
    // incomplete adjustments are not sent
    http.expectNone(PREVIEW_URL);
  });
});

describe('OptionForm of a stored option', () => {
  it('offers a frozen option (one with runs) for duplication instead of editing it, and never previews it', async () => {
    TestBed.configureTestingModule({ imports: [OptionForm], providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
    const fixture = TestBed.createComponent(OptionForm);
    fixture.componentRef.setInput('id', 'o1');
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/options/o1').flush({
      id: 'o1',
      webId: 'w1',
      versionId: 'v1',
      name: 'Run already',
      purpose: '',
      response: 'bottom-up',
      adjustments: 1,
      frozen: true,
      createdBy: 'Ana Lyst',
      createdAt: '2026-03-01T10:00:00Z',
      latestRun: null,
      shares: [],
      option: { name: 'Run already', response: 'bottom-up', adjustments: [{ type: 'close-fleet', fleet: 'Seine' }] },
    });
    await vi.waitFor(() => http.expectOne('/api/webs/w1/versions/v1').flush(version));
    await fixture.whenStable();
    fixture.detectChanges();
    const root: HTMLElement = fixture.nativeElement;
    expect(root.querySelector('[role=note]')!.textContent).toContain('Duplicate it to edit a copy');
    expect(Array.from(root.querySelectorAll('button')).map((b) => b.textContent!.trim())).toContain('content_copy Duplicate to edit');
    expect(root.querySelector('form')).toBeNull();
    await pause();
    http.expectNone(PREVIEW_URL);
    http.verify();
  });
});
