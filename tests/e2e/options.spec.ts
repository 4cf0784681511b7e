/// <reference lib="dom" />
import type { Page } from '@playwright/test';
import { expect, shot, signIn, test } from './support/fixtures';

/**
 * Workflow 3 of PRODUCT.md in the browser, as the demo analyst: build a harvest option on the
 * published demo baseline, see the engine refuse a catch the web cannot supply against that very
 * adjustment, fix it, see the preview, save, run it with uncertainty while the progress shows,
 * and open its result.
 */

const DEMO_WEB = 'Brannock Bay baseline (invented demo data)';
const OPTION = 'Hold the purse-seine catch of forage fish (e2e)';

/** Picks an entry of a Material select by its label, from the keyboard. */
async function choose(page: Page, scope: ReturnType<Page['getByRole']>, label: string, entry: string): Promise<void> {
  await scope.getByRole('combobox', { name: label }).focus();
  await page.keyboard.press('Enter');
  await page.getByRole('option', { name: entry, exact: true }).click();
}

test('build a harvest option: refused adjustment, fix, preview, save, run and open the result', async ({ page }) => {
  await signIn(page, 'analyst');
  await page.getByRole('link', { name: DEMO_WEB }).click();
  await expect(page.getByRole('heading', { level: 1, name: DEMO_WEB })).toBeVisible();
  const options = page.getByRole('list', { name: 'Harvest options' });
  await expect(options).toContainText('Cut the forage-fish quota by 40 %');
  await expect(options).toContainText('Shared with the council');
  await shot(page, 'options-on-web-page');

  await page.getByRole('link', { name: 'New harvest option' }).click();
  await expect(page).toHaveURL(/\/options\/new\?web=[^&]+&version=/);
  await expect(page.getByRole('heading', { level: 1, name: 'New harvest option' })).toBeVisible();
  await page.getByLabel('Name').fill(OPTION);
  await page.getByLabel('Purpose').fill('What if the purse seine kept landing forage fish on a fixed quota?');

  const adjustment = page.getByRole('group', { name: 'Adjustment 1' });
  await choose(page, adjustment, 'Kind', 'Set a catch to an amount');
  await choose(page, adjustment, 'Fleet', 'Purse seine');
  await choose(page, adjustment, 'Compartment', 'Small pelagic forage fish');
  // far beyond what the forage fish can supply: the engine's refusal stands against this adjustment
  await adjustment.getByLabel(/^Catch/).fill('5000');
  const problems = adjustment.getByRole('alert', { name: 'Problems with adjustment 1' });
  await expect(problems).toContainText('cannot supply a catch of 5000');
  await expect(page.getByRole('table', { name: 'Key indicators, before and after' })).toHaveCount(0);
  await shot(page, 'option-form-refused');

  await adjustment.getByLabel(/^Catch/).fill('0.5');
  await expect(problems).toHaveCount(0);
  const indicators = page.getByRole('table', { name: 'Key indicators, before and after' });
  await expect(indicators.getByRole('row', { name: /^Total catch/ })).toContainText('3.35');
  const fleets = page.getByRole('table', { name: 'Catch of each fleet, before and after' });
  await expect(fleets.getByRole('row', { name: /^Purse seine/ })).toContainText('0.500');
  await shot(page, 'option-form-preview');

  await page.getByRole('button', { name: 'Save option' }).click();
  await expect(page).toHaveURL(/\/options\/[0-9a-f-]+$/);
  await expect(page.getByRole('heading', { level: 1, name: OPTION })).toBeVisible();
  await expect(page.getByRole('list', { name: 'Adjustments' })).toHaveText("Set the Purse seine fleet's catch of Small pelagic forage fish to 0.5 g C m-2 y-1.");
  await expect(page.getByRole('link', { name: `version 1 of ${DEMO_WEB}` })).toBeVisible();
  await expect(page.getByRole('main').getByRole('note').filter({ hasText: 'indicative only' })).toBeVisible();
  await shot(page, 'option-page-saved');

  // not run yet, so it is edited in place
  await page.getByRole('link', { name: 'Edit', exact: true }).click();
  await expect(page.getByRole('heading', { level: 1, name: `Edit “${OPTION}”` })).toBeVisible();
  await expect(page.getByRole('group', { name: 'Adjustment 1' }).getByLabel(/^Catch/)).toHaveValue('0.5');
  await page.getByLabel('Purpose').fill('A fixed quota for the purse seine, whatever the forage fish do.');
  await page.getByRole('button', { name: 'Save option' }).click();
  await expect(page.getByRole('heading', { level: 1, name: OPTION })).toBeVisible();
  await expect(page.getByText('A fixed quota for the purse seine, whatever the forage fish do.')).toBeVisible();

  await page.getByLabel('Draws').fill('1000');
  await page.getByRole('button', { name: 'Run', exact: true }).click();
  await expect(page.getByRole('progressbar', { name: 'Progress of the run' })).toBeVisible();
  await shot(page, 'option-page-running');

  const runs = page.getByRole('table', { name: 'Runs' });
  await expect(runs.getByRole('row').nth(1)).toContainText('Done', { timeout: 60_000 });
  await expect(page.getByRole('progressbar', { name: 'Progress of the run' })).toHaveCount(0);
  await expect(runs.getByRole('row').nth(1)).toContainText('1,000');
  await shot(page, 'option-page-done');

  // shared for council review with the finished run, then withdrawn again
  await page.getByRole('button', { name: 'Share for council review' }).click();
  const shares = page.getByRole('list', { name: 'Active shares' });
  await expect(shares).toContainText('Shared for council review by Ana Demo (analyst)');
  await expect(page.getByRole('button', { name: 'Share for council review' })).toBeDisabled();
  await shot(page, 'option-page-shared');
  await shares.getByRole('button', { name: 'Withdraw' }).click();
  await expect(shares).toHaveCount(0);
  await expect(page.getByText('Not shared: only analysts can see this option.')).toBeVisible();

  // a run option keeps its inputs: it is duplicated to edit, and the copy can be deleted again
  await page.getByRole('button', { name: 'Duplicate to edit' }).click();
  await expect(page).toHaveURL(/\/options\/[0-9a-f-]+\/edit$/);
  await expect(page.getByLabel('Name')).toHaveValue(`${OPTION} (copy)`);
  await page.getByRole('button', { name: 'Save option' }).click();
  await expect(page.getByRole('heading', { level: 1, name: `${OPTION} (copy)` })).toBeVisible();
  await expect(page.getByText('Not run yet.')).toBeVisible();
  await page.getByRole('button', { name: 'Delete' }).click();
  const confirm = page.getByRole('dialog', { name: 'Delete this harvest option?' });
  await expect(confirm).toContainText('cannot be undone');
  await shot(page, 'option-delete-confirm');
  await confirm.getByRole('button', { name: 'Delete' }).click();
  await expect(page.getByRole('heading', { level: 1, name: DEMO_WEB })).toBeVisible();
  // once the list has loaded (the option itself is in it), the copy is not
  await expect(options.getByRole('link', { name: OPTION, exact: true })).toBeVisible();
  await expect(options.getByRole('link', { name: `${OPTION} (copy)` })).toHaveCount(0);
  await options.getByRole('link', { name: OPTION, exact: true }).click();
  await expect(page.getByRole('heading', { level: 1, name: OPTION })).toBeVisible();

  const open = runs.getByRole('link', { name: 'Open result' });
  await expect(open).toHaveAttribute('href', /^\/runs\/[0-9a-f-]+$/);
  await open.click();
  await expect(page).toHaveURL(/\/runs\/[0-9a-f-]+$/);
  await expect(page.getByRole('heading', { level: 1 })).toContainText(OPTION);
  await shot(page, 'run-result');
});

