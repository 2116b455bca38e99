import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { offices } from '../../server/db/schema';
import { fieldDefinitions } from '../../shared/model-fields/field-bands';
import { insertGridRun } from '../api/helpers/grid-runs';
import { expectAccessible, startBrowserJourney, type BrowserJourney, signIn } from './browser';

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
    await signIn(page, journey.baseUrl, 'forecaster@demo.stormdraft.test');
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

  it('When the author ticks the run for an outlook, then the evidence panel names it beside the statistics', async () => {
    const headers = { Origin: journey.baseUrl };
    const created = await page.request.post(`${journey.baseUrl}/api/outlooks`, { headers, data: { day: 1, issuanceTime: '2027-04-18T15:00:00Z', headline: 'Grid evidence journey' } });
    expect(created.status()).toBe(201);
    const outlook = (await created.json()) as { id: string; version: number; validFrom: string; validUntil: string };
    const [office] = await journey.sd.ctx.db.select({ region: offices.region }).from(offices).limit(1);
    const { west, south, east, north } = office?.region ?? { west: 0, south: 0, east: 1, north: 1 };
    const mid = { x: (west + east) / 2, y: (south + north) / 2, dx: (east - west) / 8, dy: (north - south) / 8 };
    const geometry = { type: 'Polygon', coordinates: [[[mid.x - mid.dx, mid.y - mid.dy], [mid.x + mid.dx, mid.y - mid.dy], [mid.x + mid.dx, mid.y + mid.dy], [mid.x - mid.dx, mid.y + mid.dy], [mid.x - mid.dx, mid.y - mid.dy]]] };
    const saved = await page.request.put(`${journey.baseUrl}/api/outlooks/${outlook.id}`, { headers, data: { version: outlook.version, headline: 'Grid evidence journey', discussion: '', hazardNotes: {}, validFrom: outlook.validFrom, validUntil: outlook.validUntil, areas: [{ levelKey: 'level2', hazards: [], geometry, label: 'Dome' }] } });
    expect(saved.status()).toBe(200);

    await page.goto(`${journey.baseUrl}/outlooks/${outlook.id}`);
    await page.getByRole('tab', { name: 'All areas' }).click();
    const runs = page.getByRole('group', { name: 'Model runs in the evidence' });
    const tick = runs.getByRole('checkbox', { name: /VALLEY3 2027-04-18 12Z \+6 h/ });
    await tick.check();
    await expect.poll(async () => (await runs.textContent()) ?? '').toContain('Picked by the author');
    await page.getByRole('button', { name: /Dome/ }).first().click();
    const sources = page.getByTestId('evidence-sources');
    await expect.poll(async () => (await sources.textContent()) ?? '').toMatch(/Statistics from .*VALLEY3 2027-04-18 12Z \+6 h \(\d+\)/);
    await expectAccessible(page, 'evidence from a model run');
  });
});
