import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { offices } from '../../server/db/schema';
import { demoPassword } from '../../server/services/seed.service';
import { fieldDefinitions } from '../../shared/model-fields/field-bands';
import { insertGridRun } from '../api/helpers/grid-runs';
import { expectAccessible, startBrowserJourney, type BrowserJourney } from './browser';

let journey: BrowserJourney;
beforeAll(async () => {
  journey = await startBrowserJourney();
  const [office] = await journey.sd.ctx.db.select({ region: offices.region }).from(offices).limit(1);
  if (!office) throw new Error('no office');
  const { west, south, east, north } = office.region;
  // A 40 × 30 run over the office region with an invented CAPE dome in the middle.
  await insertGridRun(journey.sd.ctx.db, {
    model: 'VALLEY3',
    cycleTime: '2027-04-18T12:00:00Z',
    forecastHour: 6,
    nx: 40,
    ny: 30,
    gridKind: 'lambert',
    position: (c, r) => ({ longitude: west + ((east - west) * c) / 39, latitude: south + ((north - south) * r) / 29 }),
    figures: (c, r) => ({ mlCape: Math.max(0, 3500 - 160 * Math.hypot(c - 20, r - 15)) }),
  });
});
afterAll(async () => {
  await journey?.close();
});

describe('browser journey: a forecaster draws a model field under the sounding map', () => {
  let page: Page;
  beforeAll(async () => {
    page = await journey.browser.newPage();
    await page.goto(`${journey.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('forecaster@demo.stormdraft.test');
    await page.getByLabel('Password', { exact: true }).fill(demoPassword);
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.waitForURL((url) => url.pathname === '/desk');
  });
  afterAll(async () => {
    await page?.close();
  });

  it('When the forecaster picks the run, then MLCAPE bands are drawn in their colours with a key naming the run', async () => {
    await page.goto(`${journey.baseUrl}/soundings/map`);
    const picker = page.getByLabel('Model field');
    await expect.poll(() => picker.locator('option').count()).toBeGreaterThan(1);
    await picker.selectOption({ label: 'VALLEY3 2027-04-18 12Z +6 h (valid 18:00 UTC 04-18)' });
    const key = page.getByRole('figure', { name: 'Field key: MLCAPE' });
    await key.waitFor();
    expect(await key.textContent()).toContain('VALLEY3 2027-04-18 12Z +6 h');
    const fills = await page.locator('.leaflet-model-field-pane path').evaluateAll((paths) => paths.map((p) => p.getAttribute('fill')));
    // 3500 J/kg at the centre reaches the 3000 J/kg band: seven bands from 100 J/kg up.
    expect(fills).toEqual(fieldDefinitions.mlCape.colours.slice(0, 7));
    await expectAccessible(page, 'model field');
  });
});
