import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import type { InvitationSummary, Page } from '@seinework/contracts';
import { InvitationsPage } from './invitations-page';

const waiting: InvitationSummary = {
  id: 'i1',
  email: 'skipper@example.test',
  role: 'council',
  invitedBy: 'Ada',
  createdAt: '2026-12-01T09:00:00Z',
  expiresAt: '2999-12-08T09:00:00Z',
  acceptedAt: null,
};

describe('InvitationsPage', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ imports: [InvitationsPage], providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  async function render(first: Page<InvitationSummary>) {
    const fixture = TestBed.createComponent(InvitationsPage);
    fixture.detectChanges();
    http.expectOne((r) => r.url === '/api/admin/invitations' && r.method === 'GET').flush(first);
    const settle = async () => {
      await fixture.whenStable();
      fixture.detectChanges();
    };
    await settle();
    return { fixture, element: fixture.nativeElement as HTMLElement, settle };
  }

  it('says so when no invitation has been sent', async () => {
    const { element } = await render({ items: [], total: 0 });
    expect(element.querySelector('[role=status]')?.textContent).toContain('No invitations have been sent yet.');
  });

  it('lists invitations with their status and offers to revoke a waiting one', async () => {
    const accepted = { ...waiting, id: 'i2', email: 'deckhand@example.test', acceptedAt: '2026-12-02T10:00:00Z' };
    const { element } = await render({ items: [waiting, accepted], total: 2 });
    const rows = Array.from(element.querySelectorAll('tr.mat-mdc-row')).map((r) => r.textContent ?? '');
    expect(rows[0]).toContain('skipper@example.test');
    expect(rows[0]).toContain('Council member');
    expect(rows[0]).toContain('Waiting');
    expect(rows[0]).toContain('Revoke');
    expect(rows[1]).toContain('Accepted');
    expect(rows[1]).not.toContain('Revoke');
  });

  it('sends an invitation with the chosen role, then shows the list again', async () => {
    const { element, settle } = await render({ items: [], total: 0 });
    const email = element.querySelector('input[type=email]') as HTMLInputElement;
    email.value = 'skipper@example.test';
    email.dispatchEvent(new Event('input'));
    (element.querySelector('button[type=submit]') as HTMLButtonElement).click();
    const sent = http.expectOne((r) => r.url === '/api/admin/invitations' && r.method === 'POST');
    expect(sent.request.body).toEqual({ email: 'skipper@example.test', role: 'analyst' });
    sent.flush({ id: 'i1' }, { status: 201, statusText: 'Created' });
    await vi.waitFor(() => http.expectOne((r) => r.url === '/api/admin/invitations' && r.method === 'GET').flush({ items: [waiting], total: 1 }));
    await vi.waitFor(async () => {
      await settle();
      expect(element.textContent).toContain('An invitation is on its way to skipper@example.test.');
    });
    expect(email.value).toBe('');
  });

  it('shows the server\'s reason when an invitation is refused', async () => {
    const { element, settle } = await render({ items: [], total: 0 });
    const email = element.querySelector('input[type=email]') as HTMLInputElement;
    email.value = 'analyst@demo.test';
    email.dispatchEvent(new Event('input'));
    (element.querySelector('button[type=submit]') as HTMLButtonElement).click();
    http
      .expectOne((r) => r.method === 'POST')
      .flush({ error: 'analyst@demo.test already has an account' }, { status: 409, statusText: 'Conflict' });
    await vi.waitFor(async () => {
      await settle();
      expect(element.querySelector('[role=alert]')?.textContent).toContain('The invitation was not sent: analyst@demo.test already has an account');
    });
  });
});
