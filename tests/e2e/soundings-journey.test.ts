import { existsSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { demoPassword } from '../../server/services/seed.service';
import { startBrowserJourney, type BrowserJourney } from './browser';

const fixture = path.resolve(import.meta.dirname, '../fixtures/soundings/oax_20140616_19z.csv');

let journey: BrowserJourney;
beforeAll(async () => {
  if (!existsSync(path.resolve(import.meta.dirname, '../../dist/index.html'))) {
    throw new Error('The client is not built: run `npm test` (it builds with vite first) or `npx vite build`.');
  }
  journey = await startBrowserJourney();
});
afterAll(async () => {
  await journey?.close();
});

async function signInAsForecaster(page: Page) {
  await page.goto(`${journey.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill('forecaster@demo.stormdraft.test');
  await page.getByLabel('Password', { exact: true }).fill(demoPassword);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL((url) => url.pathname === '/desk');
}

describe('browser journey: a forecaster brings in a sounding and tries a what-if', () => {
  let page: Page;
  let soundingPath = '';

  beforeAll(async () => {
    page = await journey.browser.newPage();
    await signInAsForecaster(page);
  });
  afterAll(async () => {
    await page?.close();
  });

  it('When the forecaster uploads an exchange-CSV file on the upload page, then it is accepted with a link to open it', async () => {
    await page.getByRole('link', { name: 'Soundings' }).click();
    await page.getByRole('link', { name: 'Upload soundings' }).first().click();
    await page.waitForURL((url) => url.pathname === '/soundings/upload');
    await page.getByLabel('Choose files').setInputFiles(fixture);

    const results = page.getByRole('list', { name: 'Upload results' });
    await results.waitFor();
    const row = results.getByRole('listitem').filter({ hasText: 'oax_20140616_19z.csv' }).first();
    expect(await row.getAttribute('data-status')).toMatch(/^accepted/);
    await expect.poll(() => page.getByText('1 file stored.').count()).toBe(1);

    await row.getByRole('link', { name: 'Open oax_20140616_19z.csv' }).click();
    await page.waitForURL((url) => /^\/soundings\/[^/]+$/.test(url.pathname) && url.pathname !== '/soundings/upload');
    soundingPath = new URL(page.url()).pathname;
  });

  it('When the sounding opens, then its header names the station, time and source', async () => {
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toContain('OAX');
    expect(await page.getByText('Valid 16 Jun 2014, 19:00 UTC').count()).toBe(1);
    expect(await page.getByText('Observed', { exact: true }).count()).toBeGreaterThan(0);
    expect(soundingPath).not.toBe('');
  });

  // The what-if steps need the diagram kit (SoundingWorkbench); see the report for what remains.
  it.todo('When the surface dewpoint is raised by 2 K in the what-if editor, then CAPE rises and the delta is shown');
  it.todo('When the modified sounding is saved, then its page opens with a confirmation');

  it('When a modified sounding exists, then the library lists it marked as modified', async () => {
    // Until the editor lands, save the what-if through the same API the editor calls.
    const soundingId = soundingPath.split('/').pop() ?? '';
    const original = await page.request.get(`${journey.baseUrl}/api/soundings/${soundingId}`);
    const body: unknown = await original.json();
    const dewpoint = typeof body === 'object' && body !== null && 'figures' in body && typeof body.figures === 'object' && body.figures !== null && 'surfaceDewpointC' in body.figures ? body.figures.surfaceDewpointC : null;
    expect(typeof dewpoint).toBe('number');
    const saved = await page.request.post(`${journey.baseUrl}/api/soundings/${soundingId}/modified`, {
      data: { name: 'Moister surface +2 K', surfaceDewpointC: Number(dewpoint) + 2 },
      headers: { Origin: journey.baseUrl },
    });
    expect(saved.status()).toBe(201);

    await page.goto(`${journey.baseUrl}/soundings?station=OAX`);
    const table = page.getByRole('table');
    await table.waitFor();
    await expect.poll(() => table.getByText('Modified · Moister surface +2 K').count()).toBe(1);
    expect(await table.getByRole('row').count()).toBe(3);
  });
});
