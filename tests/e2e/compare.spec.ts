/// <reference lib="dom" />
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from '@playwright/test';
import type { Web } from '@seinework/contracts';
import { expect, shot, signIn, test } from './support/fixtures';

/**
 * Workflow 5 of PRODUCT.md in the browser, as the demo council member: open Compare options from
 * the navigation, pick the demo baseline and the three options shared for council review, compare
 * them, sort by a column, and record a preference with a reason that then shows in the list.
 */

const demo = JSON.parse(readFileSync(join(import.meta.dirname, '../../seeds/brannock-bay.json'), 'utf8')) as Web;
const SHARED = ['Cut the forage-fish quota by 40 %', 'Close the set-gillnet fleet', 'Raise the mid-water predator quota by 25 %'];

function watchForErrors(page: Page): string[] {
  const problems: string[] = [];
  page.on('pageerror', (error) => problems.push(error.message));
  page.on('console', (message) => {
    if (message.type() === 'error' && !message.text().startsWith('Failed to load resource')) problems.push(message.text());
  });
  return problems;
}

/** The seed queues the shared options' runs as the server starts: wait until all three have finished. */
async function sharedRunsDone(page: Page): Promise<void> {
  await expect
    .poll(
      async () => {
        const webs = await (await page.request.get('/api/webs')).json();
        const web = webs.items.find((w: { name: string }) => w.name === demo.name);
        const options = await (await page.request.get(`/api/webs/${web.id}/versions/${web.published.id}/options`)).json();
        return options.items.filter((o: { latestRun: { status: string } | null }) => o.latestRun?.status === 'done').length;
      },
      { timeout: 45_000 },
    )
    .toBe(SHARED.length);
}

test('a council member compares the shared options and records a preference', async ({ page }) => {
  test.setTimeout(120_000);
  const problems = watchForErrors(page);
  await signIn(page, 'council');
  await sharedRunsDone(page);
  await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Compare options' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Compare options' })).toBeVisible();

  // the demo has one published web: it and its newest published version are chosen already
  await expect(page.getByRole('combobox', { name: 'Web' })).toContainText(demo.name);
  await expect(page.getByRole('combobox', { name: 'Baseline (published version)' })).toContainText('Version 1');
  const compare = page.getByRole('button', { name: 'Compare', exact: true });
  await expect(compare).toBeDisabled();
  for (const name of SHARED) await page.getByRole('checkbox', { name }).check();
  await expect(page.getByText('3 of 6 ticked')).toBeVisible();
  await shot(page, 'compare-picker');

  await compare.click();
  await expect(page).toHaveURL(/\/compare\?runs=[^,]+,[^,]+,[^,]+$/);
  await expect(page.getByRole('heading', { level: 1, name: 'Comparison of 3 options' })).toBeVisible();
  const runs = page.getByRole('region', { name: 'The compared runs' });
  for (const name of SHARED) await expect(runs.getByRole('link', { name })).toHaveAttribute('href', /^\/options\//);
  await expect(runs).toContainText('500 draws');
  await expect(page.getByRole('main').getByRole('note')).toContainText('do not replace stock assessments');

  const table = page.getByRole('table', { name: 'Indicators side by side' });
  const rows = table.locator('tbody tr');
  await expect(rows).toHaveCount(17);
  // the forage-fish cut lowers the total catch by 0.48, beyond the uncertainty
  const catchRow = rows.filter({ hasText: 'Total catch' });
  await expect(catchRow.getByRole('cell').nth(1)).toHaveText('3.35');
  await expect(catchRow.getByRole('cell').nth(3)).toContainText('−0.48');
  await expect(catchRow.getByRole('cell').nth(3)).toContainText('exceeds uncertainty');
  await expect(page.getByText(/means the whole 5–95 % band of the difference lies on one side of zero/)).toBeVisible();

  // sort by the baseline, largest first: development capacity leads
  const baselineHeader = table.getByRole('columnheader', { name: 'Baseline', exact: true });
  await baselineHeader.click();
  await baselineHeader.click();
  await expect(baselineHeader).toHaveAttribute('aria-sort', 'descending');
  await expect(rows.first().getByRole('cell').first()).toHaveText(`Development capacity ${demo.unit}·bits`);
  // the row without a baseline (Fishing-in-Balance exists only as a change) stays last
  await expect(rows.last().getByRole('cell').first()).toHaveText('Fishing-in-Balance');

  // each chart has its figures as a table behind it
  await page.getByText('The figures of this chart').first().click();
  await expect(page.getByRole('table', { name: 'Relative ascendency: change per option' }).getByRole('row')).toHaveCount(4);
  await page.getByText('The figures of these charts').click();
  const positions = page.getByRole('table', { name: 'Positions on the fitness curve' });
  await expect(positions.getByRole('row')).toHaveCount(5);
  await expect(positions.getByRole('row', { name: /Baseline/ })).toContainText('0.34372');
  await expect(page.getByText('No council member has recorded a preference among these options yet.')).toBeVisible();
  await shot(page, 'compare-comparison');

  // a preference needs a reason; then it is listed with the member's name
  const form = page.getByRole('form', { name: 'Record your preference' });
  await form.getByRole('radio', { name: /Close the set-gillnet fleet/ }).check();
  await form.getByRole('button', { name: 'Record preference' }).click();
  await expect(form.getByText('Say why you prefer this option.')).toBeVisible();
  const reason = 'Closing the set-gillnet fleet cuts the primary production the catch needs most, and the change is well beyond the uncertainty.';
  await form.getByLabel('Your reason').fill(reason);
  await form.getByRole('button', { name: 'Record preference' }).click();
  await expect(form.getByRole('status')).toHaveText('Your preference was recorded.');
  const listed = page.getByRole('list', { name: "The council's preferences" }).getByRole('listitem');
  await expect(listed).toHaveCount(1);
  await expect(listed).toContainText('Cole Demo (council member)');
  await expect(listed).toContainText('prefers option B, Close the set-gillnet fleet');
  await expect(listed).toContainText(reason);
  await expect(form.getByLabel('Your reason')).toHaveValue('');
  await shot(page, 'compare-preference-recorded');

  // the URL is the comparison: opened afresh it shows the same runs and the recorded preference
  await page.reload();
  await expect(page.getByRole('list', { name: "The council's preferences" })).toContainText(reason);

  // back to the picker on the same baseline, with the compared options still ticked
  await page.getByRole('button', { name: 'Change the options' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Compare options' })).toBeVisible();
  for (const name of SHARED) await expect(page.getByRole('checkbox', { name })).toBeChecked();
  await shot(page, 'compare-picker-again');

  // at twice the zoom (half the width) the table scrolls in its own frame and the page does not
  await page.goBack();
  await page.setViewportSize({ width: 640, height: 800 });
  await expect(table).toBeVisible();
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(640);
  await shot(page, 'compare-comparison-narrow');

  expect(problems).toEqual([]);
});

test('runs that cannot be compared say why, in the server’s words', async ({ page }) => {
  await signIn(page, 'council');
  await page.goto('/compare?runs=no-such-run,another');
  await expect(page.getByRole('alert')).toContainText('These runs could not be compared: No such run: no-such-run, another');
  await expect(page.getByRole('link', { name: 'Choose the options again' })).toBeVisible();
  await shot(page, 'compare-error');
});

test('the navigation offers Compare options only to roles that read options', async ({ page }) => {
  await signIn(page, 'stakeholder');
  await expect(page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Compare options' })).toHaveCount(0);
});
