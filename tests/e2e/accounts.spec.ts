import { ROLES, type Role } from '@seinework/contracts';
import { can } from '@seinework/contracts/permissions';
import { DEMO_PASSWORD, demoEmail, expect, landingPage, shot, signIn, signOut, test } from './support/fixtures';
import { asAdmin, linkFromOutbox } from './support/outbox';

/**
 * Accounts in the browser: each role signs in and sees what it may do; a wrong password; an
 * invitation and a password reset followed from the message the local mail catcher received.
 */

const ROLE_LABELS: Record<Role, string> = { admin: 'Administrator', analyst: 'Analyst', council: 'Council member', stakeholder: 'Stakeholder', staff: 'Staff' };

test.describe('each role signs in and sees what it may do', () => {
  for (const role of ROLES) {
    test(`${role}`, async ({ page }) => {
      await signIn(page, role);
      const toolbar = page.getByRole('banner');
      await expect(toolbar.getByRole('button', { name: /^Account of / })).toContainText(ROLE_LABELS[role]);
      const websLink = toolbar.getByRole('link', { name: 'Webs' });
      if (can(role, 'webs.read-published')) await expect(websLink).toBeVisible();
      else await expect(websLink).toHaveCount(0);
      const adminLink = toolbar.getByRole('link', { name: 'Admin' });
      if (role === 'admin') await expect(adminLink).toBeVisible();
      else await expect(adminLink).toHaveCount(0);
      const upload = page.getByRole('link', { name: /upload a web/i });
      if (role === 'analyst' || role === 'admin') await expect(upload.first()).toBeVisible();
      else await expect(upload).toHaveCount(0);
      await shot(page, `landing-as-${role}`);

      if (role !== 'admin') {
        // the admin pages are refused even when typed in: back to the role's own first page
        await page.goto('/admin/users');
        await expect(page).toHaveURL(landingPage(role));
      }
      await signOut(page);
      // signed out, the app's pages send the person back to sign in
      await page.goto('/webs');
      await expect(page).toHaveURL(/\/sign-in\?returnTo=%2Fwebs/);
    });
  }
});

test('a wrong password is refused with a plain message', async ({ page }) => {
  await page.goto('/sign-in');
  await shot(page, 'sign-in');
  await page.getByLabel('E-mail address').fill(demoEmail('council'));
  await page.getByLabel('Password').fill('not-the-password');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('alert')).toContainText('do not match an active account');
  await expect(page).toHaveURL(/\/sign-in/);
  await expect(page.getByLabel('Password')).toHaveValue('');
  await shot(page, 'sign-in-wrong-password');
});

test('after sign-in the person lands on the page they asked for', async ({ page }) => {
  await page.goto('/admin/audit');
  await expect(page).toHaveURL(/\/sign-in\?returnTo=%2Fadmin%2Faudit/);
  await page.getByLabel('E-mail address').fill(demoEmail('admin'));
  await page.getByLabel('Password').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(/\/admin\/audit$/);
  await expect(page.getByRole('heading', { name: 'Audit log' })).toBeVisible();
  // the log has rows, or says it has none yet
  await expect(page.getByRole('table', { name: 'Audit log' }).or(page.getByText('Nothing has been changed yet.'))).toBeVisible();
  await shot(page, 'admin-audit');
  await page.getByRole('tab', { name: 'Users' }).click();
  await expect(page.getByRole('table', { name: 'Users' })).toContainText('analyst@demo.test');
  await shot(page, 'admin-users');
});

