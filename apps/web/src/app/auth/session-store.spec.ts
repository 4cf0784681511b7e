import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import type { CurrentUser } from '@seinework/contracts';
import { SessionStore } from './session-store';

const analyst: CurrentUser = { id: 'u1', email: 'analyst@demo.test', name: 'Ana Lyst', role: 'analyst' };

describe('SessionStore', () => {
  let store: InstanceType<typeof SessionStore>;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    store = TestBed.inject(SessionStore);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('loads the signed-in person and answers what their role may do', async () => {
    const loading = store.load();
    http.expectOne('/api/me').flush(analyst);
    await loading;
    expect(store.user()).toEqual(analyst);
    expect(store.checked()).toBe(true);
    expect(store.can('webs.create')).toBe(true);
    expect(store.can('users.manage')).toBe(false);
  });

  it('takes a 401 from /api/me as nobody signed in, not as a problem', async () => {
    const loading = store.load();
    http.expectOne('/api/me').flush({ error: 'Sign in first' }, { status: 401, statusText: 'Unauthorized' });
    await loading;
    expect(store.user()).toBeNull();
    expect(store.error()).toBeNull();
    expect(store.can('webs.read-published')).toBe(false);
  });

  it('asks the server once however many callers wait for the check', async () => {
    const first = store.ensureChecked();
    const second = store.ensureChecked();
    http.expectOne('/api/me').flush(analyst);
    await Promise.all([first, second]);
    await store.ensureChecked();
    http.expectNone('/api/me');
  });

  it('signs in with the e-mail address and password', async () => {
    const signingIn = store.signIn('analyst@demo.test', 'seinework-demo');
    const request = http.expectOne('/api/auth/sign-in');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ email: 'analyst@demo.test', password: 'seinework-demo' });
    request.flush(analyst);
    await expect(signingIn).resolves.toBe(true);
    expect(store.user()?.name).toBe('Ana Lyst');
  });

  it('says plainly when the password is wrong', async () => {
    const signingIn = store.signIn('analyst@demo.test', 'wrong');
    http.expectOne('/api/auth/sign-in').flush({ error: 'Wrong e-mail or password' }, { status: 401, statusText: 'Unauthorized' });
    await expect(signingIn).resolves.toBe(false);
    expect(store.user()).toBeNull();
    expect(store.error()).toBe('That e-mail address and password do not match an active account.');
  });

  it('says how long to wait once sign-in attempts are rate-limited', async () => {
    const signingIn = store.signIn('analyst@demo.test', 'wrong');
    http
      .expectOne('/api/auth/sign-in')
      .flush({ error: 'Too many sign-in attempts' }, { status: 429, statusText: 'Too Many Requests', headers: { 'Retry-After': '540' } });
    await signingIn;
    expect(store.error()).toBe('Too many attempts. Try again in 9 minutes.');
  });

  it('forgets the person on sign-out even when the server has already ended the session', async () => {
    store.signedInAs(analyst);
    const signingOut = store.signOut();
    http.expectOne('/api/auth/sign-out').flush({ error: 'Sign in first' }, { status: 401, statusText: 'Unauthorized' });
    await signingOut;
    expect(store.user()).toBeNull();
  });
});
