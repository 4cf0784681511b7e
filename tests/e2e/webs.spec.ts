/// <reference lib="dom" />
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from '@playwright/test';
import type { Web } from '@seinework/contracts';
import { analyzeWeb } from '@seinework/network-analysis';
import { expect, shot, signIn, test } from './support/fixtures';

/**
 * Workflows 1 and 2 of PRODUCT.md in the browser, as the demo analyst: bring in a baseline from an
 * upload with an error, fix it, balance, save and publish; then clone a published baseline and
 * edit a flow. Also what the first screen used to check: a web page shows the headline
 * indicators, a painted fitness curve, the trophic positions and the caution.
 */

const fixtures = join(import.meta.dirname, 'fixtures');
const demo = JSON.parse(readFileSync(join(import.meta.dirname, '../../seeds/brannock-bay.json'), 'utf8')) as Web;
const CREEK = 'Heronsgate Creek (invented test web)';

/** Errors the page itself raised; a refused request (422) is an answer the page shows, not a fault. */
function watchForErrors(page: Page): string[] {
  const problems: string[] = [];
  page.on('pageerror', (error) => problems.push(error.message));
  page.on('console', (message) => {
    if (message.type() === 'error' && !message.text().startsWith('Failed to load resource')) problems.push(message.text());
  });
  return problems;
}

