/// <reference lib="dom" />
import { readFile } from 'node:fs/promises';
import type { Page } from '@playwright/test';
import type { OptionSummary, Page as Paged, WebSummary } from '@seinework/contracts';
import { expect, shot, signIn, test } from './support/fixtures';

/**
 * The result page of a run (issue 8, item 3), as a council member sees it: the seeded options
 * shared for council review, each with a finished run of 500 draws.
 */

function watchForErrors(page: Page): string[] {
  const problems: string[] = [];
  page.on('pageerror', (error) => problems.push(error.message));
  page.on('console', (message) => {
    if (message.type() === 'error' && !message.text().startsWith('Failed to load resource')) problems.push(message.text());
  });
  return problems;
}

/** The shared options the signed-in account can read, found through the API. */
async function sharedOptions(page: Page): Promise<OptionSummary[]> {
  const webs = (await (await page.request.get('/api/webs')).json()) as Paged<WebSummary>;
  const options: OptionSummary[] = [];
  for (const web of webs.items) {
    if (!web.published) continue;
    const answer = await page.request.get(`/api/webs/${web.id}/versions/${web.published.id}/options`);
    expect(answer.ok()).toBe(true);
    options.push(...((await answer.json()) as { items: OptionSummary[] }).items);
  }
  return options;
}

test('a council member reads the result of a shared option: indicators with bands, curve, ladder, dependence, fleets, CSV', async ({ page }) => {
  const problems = watchForErrors(page);
  await signIn(page, 'council');
  const options = await sharedOptions(page);
  expect(options.length).toBe(3);
  const forage = options.find((o) => o.name.startsWith('Cut the forage-fish quota'));
  expect(forage?.latestRun?.status).toBe('done');
  const runId = forage!.latestRun!.id;

  await page.goto(`/runs/${runId}`);
  await expect(page.getByRole('heading', { level: 1 })).toHaveText(`${forage!.name} — result`);
  await expect(page).toHaveTitle(`${forage!.name} — result — Seinework`);
  const facts = page.getByRole('definition');
  await expect(page.locator('.facts')).toContainText('Brannock Bay baseline (invented demo data), version 1');
  await expect(page.locator('.facts')).toContainText(runId);
  await expect(page.locator('.facts')).toContainText('20261202');
  await expect(page.locator('.facts')).toContainText('500');
  await expect(facts.filter({ hasText: 'seinework' })).toBeVisible();
  await expect(page.getByRole('link', { name: 'Open the option' })).toHaveAttribute('href', `/options/${forage!.id}`);
  await expect(page.locator('#main').getByRole('note')).toContainText('indicative only');
  await shot(page, 'result-forage-fish');

  // the discussion's comments beside what they point at (the demo discussion: the catch, the seabirds, the forage fish)
  const catchBadge = page.locator('#indicator-totalCatch sw-comment-badge button');
  await expect(catchBadge).toHaveAccessibleName(/^\d+ comments? on this: show them$/);
  await expect(page.locator('#compartment-seabirds sw-comment-badge button')).toBeVisible();
  await catchBadge.click();
  const catchComments = page.locator('#comments-indicator-totalCatch');
  await expect(catchComments).toBeInViewport();
  await expect(catchComments).toContainText('Forty per cent off the purse-seine quota');
  await expect(page.locator('#comments')).not.toContainText('landing over his quota'); // hidden by staff: not shown to council members
  await shot(page, 'result-comments');
  await expect(page.locator('#main').getByRole('link', { name: 'Discussion', exact: true })).toHaveAttribute('href', `/discussions/${forage!.id}`);
  await expect(page.getByRole('link', { name: 'Brief' })).toHaveCount(0); // briefs are for analysts, staff and admins
  await catchComments.getByRole('button', { name: 'Show it in the result' }).click();
  await expect(page.locator('#indicator-totalCatch')).toBeInViewport();
  // a comment's link (#compartment-…) opens the page at that row
  await page.goto(`/runs/${runId}#compartment-forage-fish`);
  await expect(page.locator('#compartment-forage-fish')).toBeInViewport();
  await page.goto(`/runs/${runId}`);

  // key indicators: a band for each, and the robust mark in words where the band excludes zero
  const run = await (await page.request.get(`/api/runs/${runId}`)).json();
  const catchBand = run.result.uncertainty.indicators.totalCatch.difference;
  expect(catchBand.p95).toBeLessThan(0); // the demo's catch falls in every draw: robust
  const catchRow = page.locator('#indicator-totalCatch');
  await expect(catchRow).toContainText('Total catch');
  await expect(catchRow).toContainText('Robust');
  await expect(catchRow).toContainText(' to ');
  const indicatorRows = page.getByRole('table', { name: 'Every indicator before and after the option' }).locator('tbody tr');
  await expect(indicatorRows).toHaveCount(16);
  const robustKeys: string[] = Object.entries(run.result.uncertainty.indicators as Record<string, { difference: { p5: number; p95: number } }>)
    .filter(([, u]) => u.difference.p5 > 0 || u.difference.p95 < 0)
    .map(([key]) => key);
  for (const key of Object.keys(run.result.uncertainty.indicators)) {
    const mark = page.locator(`#indicator-${key} .mark`);
    await expect(mark).toHaveCount(robustKeys.includes(key) ? 1 : 0);
  }
  const card = page.locator('#indicator-card-totalCatch');
  await expect(card).toContainText('Before');
  const p5 = `−${Math.abs(catchBand.p5).toFixed(3)}`;
  const p95 = `−${Math.abs(catchBand.p95).toFixed(3)}`;
  await expect(card).toContainText(`9 draws in 10 put the change between ${p5} and ${p95}`);
  await expect(catchRow).toContainText(`${p5} to ${p95}`);

  // the fitness curve, drawn, with its table
  const curve = page.locator('sw-result-fitness-curve canvas');
  await expect(curve).toHaveAttribute('aria-label', /Baseline at relative ascendency 0\.34.*With the option/);
  await expect(page.getByRole('table', { name: /on the fitness curve/ })).toContainText('With the option');
  await page.getByRole('radio', { name: 'Close up on the two points' }).click();
  await expect(page.getByRole('radio', { name: 'Close up on the two points' })).toBeChecked();
  await curve.scrollIntoViewIfNeeded();
  await shot(page, 'result-fitness-close-up');

  // the trophic ladder, as a chart and a table
  await expect(page.locator('sw-ladder-chart canvas')).toHaveAttribute('aria-label', /transfer efficiency per level/);
  const ladder = page.getByRole('table', { name: /Trophic ladder before and after/ });
  await expect(ladder.locator('tbody tr').first()).toContainText('I');
  await expect(page.locator('#compartment-forage-fish')).toContainText('Small pelagic forage fish');

  // diet dependence: largest change first, sortable
  const dependence = page.getByRole('table', { name: 'Largest changes of indirect diet dependence' });
  await expect(dependence.locator('tbody tr')).toHaveCount(25);
  await dependence.getByRole('button', { name: 'Food of' }).click();
  // the click re-sorts on the next change detection: poll until the column reads in order
  const foodOf = dependence.locator('tbody tr td:nth-child(2)');
  await expect
    .poll(async () => {
      const names = (await foodOf.allTextContents()).map((name) => name.trim());
      return names.join('|') === [...names].sort((a, b) => a.localeCompare(b, 'en-GB')).join('|');
    })
    .toBe(true);
  await expect(page.getByRole('table', { name: /Change of indirect diet dependence/ })).toBeVisible();

  // fleet effects and the fleet table
  const effects = page.getByRole('table', { name: 'Mixed trophic impact of each fleet on each compartment' });
  await expect(effects.locator('tbody tr')).toHaveCount(4);
  await expect(effects).toContainText('Purse seine');
  const fleets = page.getByRole('table', { name: /per fleet/ });
  await expect(fleets.locator('#fleet-purse-seine')).toContainText('→');

  // recycling and the harvest sensitivity of the baseline
  await expect(page.getByRole('table', { name: 'Cycling before and after the option' })).toContainText('Finn cycling index');
  await expect(page.getByRole('table', { name: /Harvest sensitivity of the baseline/ }).locator('tbody tr').first()).toBeVisible();

  // one CSV, with the header line the table export promises
  const download = page.waitForEvent('download');
  await page.getByRole('button', { name: 'Download every indicator as CSV' }).click();
  const file = await download;
  expect(file.suggestedFilename()).toBe(`run-${runId.slice(0, 8)}-key-indicators.csv`);
  const csv = await readFile((await file.path())!, 'utf8');
  expect(csv.split('\r\n')[0]).toBe('indicator,key,before,after,difference,difference p5,difference median,difference p95,robust');
  expect(csv).toContain(`Total catch,totalCatch,${run.result.baseline.totalCatch},`);

  // the workbook of every table
  const workbook = page.waitForEvent('download');
  await page.getByRole('button', { name: 'Download every table (XLSX)' }).click();
  const xlsx = await workbook;
  expect(xlsx.suggestedFilename()).toBe(`run-${runId.slice(0, 8)}.xlsx`);
  const bytes = await readFile((await xlsx.path())!);
  expect(bytes.subarray(0, 2).toString()).toBe('PK');

  await shot(page, 'result-forage-fish-after-sorting');
  expect(problems).toEqual([]);
});

