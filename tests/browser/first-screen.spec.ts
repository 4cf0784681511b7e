/// <reference lib="dom" />
import { existsSync } from 'node:fs';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type Browser } from 'playwright-core';
import { analyzeWeb } from '@seinework/network-analysis';
import { createApp } from '../../apps/server/src/app';
import demo from '../../seeds/brannock-bay.json';
import { repositoryRoot } from '../support/run-command';

/**
 * The product as a new user meets it: the built browser app served by the real server, opened in
 * Debian's Chromium (no downloaded browser). Runs after `ng build web` (npm test builds first).
 */

const builtApp = join(repositoryRoot, 'dist/web/browser');
const chromiumPath = process.env['CHROMIUM_PATH'] ?? '/usr/bin/chromium';

let server: Server;
let base: string;
let browser: Browser;

beforeAll(async () => {
  if (!existsSync(join(builtApp, 'index.html'))) throw new Error(`no built app in ${builtApp}: run "npx ng build web" first`);
  if (!existsSync(chromiumPath)) throw new Error(`no Chromium at ${chromiumPath}: apt-get install chromium, or set CHROMIUM_PATH`);
  const app = await createApp({ demoWebPath: join(repositoryRoot, 'seeds/brannock-bay.json'), staticDir: builtApp });
  server = app.listen(0, '127.0.0.1');
  await new Promise((ready) => server.once('listening', ready));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  browser = await chromium.launch({
    executablePath: chromiumPath,
    // Playwright gives each launch a fresh profile; the closed network refuses Chromium's
    // background connections, so keep it from trying
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
});

afterAll(async () => {
  await browser?.close();
  await new Promise((done) => (server ? server.close(done) : done(undefined)));
});

describe('first screen in Chromium', () => {
  it('shows the demo baseline with its headline indicators, the trophic positions and the caution', async () => {
    const page = await browser.newPage();
    const problems: string[] = [];
    page.on('console', (message) => {
      if (message.type() === 'error') problems.push(message.text());
    });
    page.on('pageerror', (error) => problems.push(error.message));

    await page.goto(base);
    await page.getByRole('heading', { level: 1, name: demo.name }).waitFor();

    const expected = analyzeWeb(demo);
    const headline = page.getByRole('region', { name: 'Headline indicators' });
    await expect(headline.textContent()).resolves.toContain(expected.relativeAscendency.toFixed(3));
    await expect(headline.textContent()).resolves.toContain('Finn cycling index');
    // one row per compartment in the trophic-position table, plus the header row
    await expect(page.locator('table.positions tr').count()).resolves.toBe(demo.compartments.length + 1);
    await expect(page.locator('body').textContent()).resolves.toMatch(/steady state and are indicative only/);
    // the fitness curve is drawn: its canvas has painted pixels and names the baseline's place on it
    const curve = page.locator('sw-fitness-curve canvas');
    await expect(curve.getAttribute('aria-label')).resolves.toContain(`relative ascendency ${expected.relativeAscendency.toFixed(3)}`);
    const painted = await curve.evaluate((canvas: HTMLCanvasElement) => {
      const { data } = canvas.getContext('2d')!.getImageData(0, 0, canvas.width, canvas.height);
      let count = 0;
      for (let i = 3; i < data.length; i += 4) if (data[i] > 0) count++;
      return count;
    });
    expect(painted).toBeGreaterThan(1000);
    const screenshot = join(tmpdir(), 'seinework-first-screen.png');
    await page.screenshot({ path: screenshot, fullPage: true });
    console.log(`screenshot: ${screenshot}`);
    expect(problems).toEqual([]);
  });

  it('answers an unknown address inside the app with the app itself (client-side routes)', async () => {
    const response = await fetch(`${base}/baselines/anything`);
    expect(response.status).toBe(200);
    expect(await response.text()).toContain('<sw-root');
  });
});