test('bring in a baseline: upload with an error, fix it, balance, save and publish', async ({ page }) => {
  const problems = watchForErrors(page);
  await signIn(page, 'analyst');
  await expect(page.getByRole('heading', { level: 1, name: 'Webs' })).toBeVisible();
  await expect(page.getByRole('table', { name: 'Webs' })).toContainText(demo.name);
  await shot(page, 'webs-list');

  await page.getByRole('link', { name: 'Upload a web' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Upload a web' })).toBeVisible();
  await page.getByLabel('Place').fill('Heronsgate, north shore');
  await page.getByLabel('Period').fill('2021–2023');
  await page.getByLabel('Note for this version').fill('Survey tables as received');
  // the filled-in example of the layout is a published web's own export, in each format
  for (const format of ['Workbook (XLSX)', 'CSV', 'WEB.json']) {
    const href = await page.getByRole('link', { name: format }).getAttribute('href');
    const file = await page.request.get(href!);
    expect(file.status()).toBe(200);
    expect(file.headers()['content-disposition']).toMatch(/^attachment/);
  }
  await shot(page, 'upload');

  // one flow names a compartment the web does not have: refused, against its row and column
  await page.locator('input[type=file]').setInputFiles(join(fixtures, 'heronsgate-creek-with-error.csv'));
  await expect(page.getByText('heronsgate-creek-with-error.csv')).toBeVisible();
  await page.getByRole('button', { name: 'Upload', exact: true }).click();
  const refused = page.getByRole('alert').filter({ has: page.getByRole('heading', { name: /Nothing was stored/ }) });
  await expect(refused.getByRole('heading')).toHaveText('Nothing was stored: one problem was found');
  const row = refused.getByRole('row').filter({ hasText: 'eels' });
  await expect(row.getByRole('cell')).toHaveText(['flows', '11', 'to', 'unknown compartment "eels"']);
  await expect(page).toHaveURL(/\/webs\/upload$/);
  await shot(page, 'upload-problems');

  // the corrected file goes in as a new web whose first version is a draft
  await page.locator('input[type=file]').setInputFiles(join(fixtures, 'heronsgate-creek.csv'));
  await page.getByRole('button', { name: 'Upload', exact: true }).click();
  await expect(page.getByRole('heading', { level: 1, name: CREEK })).toBeVisible();
  await expect(page).toHaveURL(/\/webs\/[^/]+\?version=/);
  const versions = page.getByRole('table', { name: 'Versions' });
  await expect(versions.getByRole('row')).toHaveCount(2);
  await expect(versions).toContainText('Draft');
  await expect(versions).toContainText('Survey tables as received');
  // an unbalanced draft has no indicators yet, and the page says why
  await expect(page.getByRole('alert')).toContainText('unbalanced');
  await shot(page, 'web-page-uploaded-draft');

  await page.getByRole('link', { name: 'Edit as a new draft' }).click();
  await expect(page.getByRole('heading', { level: 1, name: `Edit ${CREEK}` })).toBeVisible();
  const balance = page.getByRole('region', { name: 'Balance of each compartment' });
  await expect(balance.getByRole('status')).toHaveText('2 of 4 compartments are out of balance.');
  await expect(balance.getByRole('row', { name: /Mullet/ })).toContainText('0.5');
  await shot(page, 'editor-uploaded-draft');

  await page.getByRole('radio', { name: /Smallest change/ }).check();
  await page.getByRole('button', { name: 'Balance', exact: true }).click();
  const changes = page.getByRole('region', { name: 'What balancing would change' });
  await expect(changes.getByRole('table')).toBeVisible();
  await expect(changes.getByRole('row').nth(1)).toBeVisible();
  await shot(page, 'editor-balance-preview');
  await changes.getByRole('button', { name: 'Take these changes' }).click();
  await expect(balance.getByRole('status')).toHaveText('Every compartment is balanced: inputs equal outputs.');

  await page.getByLabel('Note for the new version').fill('Balanced by the smallest change');
  await page.getByRole('button', { name: 'Save as a new draft' }).click();
  await expect(page.getByText('Saved as a new draft.')).toBeVisible();
  await shot(page, 'editor-saved');
  await page.getByRole('button', { name: 'Publish' }).click();

  // back on the web page: version 2 is the published baseline, with its indicators and diagram
  await expect(page.getByRole('heading', { level: 1, name: CREEK })).toBeVisible();
  const selected = page.getByRole('region', { name: 'Version 2' });
  await expect(selected.getByText('Published', { exact: true })).toBeVisible();
  await expect(selected.getByRole('region', { name: 'Headline indicators' })).toContainText('Relative ascendency');
  await expect(selected.locator('sw-web-diagram svg[role=img] circle')).toHaveCount(4);
  await expect(versions.getByRole('row').filter({ hasText: 'Version 2' })).toContainText('version 1');
  await shot(page, 'web-page-published');
  expect(problems).toEqual([]);
});

test('clone a published baseline into a new web and edit a flow', async ({ page }) => {
  const problems = watchForErrors(page);
  await signIn(page, 'analyst');
  await page.getByRole('link', { name: demo.name }).click();
  await expect(page.getByRole('heading', { level: 1, name: demo.name })).toBeVisible();

  // the first screen's checks, now on the web page of the demo baseline
  const expected = analyzeWeb(demo);
  const headline = page.getByRole('region', { name: 'Headline indicators' });
  await expect(headline).toContainText(expected.relativeAscendency.toFixed(3));
  await expect(headline).toContainText('Finn cycling index');
  await expect(page.getByRole('table', { name: 'Trophic positions' }).getByRole('row')).toHaveCount(demo.compartments.length + 1);
  await expect(page.locator('body')).toContainText('steady state and are indicative only');
  const curve = page.locator('sw-fitness-curve canvas');
  await expect(curve).toHaveAttribute('aria-label', new RegExp(`relative ascendency ${expected.relativeAscendency.toFixed(3)}`));
  const painted = await curve.evaluate((canvas: HTMLCanvasElement) => {
    const { data } = canvas.getContext('2d')!.getImageData(0, 0, canvas.width, canvas.height);
    let count = 0;
    for (let i = 3; i < data.length; i += 4) if (data[i] > 0) count++;
    return count;
  });
  expect(painted).toBeGreaterThan(1000);
  await expect(page.locator('sw-web-diagram svg[role=img] circle')).toHaveCount(demo.compartments.length);
  await shot(page, 'web-page-demo-baseline');

  await page.getByRole('button', { name: 'More for version 1' }).click();
  await shot(page, 'web-page-version-menu');
  await page.getByRole('menuitem', { name: 'Clone into a new web' }).click();
  const dialog = page.getByRole('dialog', { name: 'Clone into a new web' });
  await dialog.getByLabel('Name of the new web').fill('Brannock Bay, wetter years');
  await dialog.getByLabel('Period').fill('2010–2014');
  await shot(page, 'clone-dialog');
  await dialog.getByRole('button', { name: 'Clone' }).click();

  await expect(page.getByRole('heading', { level: 1, name: 'Brannock Bay, wetter years' })).toBeVisible();
  const versions = page.getByRole('table', { name: 'Versions' });
  await expect(versions.getByRole('row')).toHaveCount(2);
  await expect(versions).toContainText('Draft');
  await shot(page, 'web-page-clone');

  await page.getByRole('link', { name: 'Edit as a new draft' }).click();
  const balance = page.getByRole('region', { name: 'Balance of each compartment' });
  await expect(balance.getByRole('status')).toHaveText('Every compartment is balanced: inputs equal outputs.');
  await page.getByRole('tab', { name: /^Flows/ }).click();
  const firstFlow = demo.flows[0];
  const value = page.getByRole('textbox', { name: 'flow 1, Flow' });
  await expect(value).toHaveValue(String(firstFlow.value));
  await value.fill(String(firstFlow.value + 20));
  // the balance follows the typing: both ends of the flow are now out of balance
  await expect(balance.getByRole('status')).toHaveText(`2 of ${demo.compartments.length} compartments are out of balance.`);
  const names = new Map(demo.compartments.map((c) => [c.id, c.name]));
  await expect(balance.getByRole('row', { name: new RegExp(names.get(firstFlow.to)!) })).toContainText('20');
  await shot(page, 'editor-clone-edited');

  // leaving with unsaved edits asks first; staying keeps them
  const asked = new Promise<string>((answered) =>
    page.once('dialog', async (dialog) => {
      answered(dialog.message());
      await dialog.dismiss();
    }),
  );
  await page.getByRole('navigation', { name: 'Where you are' }).getByRole('link', { name: 'Webs' }).click();
  expect(await asked).toContain('not saved');
  await expect(value).toHaveValue(String(firstFlow.value + 20));

  await page.getByLabel('Note for the new version').fill('More grazing in wetter years');
  await page.getByRole('button', { name: 'Save as a new draft' }).click();
  await expect(page.getByText('Saved as a new draft.')).toBeVisible();
  await page.getByRole('link', { name: 'Brannock Bay, wetter years' }).click();
  await expect(versions.getByRole('row')).toHaveCount(3);
  await expect(versions.getByRole('row').filter({ hasText: 'More grazing in wetter years' })).toContainText('version 1');
  // the edited draft is out of balance, so it has no indicators yet, and says so
  await expect(page.getByRole('alert')).toContainText('No indicators for this version yet');
  await shot(page, 'web-page-clone-edited');
  expect(problems).toEqual([]);
});

test('a new web straight from a WEB.json file, and a file that is not JSON refused in plain words', async ({ page }) => {
  const problems = watchForErrors(page);
  await signIn(page, 'analyst');
  const picker = page.locator('input[type=file][accept*=json]');
  await picker.setInputFiles({ name: 'notes.json', mimeType: 'application/json', buffer: Buffer.from('{"name": "half a file",') });
  await expect(page.getByRole('alert')).toContainText('No web was made from notes.json: it is not valid JSON');
  await shot(page, 'webs-list-json-refused');

  await picker.setInputFiles({ name: 'bay.json', mimeType: 'application/json', buffer: Buffer.from(JSON.stringify({ ...demo, name: 'Brannock Bay from WEB.json' })) });
  await expect(page.getByRole('heading', { level: 1, name: 'Brannock Bay from WEB.json' })).toBeVisible();
  await expect(page.getByRole('table', { name: 'Versions' }).getByRole('row')).toHaveCount(2);
  // the demo web is balanced, so even its first draft has indicators
  await expect(page.getByRole('region', { name: 'Headline indicators' })).toBeVisible();
  expect(problems).toEqual([]);
});

test('staff read published baselines and are offered no changes', async ({ page }) => {
  const problems = watchForErrors(page);
  // staff read every published baseline (council members only those shared with them for review)
  await signIn(page, 'staff');
  const list = page.getByRole('table', { name: 'Webs' });
  await expect(list).toContainText(demo.name);
  // a web with drafts only (the clone above, when this runs after it) is not shown to staff
  await expect(list).not.toContainText('Brannock Bay, wetter years');
  await expect(page.getByRole('link', { name: 'Upload a web' })).toHaveCount(0);
  await expect(page.getByRole('button', { name: 'New from WEB.json' })).toHaveCount(0);
  await shot(page, 'webs-list-staff');

  await list.getByRole('link', { name: demo.name }).click();
  await expect(page.getByRole('region', { name: 'Headline indicators' })).toBeVisible();
  await expect(page.getByRole('link', { name: 'Edit as a new draft' })).toHaveCount(0);
  await expect(page.getByRole('button', { name: 'Publish' })).toHaveCount(0);
  // the version menu opens from the keyboard too
  await page.getByRole('button', { name: 'More for version 1' }).focus();
  await page.keyboard.press('Enter');
  await expect(page.getByRole('menuitem')).toHaveText(['Download as a workbook (XLSX)', 'Download as CSV tables', 'Download as WEB.json'].map((t) => new RegExp(t.replace(/[()]/g, '\\$&'))));
  await shot(page, 'web-page-staff');
  expect(problems).toEqual([]);
});

test('readable at 200 % zoom: no page scrolls sideways', async ({ page }) => {
  // 640 × 400 CSS pixels at twice the density is how a 1280 × 800 screen shows the app at 200 %
  await page.setViewportSize({ width: 640, height: 400 });
  const fitsTheWidth = () => page.evaluate(() => document.documentElement.scrollWidth <= window.innerWidth);
  await signIn(page, 'analyst');
  await expect(page.getByRole('table', { name: 'Webs' })).toContainText(demo.name);
  expect(await fitsTheWidth()).toBe(true);
  await shot(page, 'zoom-200-webs-list');

  await page.getByRole('link', { name: demo.name }).click();
  await expect(page.getByRole('region', { name: 'Headline indicators' })).toBeVisible();
  await expect(page.locator('sw-web-diagram svg[role=img]')).toBeVisible();
  expect(await fitsTheWidth()).toBe(true);
  await shot(page, 'zoom-200-web-page');

  await page.getByRole('link', { name: 'Edit as a new draft' }).click();
  await expect(page.getByRole('region', { name: 'Balance of each compartment' })).toBeVisible();
  expect(await fitsTheWidth()).toBe(true);
  await shot(page, 'zoom-200-editor');

  await page.goto('/webs/upload');
  await expect(page.getByRole('heading', { level: 1, name: 'Upload a web' })).toBeVisible();
  expect(await fitsTheWidth()).toBe(true);
  await shot(page, 'zoom-200-upload');
});

test('an address inside the app is answered with the app itself', async ({ request }) => {
  const response = await request.get('/webs/some-web/versions/some-version/edit');
  expect(response.status()).toBe(200);
  expect(await response.text()).toContain('<sw-root');
});
