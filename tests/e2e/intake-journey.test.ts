import { copyFile, mkdtemp, rm } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { expectAccessible, startBrowserJourney, type BrowserJourney, signIn } from './browser';

const bufrFolder = path.resolve(import.meta.dirname, '../fixtures/bufr');
let journey: BrowserJourney;
let folder: string;

beforeAll(async () => {
  folder = await mkdtemp(path.join(tmpdir(), 'intake-journey-'));
  journey = await startBrowserJourney({ intakeDir: folder, intakeSettleMs: 200, intakePollMs: 0 });
});
afterAll(async () => {
  await journey?.close();
  await rm(folder, { recursive: true, force: true });
});

describe('intake journey', () => {
  it('a forecaster opens Intake, a BUFR file dropped in the folder appears as done with its soundings, a corrupt one as failed with its reason', async () => {
    const page = await journey.browser.newPage();
    await signIn(page, journey.baseUrl, 'forecaster@demo.stormdraft.test');

    await page.getByRole('link', { name: 'Intake' }).click();
    await page.waitForURL((url) => url.pathname === '/intake');
    await page.getByText('Nothing taken in yet.').waitFor();
    expect(await page.getByText(folder).count()).toBe(1);

    await copyFile(path.join(bufrFolder, 'three-stations.bufr'), path.join(folder, 'morning.bufr'));
    await copyFile(path.join(bufrFolder, 'corrupt.bufr'), path.join(folder, 'noise.bufr'));
    const table = page.getByRole('table');
    const done = table.getByRole('row', { name: /morning\.bufr/ });
    await done.getByText('Done').waitFor({ timeout: 60_000 });
    expect(await done.getByText('3 new').count()).toBe(1);
    expect(await done.getByText('intake folder').count()).toBe(1);
    const failed = table.getByRole('row', { name: /noise\.bufr/ });
    await failed.getByText('Failed').waitFor({ timeout: 60_000 });
    expect(await failed.getByText(/bufr_dump could not read the file/).count()).toBe(1);
    await expectAccessible(page, 'intake list');

    // The soundings are in the library, observed, under their WMO station numbers.
    await page.goto(`${journey.baseUrl}/soundings?station=72901`);
    await page.getByRole('cell', { name: '72901' }).first().waitFor();
    await page.close();
  });
});
