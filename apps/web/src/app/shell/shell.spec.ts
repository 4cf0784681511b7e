import { TestBed } from '@angular/core/testing';
import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { provideRouter, Router } from '@angular/router';
import { Component } from '@angular/core';
import type { CurrentUser, Role } from '@seinework/contracts';
import { SessionStore } from '../auth/session-store';
import { PAGE_CARRIES_CAUTION } from '../shared/caution';
import { Shell } from './shell';

@Component({ template: 'page' })
class Page {}

function person(role: Role): CurrentUser {
  return { id: `${role}-1`, email: `${role}@demo.test`, name: `Demo ${role}`, role };
}

describe('Shell', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({
      imports: [Shell],
      providers: [
        provideHttpClient(),
        provideHttpClientTesting(),
        provideRouter([
          { path: 'runs/:id', component: Page, data: PAGE_CARRIES_CAUTION },
          { path: '**', component: Page },
        ]),
      ],
    });
  });

  async function render(user: CurrentUser | null) {
    if (user) TestBed.inject(SessionStore).signedInAs(user);
    const fixture = TestBed.createComponent(Shell);
    fixture.detectChanges();
    await fixture.whenStable();
    const element: HTMLElement = fixture.nativeElement;
    const links = Array.from(element.querySelectorAll('nav a')).map((a) => a.textContent?.trim());
    return { fixture, element, links };
  }

  it('shows the admin link to an admin only', async () => {
    expect((await render(person('admin'))).links).toEqual(['Webs', 'Compare options', 'Discussions', 'Admin']);
  });

  it('shows an analyst the webs and not the admin pages', async () => {
    expect((await render(person('analyst'))).links).toEqual(['Webs', 'Compare options', 'Discussions']);
  });

  it('offers the comparison of options to the roles that read them', async () => {
    expect((await render(person('council'))).links).toEqual(['Webs', 'Compare options', 'Discussions']);
  });

  it('shows a stakeholder no list of webs it would be refused, only the discussions open to them', async () => {
    expect((await render(person('stakeholder'))).links).toEqual(['Discussions']);
  });

  it('names the signed-in person and their role in the toolbar', async () => {
    const { element } = await render(person('council'));
    const account = element.querySelector('mat-toolbar button') as HTMLButtonElement;
    expect(account.textContent).toContain('Demo council');
    expect(account.textContent).toContain('Council member');
    expect(account.getAttribute('aria-label')).toBe('Account of Demo council, Council member');
  });

  it('shows no navigation to someone signed out, and always the caution', async () => {
    const { element, links } = await render(null);
    expect(links).toEqual([]);
    expect(element.querySelector('sw-caution')?.textContent).toContain('indicative only');
  });

  it('leaves the caution to the pages that say it beside their results, so it is said once', async () => {
    const { fixture, element } = await render(person('council'));
    await TestBed.inject(Router).navigateByUrl('/webs');
    fixture.detectChanges();
    expect(element.querySelector('footer sw-caution')).not.toBeNull();
    await TestBed.inject(Router).navigateByUrl('/runs/r-1');
    fixture.detectChanges();
    expect(element.querySelector('footer sw-caution')).toBeNull();
  });

  it('signs out and goes to the sign-in page', async () => {
    const { fixture, element } = await render(person('staff'));
    (element.querySelector('mat-toolbar button') as HTMLButtonElement).click();
    fixture.detectChanges();
    const signOut = Array.from(document.querySelectorAll('[mat-menu-item]')).find((b) => b.textContent?.includes('Sign out')) as HTMLButtonElement;
    signOut.click();
    TestBed.inject(HttpTestingController).expectOne('/api/auth/sign-out').flush({});
    await vi.waitFor(() => expect(TestBed.inject(Router).url).toBe('/sign-in'));
    expect(TestBed.inject(SessionStore).user()).toBeNull();
  });
});
