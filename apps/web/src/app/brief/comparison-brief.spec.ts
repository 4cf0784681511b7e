import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { ComparisonBrief } from './comparison-brief';

describe('ComparisonBrief (print page)', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({ imports: [ComparisonBrief], providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
  });

  function open(runs: string) {
    const fixture = TestBed.createComponent(ComparisonBrief);
    fixture.componentRef.setInput('runs', runs);
    fixture.detectChanges();
    return { root: fixture.nativeElement as HTMLElement, http: TestBed.inject(HttpTestingController) };
  }

  for (const [what, runs] of [
    ['no runs', ''],
    ['one run', 'r-1'],
    ['seven runs', 'a,b,c,d,e,f,g'],
  ] as const) {
    it(`with ${what} says what a comparison brief needs, links to the compare page and asks the server nothing`, () => {
      const { root, http } = open(runs);
      expect(root.querySelector('h1')!.textContent).toBe('No comparison to brief');
      expect(root.querySelector('a[href="/compare"]')).not.toBeNull();
      http.expectNone((r) => r.url === '/api/comparisons/brief');
      http.verify();
    });
  }

  it('asks for the brief of 2 to 6 runs, in the order given', () => {
    const { root, http } = open('r-1, r-2');
    expect(root.querySelector('[role=status]')!.textContent).toContain('Preparing the brief…');
    expect(http.expectOne((r) => r.url === '/api/comparisons/brief').request.params.get('runs')).toBe('r-1,r-2');
  });
});
