import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { provideCharts, withDefaultRegisterables } from 'ng2-charts';
import type { VersionDetail, WebDetail } from '@seinework/contracts';
import { WebPage } from './web-page';

const version = (id: string, number: number, status: 'draft' | 'published') => ({
  id,
  number,
  status,
  note: `note ${number}`,
  createdBy: 'Ana Lyst',
  createdAt: '2026-03-01T10:00:00Z',
  publishedBy: status === 'published' ? 'Ana Lyst' : null,
  publishedAt: status === 'published' ? '2026-03-02T10:00:00Z' : null,
  basedOn: null,
});

const detail: WebDetail = {
  id: 'w1',
  name: 'Test bay',
  place: 'North shore',
  period: '2020–2022',
  unit: 'g C m-2 y-1',
  createdBy: 'Ana Lyst',
  createdAt: '2026-03-01T10:00:00Z',
  versions: [version('v1', 1, 'published'), { ...version('v2', 2, 'draft'), basedOn: 'v1' }],
};

const web = {
  name: 'Test bay',
  unit: 'g C m-2 y-1',
  compartments: [
    { id: 'p', name: 'Plankton', kind: 'producer' as const },
    { id: 'f', name: 'Fish', kind: 'consumer' as const },
  ],
  flows: [{ from: 'p', to: 'f', value: 10 }],
  imports: [{ to: 'p', value: 100 }],
  exports: [{ from: 'f', value: 1, fleet: 'Seine' }],
  respiration: [
    { from: 'p', value: 90 },
    { from: 'f', value: 9 },
  ],
};

const analysis = {
  relativeAscendency: 0.4123,
  robustness: 0.3654,
  fitness: { shareOfPeak: 0.99, side: 'constraint' },
  finnCyclingIndex: 0.12,
  totalCatchTonnes: 1234,
  totalCatch: 1,
  meanTrophicLevelOfCatch: 3.21,
  primaryProductionRequiredShare: 0.05,
  trophicLevels: { p: 1, f: 2 },
  cycledThroughflow: { p: 0, f: 1.5 },
  warnings: [],
};

describe('WebPage', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [WebPage],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([]), provideCharts(withDefaultRegisterables())],
    });
  });

  async function open() {
    const fixture = TestBed.createComponent(WebPage);
    fixture.componentRef.setInput('id', 'w1');
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne('/api/webs/w1').flush(detail);
    await fixture.whenStable();
    return { fixture, http };
  }

  it('shows the newest published version: headline indicators, fitness curve, diagram and positions', async () => {
    const { fixture, http } = await open();
    http.expectOne('/api/webs/w1/versions/v1').flush({ ...version('v1', 1, 'published'), webId: 'w1', web } satisfies VersionDetail);
    await fixture.whenStable();
    http.expectOne('/api/webs/w1/versions/v1/analysis').flush(analysis);
    await fixture.whenStable();
    fixture.detectChanges();
    const root: HTMLElement = fixture.nativeElement;
    expect(root.querySelector('h1')!.textContent).toBe('Test bay');
    const versions = Array.from(root.querySelectorAll('table[aria-label=Versions] tr.mat-mdc-row')).map((r) => r.textContent);
    expect(versions).toEqual([expect.stringContaining('Version 2'), expect.stringContaining('Version 1')]);
    expect(versions[0]).toContain('version 1');
    const headline = root.querySelector('[aria-label="Headline indicators"]')!.textContent!;
    expect(headline).toContain('0.412');
    expect(headline).toContain('more constraint than flexibility');
    expect(headline).toContain('1,234 t/y');
    const curve = root.querySelector('sw-fitness-curve canvas')!;
    expect(curve.getAttribute('aria-label')).toBe('Fitness curve: Version 1 at relative ascendency 0.412, fitness 0.365');
    expect(root.querySelectorAll('sw-web-diagram .compartments circle')).toHaveLength(2);
    expect(root.querySelectorAll('sw-web-diagram .flows path')).toHaveLength(1);
    const positions = Array.from(root.querySelectorAll('table[aria-label="Trophic positions"] tr.mat-mdc-row')).map((r) => r.textContent);
    expect(positions).toEqual([expect.stringContaining('Fish'), expect.stringContaining('Plankton')]);
  });

  it('explains why a draft has no indicators instead of failing the page', async () => {
    const { fixture, http } = await open();
    http.expectOne('/api/webs/w1/versions/v1').flush({ ...version('v1', 1, 'published'), webId: 'w1', web });
    await fixture.whenStable();
    http
      .expectOne('/api/webs/w1/versions/v1/analysis')
      .flush({ error: 'the web is not balanced', details: ['compartment "f" is unbalanced'] }, { status: 422, statusText: 'Unprocessable Entity' });
    await fixture.whenStable();
    fixture.detectChanges();
    const alert = fixture.nativeElement.querySelector('[role=alert]') as HTMLElement;
    expect(alert.textContent).toContain('the web is not balanced: compartment "f" is unbalanced');
    expect(fixture.nativeElement.querySelector('h1').textContent).toBe('Test bay');
  });

  it('says so when the web cannot be loaded', async () => {
    const fixture = TestBed.createComponent(WebPage);
    fixture.componentRef.setInput('id', 'nope');
    fixture.detectChanges();
    TestBed.inject(HttpTestingController).expectOne('/api/webs/nope').flush({ error: 'No web with this id' }, { status: 404, statusText: 'Not Found' });
    await fixture.whenStable();
    fixture.detectChanges();
    expect(fixture.nativeElement.querySelector('[role=alert]').textContent).toContain('No web with this id');
  });
});
