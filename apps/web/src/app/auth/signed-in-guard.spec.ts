import { TestBed } from '@angular/core/testing';
import { Component } from '@angular/core';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter, Router } from '@angular/router';
import type { CurrentUser } from '@seinework/contracts';
import { allowedTo, safeReturnTo, signedInGuard } from './signed-in-guard';
import { SessionStore } from './session-store';

@Component({ template: 'page' })
class Page {}

const council: CurrentUser = { id: 'c1', email: 'council@demo.test', name: 'Cora Uncil', role: 'council' };

describe('signedInGuard', () => {
  let router: Router;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([
          { path: 'sign-in', component: Page },
          { path: 'webs', component: Page, canActivate: [signedInGuard] },
          { path: 'admin', component: Page, canActivate: [allowedTo('users.manage')] },
          { path: 'welcome', component: Page, canActivate: [signedInGuard] },
        ]),
      ],
    });
    router = TestBed.inject(Router);
    http = TestBed.inject(HttpTestingController);
  });

  async function navigate(url: string, me: CurrentUser | null): Promise<string> {
    const navigation = router.navigateByUrl(url);
    const request = await vi.waitFor(() => http.expectOne('/api/me'));
    if (me) request.flush(me);
    else request.flush({ error: 'Sign in first' }, { status: 401, statusText: 'Unauthorized' });
    await navigation;
    return router.url;
  }

  it('sends someone signed out to sign in, remembering where they were going', async () => {
    await expect(navigate('/webs?sort=name', null)).resolves.toBe('/sign-in?returnTo=%2Fwebs%3Fsort%3Dname');
  });

  it('lets a signed-in person through', async () => {
    await expect(navigate('/webs', council)).resolves.toBe('/webs');
  });

  it('keeps a role away from pages for an action it may not take', async () => {
    await expect(navigate('/admin', council)).resolves.toBe('/webs');
  });

  it('sends a role that reads no webs to the welcome page, not to a list it would be refused', async () => {
    await expect(navigate('/admin', { ...council, role: 'stakeholder' })).resolves.toBe('/welcome');
  });

  it('lets an admin onto the admin pages', async () => {
    await expect(navigate('/admin', { ...council, role: 'admin' })).resolves.toBe('/admin');
  });

  it('asks the server only once, not on every navigation', async () => {
    await navigate('/webs', council);
    await router.navigateByUrl('/admin');
    http.expectNone('/api/me');
    expect(TestBed.inject(SessionStore).user()).toEqual(council);
  });
});

describe('safeReturnTo', () => {
  it('follows addresses inside the app only', () => {
    expect(safeReturnTo('/webs/7')).toBe('/webs/7');
    expect(safeReturnTo('//elsewhere.example/steal')).toBe('/webs');
    expect(safeReturnTo('/\\elsewhere.example')).toBe('/webs');
    expect(safeReturnTo('https://elsewhere.example')).toBe('/webs');
    expect(safeReturnTo(undefined)).toBe('/webs');
  });
});
