import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { provideCharts, withDefaultRegisterables } from 'ng2-charts';
import type { RunDetail } from '@seinework/contracts';
import { fixtureDocument, fixtureRun } from './result-fixture';
import { ResultPage } from './result-page';

describe('ResultPage', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [ResultPage],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([]), provideCharts(withDefaultRegisterables())],
    });
  });

  async function open(run: RunDetail) {
    const fixture = TestBed.createComponent(ResultPage);
    fixture.componentRef.setInput('id', run.id);
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne((r) => r.url === `/api/runs/${run.id}`).flush(run);
    await fixture.whenStable();
    http.expectOne('/api/options/option-1').flush({ id: 'option-1', purpose: 'Let the fish grow' });
    http.expectOne('/api/webs/web-1/versions/version-1').flush({ id: 'version-1', number: 2, web: { ...fixtureDocument().web, name: 'Test bay' } });
    await fixture.whenStable();
    fixture.detectChanges();
    return { fixture, http, root: fixture.nativeElement as HTMLElement };
  }

  it('shows a finished run: title, baseline, the robust mark only where the band excludes zero, and anchors for comments', async () => {
    const doc = fixtureDocument({ totalCatch: { p5: 1.5, median: 2, p95: 2.5 }, tst: { p5: -1, median: 0.2, p95: 3 } });
    const { fixture, http, root } = await open(fixtureRun('done', doc));
    const row = { fleet: 'Trawl', compartment: 'fish', catch: 2, perPercent: { totalCatch: 0.02, robustness: -1e-7 }, distanceFromPeakChange: -0.001, catchValueChange: 10 };
    http.expectOne('/api/options/sensitivity').flush({ response: 'bottom-up', rows: [row], byRobustness: [row], byCatchValue: [row] });
    await fixture.whenStable();
    fixture.detectChanges();

    expect(root.querySelector('h1')!.textContent).toBe('Halve the trawl — result');
    const facts = root.querySelector('.facts')!.textContent!;
    expect(facts).toContain('Test bay, version 2');
    expect(facts).toContain('run-1');
    expect(facts).toContain('seinework test');
    expect(root.textContent).toContain('Trawl: catch of Fish −50 %');
    expect(root.textContent).toContain('Let the fish grow');
    expect(root.querySelector('a[href="/options/option-1"]')).not.toBeNull();
    expect(root.querySelector('sw-caution')).not.toBeNull();

    expect(root.querySelectorAll('tr[id^="indicator-"]')).toHaveLength(16);
    expect(root.querySelector('#indicator-totalCatch .mark')!.textContent).toContain('Robust');
    expect(root.querySelector('#indicator-tst .mark')).toBeNull();
    expect(root.querySelector('#indicator-tst')!.textContent).toContain('band includes zero');
    expect(root.querySelector('#indicator-card-totalCatch')!.textContent).toContain('Robust');
    expect(Array.from(root.querySelectorAll('tr[id^="compartment-"]')).map((r) => r.id)).toEqual(['compartment-fish', 'compartment-grazer', 'compartment-plants']);

    expect(root.querySelector('sw-result-fitness-curve canvas')!.getAttribute('aria-label')).toContain('With the option at relative ascendency');
    expect(root.querySelector('sw-ladder-chart canvas')!.getAttribute('aria-label')).toContain('transfer efficiency per level');
    expect(root.querySelector('table[aria-label="Mixed trophic impact of each fleet on each compartment"] tbody')!.textContent).toContain('Trawl');
    const sensitivity = root.querySelector('table[aria-label^="Harvest sensitivity"] tbody')!.textContent!;
    expect(sensitivity).toContain('Fish');
    expect(sensitivity).toContain('−1 × 10⁻⁷');
    expect(sensitivity).toContain('toward the peak');
  });

  it('tells what a run that is not done is doing, without result sections', async () => {
    const { root } = await open(fixtureRun('queued'));
    expect(root.querySelector('h1')!.textContent).toBe('Halve the trawl — result');
    expect(root.querySelector('[role=status]')!.textContent).toContain('This run is queued (40 of 100 draws)');
    expect(root.querySelector('#key-indicators')).toBeNull();
    TestBed.inject(HttpTestingController).expectNone('/api/options/sensitivity');
  });

  it('says "No such run" for a run that does not exist', async () => {
    const fixture = TestBed.createComponent(ResultPage);
    fixture.componentRef.setInput('id', 'gone');
    fixture.detectChanges();
    TestBed.inject(HttpTestingController).expectOne((r) => r.url === '/api/runs/gone').flush({ error: 'No such run' }, { status: 404, statusText: 'Not Found' });
    await fixture.whenStable();
    fixture.detectChanges();
    expect(fixture.nativeElement.querySelector('[role=alert]').textContent).toContain('No such run');
  });
});
