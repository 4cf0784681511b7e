/// <reference lib="dom" />
import { mkdirSync, readFileSync, statSync } from 'node:fs';
import { join, resolve } from 'node:path';
import type { APIRequestContext } from '@playwright/test';
import type { OptionBrief, OptionSummary, Page as ListPage, WebSummary } from '@seinework/contracts';
import { expect, shot, signIn, test } from './support/fixtures';

/**
 * Workflow 7 of PRODUCT.md: staff open the brief of an option shared for council review, print it
 * (the print layout rendered to PDF by Chromium) and download the server's PDF through its link.
 */

const OUT = resolve(import.meta.dirname, '../../test-results/brief');

/** The seeded forage-fish option (shared for council review), once its seeded run has finished. */
async function sharedForageOption(request: APIRequestContext): Promise<string> {
  const webs = (await (await request.get('/api/webs')).json()) as ListPage<WebSummary>;
  const web = webs.items.find((w) => w.published !== null)!;
  const list = (await (await request.get(`/api/webs/${web.id}/versions/${web.published!.id}/options`)).json()) as { items: OptionSummary[] };
  const option = list.items.find((o) => o.name.startsWith('Cut the forage-fish quota'))!;
  expect(option, 'the seeded forage-fish option is shared with staff').toBeTruthy();
  // the seed queues its runs; the server's queue computes them after start
  await expect.poll(async () => (await request.get(`/api/options/${option.id}/brief`)).status(), { timeout: 45_000, intervals: [500] }).toBe(200);
  return option.id;
}

test('staff print and download the brief of a shared option', async ({ page }) => {
  test.setTimeout(120_000);
  mkdirSync(OUT, { recursive: true });
  await signIn(page, 'staff');
  const optionId = await sharedForageOption(page.request);
  const brief = (await (await page.request.get(`/api/options/${optionId}/brief`)).json()) as OptionBrief;

  // from the option page, as staff would: its Brief link names the shared run
  await page.goto(`/options/${optionId}`);
  await expect(page.getByRole('heading', { level: 1, name: brief.option.name })).toBeVisible();
  await expect(page.getByRole('navigation', { name: 'About this option' }).getByRole('link', { name: 'Discussion' })).toHaveAttribute('href', `/discussions/${optionId}`);
  await shot(page, 'brief-from-option-page');
  await page.getByRole('navigation', { name: 'About this option' }).getByRole('link', { name: 'Brief' }).click();
  await expect(page).toHaveURL(new RegExp(`/brief/options/${optionId}\\?run=${brief.run.id}$`));
  await expect(page.getByRole('heading', { level: 1, name: brief.option.name })).toBeVisible();
  for (const heading of ['What the option changes', 'Where these numbers come from', 'Caution', 'Key indicators before and after', 'Where the web sits on the fitness curve', 'The trophic ladder', 'Who depends on whom: the largest changes', 'Fleet effects', 'Preferences recorded', 'Discussion']) {
    await expect(page.getByRole('heading', { level: 2, name: heading })).toBeVisible();
  }
  await expect(page.getByRole('article').getByRole('note')).toContainText('do not replace stock assessments');
  await expect(page.getByRole('img', { name: /^Fitness curve:/ })).toBeVisible();
  await expect(page.locator('svg[role="img"] polyline').first()).toBeAttached();
  await expect(page.getByText(brief.run.id).first()).toBeVisible();
  await shot(page, 'brief-option');

  // the print layout: no toolbar, A4 pages, rendered by Chromium
  await page.emulateMedia({ media: 'print' });
  await expect(page.locator('mat-toolbar')).toBeHidden();
  await expect(page.getByRole('button', { name: 'Print' })).toBeHidden();
  await shot(page, 'brief-option-print');
  const printed = join(OUT, 'option-brief-printed.pdf');
  await page.pdf({ path: printed, preferCSSPageSize: true, printBackground: true });
  const printedBytes = readFileSync(printed);
  expect(printedBytes.subarray(0, 5).toString()).toBe('%PDF-');
  expect(statSync(printed).size).toBeGreaterThan(20_000);
  // two A4 pages at least: the charts begin a new page
  expect((printedBytes.toString('latin1').match(/\/Type\s*\/Page[^s]/g) ?? []).length).toBeGreaterThanOrEqual(2);
  await page.emulateMedia({ media: 'screen' });

  const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download PDF' }).click()]);
  expect(download.suggestedFilename()).toMatch(/^brief-cut-the-forage-fish-quota.*\.pdf$/);
  const saved = join(OUT, download.suggestedFilename());
  await download.saveAs(saved);
  expect(readFileSync(saved).subarray(0, 4).toString()).toBe('%PDF');
});

test('staff print the brief of a comparison; council members are not offered briefs', async ({ page, browser }) => {
  await signIn(page, 'staff');
  const optionId = await sharedForageOption(page.request);
  const first = (await (await page.request.get(`/api/options/${optionId}/brief`)).json()) as OptionBrief;
  const webs = (await (await page.request.get('/api/webs')).json()) as ListPage<WebSummary>;
  const web = webs.items.find((w) => w.id === first.web.id)!;
  const list = (await (await page.request.get(`/api/webs/${web.id}/versions/${web.published!.id}/options`)).json()) as { items: OptionSummary[] };
  const other = list.items.find((o) => o.id !== optionId && o.latestRun !== null)!;
  await expect.poll(async () => (await page.request.get(`/api/options/${other.id}/brief`)).status(), { timeout: 45_000, intervals: [500] }).toBe(200);
  const second = (await (await page.request.get(`/api/options/${other.id}/brief`)).json()) as OptionBrief;

  // from the comparison, through its Brief link
  await page.goto(`/compare?runs=${first.run.id},${second.run.id}`);
  await expect(page.getByRole('heading', { level: 1, name: 'Comparison of 2 options' })).toBeVisible();
  await shot(page, 'brief-from-comparison');
  await page.getByRole('link', { name: 'Brief' }).click();
  await expect(page).toHaveURL(new RegExp(`/brief/compare\\?runs=${first.run.id}(,|%2C)${second.run.id}$`));
  await expect(page.getByRole('heading', { level: 1, name: 'Comparison of 2 harvest options' })).toBeVisible();
  await expect(page.getByRole('heading', { level: 3, name: `A. ${first.option.name}` })).toBeVisible();
  await expect(page.getByRole('heading', { level: 2, name: 'Indicators side by side' })).toBeVisible();
  await shot(page, 'brief-comparison');

  const council = await browser.newPage();
  await signIn(council, 'council');
  await council.goto(`/options/${optionId}`);
  await expect(council.getByRole('heading', { level: 1 })).toBeVisible();
  await expect(council.getByRole('link', { name: 'Brief' })).toHaveCount(0);
  await council.goto(`/brief/options/${optionId}`);
  await expect(council).toHaveURL(/\/webs/);
  await council.close();
});
