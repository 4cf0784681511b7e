import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { provideCharts, withDefaultRegisterables } from 'ng2-charts';
import type { Role, WebDetail } from '@seinework/contracts';
import { SessionStore } from '../auth/session-store';
import { ComparePage } from './compare-page';
import { COMPARISON } from './test-comparison';

const web: WebDetail = {
  id: 'w1',
  name: 'Test bay',
  place: '',
  period: '',
  unit: 'g C m-2 y-1',
  createdBy: 'Ana Lyst',
  createdAt: '2026-03-01T10:00:00Z',
  versions: [{ id: 'v1', number: 4, status: 'published', note: '', createdBy: 'Ana', createdAt: '2026-03-01T10:00:00Z', publishedBy: 'Ana', publishedAt: '2026-03-01T10:00:00Z', basedOn: null }],
};

describe('ComparePage', () => {
  async function open(role: Role, runs: string) {
    TestBed.configureTestingModule({
      imports: [ComparePage],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([]), provideCharts(withDefaultRegisterables())],
    });
    TestBed.inject(SessionStore).signedInAs({ id: 'u1', email: `${role}@demo.test`, name: 'Cole', role });
    const fixture = TestBed.createComponent(ComparePage);
    fixture.componentRef.setInput('runs', runs);
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    return { fixture, http, root: fixture.nativeElement as HTMLElement };
  }

  async function answer(fixture: Awaited<ReturnType<typeof open>>['fixture'], http: HttpTestingController) {
    http.expectOne((r) => r.url === '/api/comparisons' && r.params.get('runs') === 'r1,r2').flush(COMPARISON);
    await fixture.whenStable();
    http.expectOne('/api/webs/w1').flush(web);
    await fixture.whenStable();
    fixture.detectChanges();
  }

  it('heads each run with its option, run, draws and seed, and carries the caution', async () => {
    const { fixture, http, root } = await open('council', 'r1, r2');
    expect(root.querySelector('mat-progress-bar')).not.toBeNull();
    await answer(fixture, http);
    expect(root.querySelector('h1')!.textContent).toBe('Comparison of 2 options');
    expect(root.querySelector('.on-baseline')!.textContent!.replace(/\s+/g, ' ')).toContain('Test bay, version 4');
    const heads = Array.from(root.querySelectorAll('[aria-label="The compared runs"] article'));
    expect(heads).toHaveLength(2);
    expect(heads[0].querySelector('h2 a')!.getAttribute('href')).toBe('/options/o1');
    expect(heads[0].querySelector('.facts a')!.getAttribute('href')).toBe('/runs/r1');
    expect(heads[0].textContent).toContain('500 draws');
    expect(heads[0].textContent).toContain('seed 7');
    expect(root.querySelector('sw-caution')!.textContent).toContain('do not replace stock assessments');
    expect(root.querySelectorAll('sw-comparison-charts figure canvas').length).toBeGreaterThan(0);
    expect(root.querySelector('form[aria-labelledby=record-heading]')).not.toBeNull();
  });

  it('offers the preference form only to roles that record preferences', async () => {
    const { fixture, http, root } = await open('staff', 'r1,r2');
    await answer(fixture, http);
    expect(root.textContent).toContain("The council's preferences");
    expect(root.querySelector('form[aria-labelledby=record-heading]')).toBeNull();
  });

  it("says why runs cannot be compared, in the server's words", async () => {
    const { fixture, http, root } = await open('council', 'r1,r2');
    http
      .expectOne((r) => r.url === '/api/comparisons')
      .flush({ error: 'Only finished runs can be compared', details: ['run r2 ("Close the gillnets") is running'] }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    fixture.detectChanges();
    expect(root.querySelector('[role=alert]')!.textContent).toContain('These runs could not be compared: Only finished runs can be compared: run r2 ("Close the gillnets") is running');
    expect(root.querySelector('h1')!.textContent).toBe('Comparison');
    expect(root.querySelector('sw-indicator-table')).toBeNull();
  });
});
