/// <reference lib="dom" />
import { test as base, expect, type Page } from '@playwright/test';
import { mkdirSync } from 'node:fs';
import { join, resolve } from 'node:path';
import type { Role } from '@seinework/contracts';
import { can } from '@seinework/contracts/permissions';
import { baseUrl } from './server-under-test';

/**
 * What every end-to-end spec imports instead of @playwright/test: `baseURL` points at the server
 * global setup started, so `page.goto('/webs')` and `page.request.get('/api/…')` reach it.
 */
export const test = base.extend({
  baseURL: async ({}, use) => {
    await use(baseUrl());
  },
});
export { expect };

export const DEMO_PASSWORD = 'seinework-demo';
export const demoEmail = (role: Role) => `${role}@demo.test`;

/** Signs in through the sign-in page as the demo account of a role and waits for its first page. */
export async function signIn(page: Page, role: Role, password = DEMO_PASSWORD): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail address').fill(demoEmail(role));
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page).toHaveURL(landingPage(role));
}

/** Where a role lands after sign-in: the list of webs, or the welcome page for a role that reads none. */
export function landingPage(role: Role): RegExp {
  return can(role, 'webs.read-published') ? /\/webs(\?|$)/ : /\/welcome$/;
}

/** Signs out through the account menu of the toolbar and waits for the sign-in page. */
export async function signOut(page: Page): Promise<void> {
  await page.getByRole('button', { name: /^Account of / }).click();
  await page.getByRole('menuitem', { name: 'Sign out' }).click();
  await expect(page).toHaveURL(/\/sign-in/);
}

export const SCREENSHOT_DIR = resolve(import.meta.dirname, '../screenshots');

/** A full-page screenshot in tests/e2e/screenshots/<name>.png (git-ignored), once the page has settled. */
export async function shot(page: Page, name: string): Promise<string> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const path = join(SCREENSHOT_DIR, `${name.replace(/[^a-z0-9-]+/gi, '-')}.png`);
  await page.waitForLoadState('networkidle');
  await page.evaluate(() => document.fonts.ready);
  await page.screenshot({ path, fullPage: true });
  return path;
}
