import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { provideCharts, withDefaultRegisterables } from 'ng2-charts';
import type { CommentItem, RunDetail } from '@seinework/contracts';
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
    http.expectOne('/api/options/option-1').flush({ id: 'option-1', purpose: 'Let the fish grow', shares: [] });
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

  it('shows the comments that point at an indicator or a compartment beside their rows, and groups them below', async () => {
    const { fixture, http, root } = await open(fixtureRun('done', fixtureDocument()));
    const comment = (id: string, anchor: CommentItem['anchor'], text: string | null, hidden = false): CommentItem => ({
      id, optionId: 'option-1', audience: 'public', parentId: null, author: { id: 'u-1', name: 'Tamsin (demo)', role: 'stakeholder' },
      text, anchor, hidden, hiddenReason: null, createdAt: '2026-11-20T10:00:00.000Z', editedAt: null, editable: false,
    });
    const items = [
      comment('c-1', { kind: 'indicator', key: 'totalCatch' }, 'The catch <b>falls</b> too far'),
      comment('c-2', { kind: 'indicator', key: 'totalCatch' }, 'I agree'),
      comment('c-3', { kind: 'compartment', key: 'fish' }, 'What about the fish?'),
      comment('c-4', { kind: 'indicator', key: 'tst' }, null, true),
      comment('c-5', null, 'On the option as a whole'),
      { ...comment('c-6', null, 'An answer about the catch'), parentId: 'c-1' },
    ];
    http.expectOne((r) => r.url === '/api/options/option-1/comments').flush({
      items, total: items.length, page: 1, pageSize: 50,
      discussion: { audience: 'public', open: true, closedReason: null, closesAt: null, following: false },
    });
    await fixture.whenStable();
    fixture.detectChanges();

    // the reply goes with the comment it answers
    expect(root.querySelector('#indicator-totalCatch sw-comment-badge button')!.getAttribute('aria-label')).toBe('3 comments on this: show them');
    expect(root.querySelector('#indicator-card-totalCatch sw-comment-badge button')!.textContent).toContain('3');
    expect(root.querySelector('#compartment-fish sw-comment-badge button')!.getAttribute('aria-label')).toBe('1 comment on this: show them');
    // a comment whose text the reader may not see is not counted
    expect(root.querySelector('#indicator-tst sw-comment-badge button')).toBeNull();

    const section = root.querySelector('#comments')!;
    expect(section.querySelector('h2')!.textContent).toBe('Comments on this result');
    expect(section.textContent).toContain('4 comments of this option');
    expect(section.textContent).toContain('One more comment is about the option as a whole');
    const catchGroup = section.querySelector('#comments-indicator-totalCatch')!;
    expect(catchGroup.querySelector('h3')!.textContent).toBe('About Total catch');
    // shown as the characters typed, never as markup
    expect(catchGroup.textContent).toContain('The catch <b>falls</b> too far');
    expect(catchGroup.querySelector('b')).toBeNull();
    expect(catchGroup.textContent).toContain('An answer about the catch');
    expect(section.querySelector('#comments-compartment-fish h3')!.textContent).toBe('About compartment Fish');
    expect(root.querySelector('a[href="/discussions/option-1"]')).not.toBeNull();
    expect(Array.from(root.querySelectorAll('.toc button')).map((b) => b.textContent!.trim())).toContain('Comments');
  });

  it('shows no comments section when the option has no discussion for the reader', async () => {
    const { fixture, http, root } = await open(fixtureRun('done', fixtureDocument()));
    http.expectOne((r) => r.url === '/api/options/option-1/comments').flush({ error: 'Not shared with you' }, { status: 403, statusText: 'Forbidden' });
    await fixture.whenStable();
    fixture.detectChanges();
    expect(root.querySelector('#comments')).toBeNull();
    expect(root.querySelector('[role=alert]')).toBeNull();
    expect(root.querySelector('a[href="/discussions/option-1"]')).toBeNull();
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
