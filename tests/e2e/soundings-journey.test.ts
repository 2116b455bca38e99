import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { expectAccessible, startBrowserJourney, type BrowserJourney, signIn } from './browser';

const fixture = path.resolve(import.meta.dirname, '../fixtures/soundings/oax_20140616_19z.csv');

let journey: BrowserJourney;
beforeAll(async () => {
  journey = await startBrowserJourney();
});
afterAll(async () => {
  await journey?.close();
});

async function signInAsForecaster(page: Page) {
  await signIn(page, journey.baseUrl, 'forecaster@demo.stormdraft.test');
}

/** A value from the workbench's index panel, as a number (true minus sign and units stripped). */
async function indexNumber(page: Page, label: string): Promise<number> {
  const row = page.getByRole('rowheader', { name: label, exact: true }).first().locator('xpath=..');
  const text = (await row.getByRole('cell').first().textContent()) ?? '';
  const match = /[\u2212-]?\d+(\.\d+)?/.exec(text.replace('\u2212', '-'));
  return match ? Number(match[0]) : Number.NaN;
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
    await expectAccessible(page, 'upload results');

    await row.getByRole('link', { name: 'Open oax_20140616_19z.csv' }).click();
    await page.waitForURL((url) => /^\/soundings\/[^/]+$/.test(url.pathname) && url.pathname !== '/soundings/upload');
    soundingPath = new URL(page.url()).pathname;
  });

  it('When the sounding opens, then its header names the station, time and source', async () => {
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toContain('OAX');
    expect(await page.getByText('Valid 16 Jun 2014, 19:00 UTC').count()).toBe(1);
    expect(await page.getByText('Observed', { exact: true }).count()).toBeGreaterThan(0);
    expect(soundingPath).not.toBe('');
    await expectAccessible(page, 'sounding workbench');
  });

  it('When the forecaster reads the indices, then the hazard ingredients have their own group with values and units', async () => {
    const hazards = page.getByRole('table', { name: 'Hazard ingredients' });
    await hazards.waitFor();
    // OAX 16 June 2014 had strong low-level helicity (srh0to1km > 150 m²/s² in analyze.test.ts): 0–500 m SRH is positive.
    expect(await indexNumber(page, 'SRH 0–500 m')).toBeGreaterThan(0);
    expect(await hazards.getByRole('rowheader', { name: 'Corfidi downwind', exact: true }).locator('xpath=..').getByRole('cell').textContent()).toMatch(/^\d{3}° \d+/);
  });

  it('When the surface dewpoint is raised by 2 K in the what-if editor, then CAPE rises and the delta is shown', async () => {
    const before = await indexNumber(page, 'SBCAPE');
    const dewpoint = page.getByLabel('Surface dewpoint (°C)');
    const original = Number(await dewpoint.inputValue());
    expect(Number.isFinite(original)).toBe(true);
    await dewpoint.fill((original + 2).toFixed(1));

    await expect.poll(() => indexNumber(page, 'SBCAPE')).toBeGreaterThan(before);
    const delta = page.locator('li').filter({ hasText: 'Surface-based:' }).first();
    await expect.poll(() => delta.textContent()).toMatch(/CAPE \+\d+\u202fJ\/kg/);
  });

  it('When the modified sounding is saved, then its own page opens with a confirmation', async () => {
    await page.getByLabel('Name', { exact: true }).fill('Moister surface +2 K');
    await page.getByRole('button', { name: 'Save as modified sounding' }).click();
    await page.waitForURL((url) => url.pathname.startsWith('/soundings/') && url.pathname !== soundingPath);
    await expect.poll(() => page.getByText('Saved “Moister surface +2 K” as a modified sounding').count()).toBe(1);
    expect(await page.getByRole('link', { name: 'the original OAX sounding' }).getAttribute('href')).toBe(soundingPath);
    await expectAccessible(page, 'modified sounding');
  });

  it('When the forecaster looks in the library, then the modified sounding is listed and marked as modified', async () => {
    await page.getByRole('link', { name: 'Sounding library' }).first().click();
    await page.getByLabel('Station').fill('OAX');
    await page.waitForURL((url) => url.searchParams.get('station') === 'OAX');
    const table = page.getByRole('table');
    await expect.poll(() => table.getByText('Modified · Moister surface +2 K').count()).toBe(1);
    // The original and its what-if: a heading row plus two soundings.
    expect(await table.getByRole('row').count()).toBe(3);
    await page.getByText('More figures').click();
    await page.getByRole('checkbox', { name: /0–500 m storm-relative helicity/ }).check();
    await expect.poll(() => table.getByRole('columnheader', { name: /0–500 m SRH/ }).count()).toBe(1);
    await expectAccessible(page, 'sounding library');
  });
});