test('a council member sees the shared options, cannot run or share them, and compares two finished runs', async ({ page }) => {
  await signIn(page, 'council');
  await page.getByRole('link', { name: DEMO_WEB }).click();
  const options = page.getByRole('list', { name: 'Harvest options' });
  await expect(options).toContainText('Cut the forage-fish quota by 40 %');
  await expect(page.getByRole('link', { name: 'New harvest option' })).toHaveCount(0);

  await page.getByRole('link', { name: 'Cut the forage-fish quota by 40 %' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Cut the forage-fish quota by 40 %' })).toBeVisible();
  await expect(page.getByRole('list', { name: 'Adjustments' })).toHaveText("Cut the Purse seine fleet's catch of Small pelagic forage fish by 40 %.");
  await expect(page.getByRole('table', { name: 'Runs' }).getByRole('link', { name: 'Open result' }).first()).toBeVisible();
  await expect(page.getByRole('button', { name: 'Run', exact: true })).toHaveCount(0);
  await expect(page.getByRole('heading', { name: 'Sharing' })).toHaveCount(0);
  await expect(page.getByRole('button', { name: /Delete|Duplicate/ })).toHaveCount(0);
  await shot(page, 'option-page-council');

  await page.getByRole('link', { name: DEMO_WEB }).first().click();
  const compare = page.getByRole('button', { name: /^Compare/ });
  await expect(compare).toBeDisabled();
  await page.getByRole('checkbox', { name: 'Compare Cut the forage-fish quota by 40 %' }).check();
  await page.getByRole('checkbox', { name: 'Compare Close the set-gillnet fleet' }).check();
  await expect(compare).toHaveText(/Compare \(2\)/);
  await expect(compare).toBeEnabled();
  await shot(page, 'options-council-picked');
  // the compare page is another feature's: this checks the address it is given
  await compare.click();
  await expect(page).toHaveURL(/\/compare\?runs=[0-9a-f-]+(%2C|,)[0-9a-f-]+$/);
});
