import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { offices } from '../../server/db/schema';
import { ingestGribFile } from '../../server/ingest/grib/ingest-grib';
import { closeSoundingPool } from '../../server/workers/sounding-pool';
import { generateGribFixture, gribPresets } from '../fixtures/grib/generate-grib';
import { expectAccessible, startBrowserJourney, type BrowserJourney, signIn } from './browser';

let journey: BrowserJourney;
let dir: string;
beforeAll(async () => {
  journey = await startBrowserJourney();
  dir = mkdtempSync(path.join(tmpdir(), 'model-runs-journey-'));
  const file = path.join(dir, 'small.grib2');
  await generateGribFixture(gribPresets.small, file);
  const [office] = await journey.sd.ctx.db.select({ id: offices.id }).from(offices);
  const result = await ingestGribFile(journey.sd.ctx, { officeId: office?.id ?? '', filePath: file, model: 'JOURNEY' });
  if (!result.ok) throw new Error(result.error.reason);
}, 90_000);
afterAll(async () => {
  await closeSoundingPool();
  await journey?.close();
  rmSync(dir, { recursive: true, force: true });
});

describe('browser journey: a lead forecaster reads a model run in the library', () => {
  let page: Page;
  beforeAll(async () => {
    page = await journey.browser.newPage();
    await signIn(page, journey.baseUrl, 'lead@demo.stormdraft.test', '/review');
  });
  afterAll(async () => {
    await page?.close();
  });

  it('When the lead picks a run in the library, then its grid soundings are listed and one opens with its levels', async () => {
    await page.goto(`${journey.baseUrl}/soundings`);
    const runs = page.getByRole('table', { name: 'Model runs' });
    await runs.waitFor();
    expect(await runs.getByRole('row').filter({ hasText: 'JOURNEY' }).count()).toBe(2);
    const option = (await page.getByLabel('Run', { exact: true }).locator('option', { hasText: '+6 h' }).first().getAttribute('value')) ?? '';
    await page.getByLabel('Run', { exact: true }).selectOption(option);
    const grid = page.getByRole('table', { name: /Grid soundings of JOURNEY/ });
    await grid.waitFor();
    expect(await grid.getByRole('row').count()).toBe(1 + 8);
    await expect.poll(() => page.getByText('1–8 of 8 grid soundings').count()).toBe(1);
    await expectAccessible(page, 'library with a model run');

    await grid.getByRole('link').first().click();
    await page.waitForURL((url) => url.pathname.startsWith('/soundings/grid/'));
    const levels = page.getByRole('table', { name: 'Levels of the grid sounding' });
    await levels.waitFor();
    expect(await levels.getByRole('row').count()).toBeGreaterThan(5);
    expect(await page.getByRole('heading', { name: /JOURNEY grid point/ }).count()).toBe(1);
    await expectAccessible(page, 'grid sounding page');
  });

  it('When the lead deletes a run, then it leaves the list', async () => {
    await page.goto(`${journey.baseUrl}/soundings`);
    const runs = page.getByRole('table', { name: 'Model runs' });
    await runs.waitFor();
    page.once('dialog', (dialog) => void dialog.accept());
    await page.getByRole('button', { name: /Delete run JOURNEY .* \+9 h/ }).click();
    await expect.poll(() => runs.getByRole('row').filter({ hasText: 'JOURNEY' }).count()).toBe(1);
  });
});
