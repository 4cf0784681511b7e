import { TestBed } from '@angular/core/testing';
import { Component } from '@angular/core';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter, Router } from '@angular/router';
import { SignIn } from './sign-in';

@Component({ template: 'page' })
class Page {}

describe('SignIn', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [SignIn],
      providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([{ path: '**', component: Page }])],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  async function render(returnTo?: string) {
    const fixture = TestBed.createComponent(SignIn);
    if (returnTo) fixture.componentRef.setInput('returnTo', returnTo);
    fixture.detectChanges();
    await fixture.whenStable();
    const element: HTMLElement = fixture.nativeElement;
    const type = (label: string, value: string) => {
      const input = element.querySelector(`input[autocomplete="${label}"]`) as HTMLInputElement;
      input.value = value;
      input.dispatchEvent(new Event('input'));
    };
    const submit = async () => {
      (element.querySelector('button[type=submit]') as HTMLButtonElement).click();
      fixture.detectChanges();
    };
    const settle = async () => {
      await fixture.whenStable();
      fixture.detectChanges();
    };
    return { fixture, element, type, submit, settle };
  }

  it('labels its fields', async () => {
    const { element } = await render();
    const labels = Array.from(element.querySelectorAll('mat-label')).map((l) => l.textContent?.trim());
    expect(labels).toEqual(['E-mail address', 'Password']);
  });

  it('does not send an empty form, and says what is missing', async () => {
    const { element, submit, settle } = await render();
    await submit();
    await settle();
    http.expectNone('/api/auth/sign-in');
    expect(element.textContent).toContain('Enter your e-mail address.');
    expect(element.textContent).toContain('Enter your password.');
  });

  it('signs in and goes back where the person was heading', async () => {
    const { type, submit } = await render('/webs/3');
    type('username', ' analyst@demo.test ');
    type('current-password', 'seinework-demo');
    await submit();
    const request = http.expectOne('/api/auth/sign-in');
    expect(request.request.body).toEqual({ email: 'analyst@demo.test', password: 'seinework-demo' });
    request.flush({ id: 'u1', email: 'analyst@demo.test', name: 'Ana Lyst', role: 'analyst' });
    await vi.waitFor(() => expect(TestBed.inject(Router).url).toBe('/webs/3'));
  });

  it('shows a wrong password as a plain alert and clears the password', async () => {
    const { element, type, submit, settle } = await render();
    type('username', 'analyst@demo.test');
    type('current-password', 'not-it');
    await submit();
    http.expectOne('/api/auth/sign-in').flush({ error: 'Wrong e-mail or password' }, { status: 401, statusText: 'Unauthorized' });
    await vi.waitFor(async () => {
      await settle();
      expect(element.querySelector('[role=alert]')?.textContent).toContain('do not match an active account');
    });
    expect((element.querySelector('input[autocomplete="current-password"]') as HTMLInputElement).value).toBe('');
    expect(TestBed.inject(Router).url).toBe('/');
  });

  it('says how long to wait when there were too many attempts', async () => {
    const { element, type, submit, settle } = await render();
    type('username', 'analyst@demo.test');
    type('current-password', 'not-it');
    await submit();
    http
      .expectOne('/api/auth/sign-in')
      .flush({ error: 'Too many sign-in attempts' }, { status: 429, statusText: 'Too Many Requests', headers: { 'Retry-After': '30' } });
    await vi.waitFor(async () => {
      await settle();
      expect(element.querySelector('[role=alert]')?.textContent).toContain('Too many attempts. Try again in 30 seconds.');
    });
  });
});