test('an admin invites someone, who follows the e-mailed link, sets name and password and is signed in', async ({ page, browser, request }) => {
  const invitee = `new.member.${Date.now()}@example.test`;
  await signIn(page, 'admin');
  await page.getByRole('banner').getByRole('link', { name: 'Admin' }).click();
  await page.getByRole('tab', { name: 'Invitations' }).click();
  await expect(page).toHaveURL(/\/admin\/invitations$/);
  await page.getByLabel('E-mail address').fill(invitee);
  await page.getByLabel('Role').click();
  await page.getByRole('option', { name: 'Council member' }).click();
  await page.getByRole('button', { name: 'Send invitation' }).click();
  await expect(page.getByText(`An invitation is on its way to ${invitee}.`)).toBeVisible();
  const row = page.getByRole('row', { name: new RegExp(invitee.replace(/\./g, '\\.')) });
  await expect(row).toContainText('Waiting');
  await shot(page, 'admin-invitations');

  const { message, link } = await linkFromOutbox(await asAdmin(request), invitee, '/invitation/');
  expect(message.subject.length).toBeGreaterThan(0);
  await page.getByRole('tab', { name: 'Outbox' }).click();
  await page.getByRole('button', { name: new RegExp(message.subject.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')) }).first().click();
  await expect(page.getByText(link).first()).toBeVisible();
  await shot(page, 'admin-outbox');

  // the invited person, in a browser of their own
  const theirs = await browser.newContext();
  const invited = await theirs.newPage();
  await invited.goto(link);
  await expect(invited.getByRole('heading', { name: 'Join Seinework' })).toBeVisible();
  await expect(invited.getByText(invitee)).toBeVisible();
  await expect(invited.getByText('Council member')).toBeVisible();
  await invited.getByLabel('Your name').fill('Morwenna Tidewell');
  await invited.getByLabel('Password', { exact: true }).fill('short');
  await invited.getByLabel('Password again').fill('different');
  await invited.getByRole('button', { name: 'Create my account' }).click();
  await expect(invited.getByText('The two passwords differ.')).toBeVisible();
  await shot(invited, 'invitation-form-problems');
  await invited.getByLabel('Password', { exact: true }).fill('a tide that turns twice');
  await invited.getByLabel('Password again').fill('a tide that turns twice');
  await invited.getByRole('button', { name: 'Create my account' }).click();
  await expect(invited).toHaveURL(/\/webs(\?|$)/);
  await expect(invited.getByRole('button', { name: /^Account of Morwenna Tidewell, Council member/ })).toBeVisible();
  await expect(invited.getByRole('banner').getByRole('link', { name: 'Admin' })).toHaveCount(0);
  await shot(invited, 'webs-as-invited-council-member');

  // the link worked once
  const newcomer = await theirs.newPage();
  await newcomer.goto(link);
  await expect(newcomer.getByRole('alert')).toContainText('This invitation cannot be used');
  await shot(newcomer, 'invitation-used');
  await newcomer.close();

  await page.getByRole('tab', { name: 'Invitations' }).click();
  const inviteeRow = new RegExp(invitee.replace(/\./g, '\\.'));
  await expect(page.getByRole('row', { name: inviteeRow })).toContainText('Accepted');

  // the admin gives the newcomer another role, then stops them signing in: their open page is sent to sign in
  await page.getByRole('tab', { name: 'Users' }).click();
  await page.getByRole('combobox', { name: 'Role of Morwenna Tidewell' }).click();
  await page.getByRole('option', { name: 'Analyst' }).click();
  await expect(page.getByText("Morwenna Tidewell's role is now Analyst.")).toBeVisible();
  await page.getByRole('switch', { name: 'Active: Morwenna Tidewell' }).click();
  await expect(page.getByText('Morwenna Tidewell can no longer sign in.')).toBeVisible();
  await expect(page.getByRole('switch', { name: 'Deactivated: Morwenna Tidewell' })).not.toBeChecked();
  await shot(page, 'admin-users-deactivated');
  // the page still thinks they are signed in; opening their account asks the server (their e-mail settings), which says the session is over
  await invited.getByRole('button', { name: /^Account of / }).click();
  await invited.getByRole('menuitem', { name: 'Account and password' }).click();
  await expect(invited).toHaveURL(/\/sign-in\?returnTo=%2Faccount/);
  await expect(invited.getByText('Your session has ended.')).toBeVisible();
  await shot(invited, 'sign-in-after-session-ended');
  await theirs.close();
});

test('a forgotten password is reset through the e-mailed link, then changed back on the account page', async ({ page, request }) => {
  const account = demoEmail('stakeholder');
  const temporary = 'a brand new harbour password';
  await page.goto('/sign-in');
  await page.getByRole('link', { name: 'Forgot your password?' }).click();
  await expect(page).toHaveURL(/\/reset-password$/);
  await page.getByLabel('E-mail address').fill(account);
  await page.getByRole('button', { name: 'Send the link' }).click();
  await expect(page.getByRole('status')).toContainText(`If an account uses ${account}`);
  await shot(page, 'reset-password-requested');

  const { link } = await linkFromOutbox(await asAdmin(request), account, '/reset-password/');
  await page.goto(link);
  await expect(page.getByRole('heading', { name: 'Choose a new password' })).toBeVisible();
  await page.getByLabel('New password', { exact: true }).fill(temporary);
  await page.getByLabel('New password again').fill(temporary);
  await shot(page, 'reset-password-form');
  await page.getByRole('button', { name: 'Set the password' }).click();
  await expect(page.getByRole('status')).toContainText('Your password has been changed');
  await page.getByRole('link', { name: 'Sign in' }).click();

  await signIn(page, 'stakeholder', temporary);
  await page.getByRole('button', { name: /^Account of / }).click();
  await page.getByRole('menuitem', { name: 'Account and password' }).click();
  await expect(page).toHaveURL(/\/account$/);
  // the account menu names the account too: look in the page itself
  await expect(page.locator('main').getByText(account)).toBeVisible();
  await page.getByLabel('Current password').fill(temporary);
  await page.getByLabel('New password', { exact: true }).fill(DEMO_PASSWORD);
  await page.getByLabel('New password again').fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Change password' }).click();
  await expect(page.getByRole('status')).toContainText('Your password has been changed.');
  await shot(page, 'account');
  await signOut(page);
  await signIn(page, 'stakeholder');
});

test('signing in and out works from the keyboard alone', async ({ page }) => {
  await page.goto('/sign-in');
  await page.keyboard.press('Tab');
  await expect(page.getByRole('link', { name: 'Skip to the page' })).toBeFocused();
  await page.getByLabel('E-mail address').focus();
  await page.keyboard.type(demoEmail('council'));
  await shot(page, 'keyboard-focus-sign-in');
  await page.keyboard.press('Tab');
  await expect(page.getByLabel('Password')).toBeFocused();
  await page.keyboard.type(DEMO_PASSWORD);
  await page.keyboard.press('Enter');
  await expect(page).toHaveURL(landingPage('council'));

  const account = page.getByRole('button', { name: /^Account of / });
  await account.focus();
  await shot(page, 'keyboard-focus-toolbar');
  await page.keyboard.press('Enter');
  await expect(page.getByRole('menuitem', { name: 'Sign out' })).toBeVisible();
  await page.keyboard.press('ArrowUp');
  await expect(page.getByRole('menuitem', { name: 'Sign out' })).toBeFocused();
  await shot(page, 'keyboard-focus-account-menu');
  await page.keyboard.press('Enter');
  await expect(page).toHaveURL(/\/sign-in/);
});

test('at 200 % zoom the toolbar wraps and the pages do not spill sideways', async ({ browser, baseURL }) => {
  // 640 × 400 CSS pixels at twice the density is a 1280 × 800 screen zoomed to 200 %
  const zoomed = await browser.newContext({ baseURL, viewport: { width: 640, height: 400 }, deviceScaleFactor: 2 });
  const page = await zoomed.newPage();
  await page.goto('/sign-in');
  await shot(page, 'zoom-200-sign-in');
  await signIn(page, 'admin');
  for (const [path, heading] of [
    ['/admin/users', 'Users'],
    ['/admin/invitations', 'Invitations'],
    ['/admin/audit', 'Audit log'],
    ['/admin/outbox', 'Outbox'],
    ['/account', 'Your account'],
  ]) {
    await page.goto(path);
    await expect(page.getByRole('heading', { name: heading, exact: true })).toBeVisible();
    const toolbar = page.getByRole('banner');
    await expect(toolbar.getByRole('link', { name: 'Admin' })).toBeInViewport();
    await expect(toolbar.getByRole('button', { name: /^Account of / })).toBeInViewport();
    const spill = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(spill, `${path} is wider than the window`).toBeLessThanOrEqual(0);
    await shot(page, `zoom-200${path.replace(/\//g, '-')}`);
  }
  await zoomed.close();
});