test('the other shared runs show, and a run that does not exist says so', async ({ page }) => {
  const problems = watchForErrors(page);
  await signIn(page, 'council');
  const options = await sharedOptions(page);
  for (const option of options.filter((o) => !o.name.startsWith('Cut the forage-fish quota'))) {
    await page.goto(`/runs/${option.latestRun!.id}`);
    await expect(page.getByRole('heading', { level: 1 })).toHaveText(`${option.name} — result`);
    await expect(page.getByRole('table', { name: 'Every indicator before and after the option' }).locator('tbody tr')).toHaveCount(16);
    await shot(page, `result-${option.name.slice(0, 30)}`);
  }
  // on a tablet held upright: nothing may stick out of the page; wide tables scroll in their own box
  await page.setViewportSize({ width: 768, height: 1024 });
  await page.goto(`/runs/${options[0].latestRun!.id}`);
  await expect(page.getByRole('table', { name: 'Every indicator before and after the option' })).toBeVisible();
  expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(768);
  await shot(page, 'result-tablet');
  await page.setViewportSize({ width: 1280, height: 800 });

  await page.goto('/runs/00000000-0000-4000-8000-000000000000');
  await expect(page.getByRole('alert')).toContainText('No such run');
  await shot(page, 'result-no-such-run');
  expect(problems).toEqual([]);
});
