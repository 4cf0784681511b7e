import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import { OptionBrief } from './option-brief';

describe('OptionBrief (print page)', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({ imports: [OptionBrief], providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
  });

  function open(run?: string) {
    const fixture = TestBed.createComponent(OptionBrief);
    fixture.componentRef.setInput('id', 'o-1');
    if (run) fixture.componentRef.setInput('run', run);
    fixture.detectChanges();
    return { fixture, root: fixture.nativeElement as HTMLElement, http: TestBed.inject(HttpTestingController) };
  }

  it('says it is preparing the brief while the server makes it, for the run asked for', () => {
    const { root, http } = open('r-7');
    expect(root.querySelector('[role=status]')!.textContent).toContain('Preparing the brief…');
    expect(root.querySelector('article')).toBeNull();
    const request = http.expectOne((r) => r.url === '/api/options/o-1/brief');
    expect(request.request.params.get('run')).toBe('r-7');
  });

  it('says why there is no brief, in the server’s words, and offers no print or download', async () => {
    const { fixture, root, http } = open();
    http.expectOne((r) => r.url === '/api/options/o-1/brief').flush({ error: 'This option has no finished run yet: a brief shows a finished run (run the option first)' }, { status: 409, statusText: 'Conflict' });
    await fixture.whenStable();
    fixture.detectChanges();
    const alert = root.querySelector('[role=alert]')!;
    expect(alert.querySelector('h1')!.textContent).toBe('No brief for this option');
    expect(alert.textContent).toContain('This option has no finished run yet');
    expect(root.querySelector('[role=status]')).toBeNull();
    expect(root.querySelector('sw-brief-actions')).toBeNull();
  });
});
