import { TestBed } from '@angular/core/testing';
import { Component } from '@angular/core';
import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter, Router } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { SessionStore } from './session-store';
import { sessionEndedInterceptor } from './session-ended-interceptor';

@Component({ template: 'page' })
class Page {}

describe('sessionEndedInterceptor', () => {
  let http: HttpClient;
  let backend: HttpTestingController;
  let router: Router;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(withInterceptors([sessionEndedInterceptor])), provideHttpClientTesting(), provideRouter([{ path: '**', component: Page }])],
    });
    http = TestBed.inject(HttpClient);
    backend = TestBed.inject(HttpTestingController);
    router = TestBed.inject(Router);
    TestBed.inject(SessionStore).signedInAs({ id: 'a', email: 'admin@demo.test', name: 'Ada', role: 'admin' });
    await router.navigateByUrl('/admin/users?page=2');
  });

  it('sends the person to sign in when the session has ended, and back here afterwards', async () => {
    const answer = firstValueFrom(http.get('/api/admin/users'));
    backend.expectOne('/api/admin/users').flush({ error: 'Sign in first' }, { status: 401, statusText: 'Unauthorized' });
    await expect(answer).rejects.toMatchObject({ status: 401 });
    await vi.waitFor(() => expect(router.url).toBe('/sign-in?returnTo=%2Fadmin%2Fusers%3Fpage%3D2'));
    expect(TestBed.inject(SessionStore).user()).toBeNull();
    expect(TestBed.inject(SessionStore).ended()).toBe(true);
  });

  it('leaves a wrong password on the sign-in route to the sign-in page', async () => {
    const answer = firstValueFrom(http.post('/api/auth/sign-in', {}));
    backend.expectOne('/api/auth/sign-in').flush({ error: 'Wrong e-mail or password' }, { status: 401, statusText: 'Unauthorized' });
    await expect(answer).rejects.toMatchObject({ status: 401 });
    expect(router.url).toBe('/admin/users?page=2');
  });

  it('passes other refusals through untouched', async () => {
    const answer = firstValueFrom(http.get('/api/admin/users'));
    backend.expectOne('/api/admin/users').flush({ error: 'not for you' }, { status: 403, statusText: 'Forbidden' });
    await expect(answer).rejects.toMatchObject({ status: 403 });
    expect(router.url).toBe('/admin/users?page=2');
    expect(TestBed.inject(SessionStore).user()).not.toBeNull();
  });
});
