import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter } from '@angular/router';
import type { UploadProblem } from '@seinework/contracts';
import { UploadPage } from './upload-page';
import { UploadProblems } from './upload-problems';

const rowsOf = (root: HTMLElement) =>
  (Array.from(root.querySelectorAll('tr.mat-mdc-row')) as HTMLElement[]).map((tr) => Array.from(tr.querySelectorAll('td')).map((td) => td.textContent!.trim()));

describe('UploadProblems', () => {
  it('lists each problem against its table, row and column, in the order of the file', async () => {
    const fixture = TestBed.createComponent(UploadProblems);
    const problems: UploadProblem[] = [
      { table: 'flows', row: 7, column: 'to', problem: 'no compartment has the id "krill"' },
      { table: 'compartments', row: 3, column: 'kind', problem: 'kind must be one of producer, consumer, detritus' },
      { table: 'flows', row: 2, column: 'value', problem: 'flow value must not be negative' },
      { table: 'web', row: null, column: null, problem: 'the web table is missing' },
    ];
    fixture.componentRef.setInput('problems', problems);
    fixture.detectChanges();
    await fixture.whenStable();
    const root: HTMLElement = fixture.nativeElement;
    expect(root.querySelector('h2')!.textContent).toContain('4 problems were found');
    expect(rowsOf(root)).toEqual([
      ['web', '—', '—', 'the web table is missing'],
      ['compartments', '3', 'kind', 'kind must be one of producer, consumer, detritus'],
      ['flows', '2', 'value', 'flow value must not be negative'],
      ['flows', '7', 'to', 'no compartment has the id "krill"'],
    ]);
  });
});

describe('UploadPage', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({ imports: [UploadPage], providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([])] });
  });

  it('sends the file as multipart field "file" and shows the rows the server refused', async () => {
    const fixture = TestBed.createComponent(UploadPage);
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne((r) => r.url === '/api/webs').flush({ items: [], total: 0 });
    await fixture.whenStable();

    const input = fixture.nativeElement.querySelector('input[type=file]') as HTMLInputElement;
    const file = new File(['table,id,name\n'], 'bay.csv', { type: 'text/csv' });
    Object.defineProperty(input, 'files', { value: [file] });
    input.dispatchEvent(new Event('change'));
    const place = fixture.nativeElement.querySelector('input[name=place]') as HTMLInputElement;
    place.value = 'North shore';
    place.dispatchEvent(new Event('input'));
    fixture.detectChanges();
    (fixture.nativeElement.querySelector('form') as HTMLFormElement).dispatchEvent(new Event('submit'));

    const request = http.expectOne('/api/webs/upload');
    const body = request.request.body as FormData;
    expect((body.get('file') as File).name).toBe('bay.csv');
    expect(body.get('place')).toBe('North shore');
    expect(body.has('name')).toBe(false);
    request.flush(
      { error: 'The upload has problems', details: [{ table: 'flows', row: 4, column: 'to', problem: 'no compartment has the id "krill"' }] },
      { status: 422, statusText: 'Unprocessable Entity' },
    );
    await fixture.whenStable();
    fixture.detectChanges();
    const alert = fixture.nativeElement.querySelector('sw-upload-problems [role=alert]') as HTMLElement;
    expect(alert.querySelector('h2')!.textContent).toContain('one problem was found');
    expect(rowsOf(alert)).toEqual([['flows', '4', 'to', 'no compartment has the id "krill"']]);
  });

  it('asks for a file before sending anything', async () => {
    const fixture = TestBed.createComponent(UploadPage);
    fixture.detectChanges();
    const http = TestBed.inject(HttpTestingController);
    http.expectOne((r) => r.url === '/api/webs').flush({ items: [], total: 0 });
    (fixture.nativeElement.querySelector('form') as HTMLFormElement).dispatchEvent(new Event('submit'));
    fixture.detectChanges();
    await fixture.whenStable();
    expect(fixture.nativeElement.querySelector('[role=alert]').textContent).toContain('Choose a file');
    http.verify();
  });
});
