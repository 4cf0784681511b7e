import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideCharts, withDefaultRegisterables } from 'ng2-charts';
import { BaselineOverview } from './baseline-overview';

describe('BaselineOverview', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [BaselineOverview],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideCharts(withDefaultRegisterables())],
    });
  });

  it('shows the headline indicators and sorts compartments by trophic level', async () => {
    const fixture = TestBed.createComponent(BaselineOverview);
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/demo/baseline').flush({
      name: 'Test bay',
      unit: 'g C m-2 y-1',
      compartments: [
        { id: 'p', name: 'Plankton', kind: 'producer' },
        { id: 'f', name: 'Fish', kind: 'consumer' },
      ],
      analysis: {
        relativeAscendency: 0.4123,
        robustness: 0.3654,
        fitness: { shareOfPeak: 0.99, side: 'constraint' },
        finnCyclingIndex: 0.12,
        totalCatchTonnes: 1234,
        totalCatch: 1,
        meanTrophicLevelOfCatch: 3.21,
        primaryProductionRequiredShare: 0.05,
        trophicLevels: { p: 1, f: 3.2 },
        cycledThroughflow: { p: 0, f: 1.5 },
      },
    });
    await fixture.whenStable();
    fixture.detectChanges();
    const text: string = fixture.nativeElement.textContent;
    expect(text).toContain('Test bay');
    expect(text).toContain('0.412');
    expect(text).toContain('more constraint than flexibility');
    expect(text).toContain('1,234 t/y');
    const curve = fixture.nativeElement.querySelector('sw-fitness-curve canvas') as HTMLCanvasElement;
    expect(curve.getAttribute('aria-label')).toBe('Fitness curve: Baseline at relative ascendency 0.412, fitness 0.365');
    const rows = Array.from(fixture.nativeElement.querySelectorAll('tr.mat-mdc-row')) as HTMLElement[];
    expect(rows.map((r) => r.textContent)).toEqual([expect.stringContaining('Fish'), expect.stringContaining('Plankton')]);
  });

  it('says so when the baseline cannot be loaded', async () => {
    const fixture = TestBed.createComponent(BaselineOverview);
    fixture.detectChanges();
    TestBed.inject(HttpTestingController)
      .expectOne('/api/demo/baseline')
      .flush({ error: 'no demo web' }, { status: 404, statusText: 'Not Found' });
    await fixture.whenStable();
    fixture.detectChanges();
    expect(fixture.nativeElement.querySelector('[role=alert]').textContent).toContain('no demo web');
  });
});
