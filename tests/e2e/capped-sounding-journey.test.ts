import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { expectAccessible, startBrowserJourney, type BrowserJourney, signIn } from './browser';
import { cappedCsv, cappedProfile } from './capped-sounding';

/*
 * Issue 10's acceptance, in the browser: a capped sounding with two positive areas and the same
 * profile with its heights in feet under a `height_m` header are uploaded on the upload page;
 * their sounding pages show the cap as CIN and the quality flag in words; the evidence panel of
 * a draft over them says how many flagged soundings it used. The profile and its construction
 * are in ./capped-sounding.ts.
 */

let journey: BrowserJourney;
beforeAll(async () => {
  journey = await startBrowserJourney();
});
afterAll(async () => {
  await journey?.close();
});

// A day no demo sounding is valid on, so the draft's evidence holds exactly these two.
const valid = '2030-06-10T18:00:00Z';
const elevationM = 120;
const profile = cappedProfile(elevationM);
const cappedFile = 'capped-two-areas.csv';
const feetFile = 'heights-in-feet.csv';
const files = [
  { name: cappedFile, csv: cappedCsv(profile, { station: 'MV91', name: 'Capped test profile', latitude: 38.1, longitude: -92.3, elevationM, valid }) },
  { name: feetFile, csv: cappedCsv(profile, { station: 'MV92', name: 'Feet test profile', latitude: 38.3, longitude: -91.9, elevationM, valid }, true) },
];

/** A value from the workbench's index panel, as a number (true minus sign, separators and units stripped). */
async function indexNumber(page: Page, label: string): Promise<number> {
  const row = page.getByRole('rowheader', { name: label, exact: true }).first().locator('xpath=..');
  const text = ((await row.getByRole('cell').first().textContent()) ?? '').replace('\u2212', '-').replace(/[,\u202f\u00a0](?=\d{3})/g, '');
  const match = /-?\d+(\.\d+)?/.exec(text);
  return match ? Number(match[0]) : Number.NaN;
}

describe('browser journey: a capped sounding and heights in feet, from upload to evidence', () => {
  let page: Page;
  const links = new Map<string, string>();
  let cappedCin = Number.NaN;

  beforeAll(async () => {
    page = await journey.browser.newPage();
    await signIn(page, journey.baseUrl, 'forecaster@demo.stormdraft.test');
  });
  afterAll(async () => {
    await page?.close();
  });

  it('When both files are uploaded on the upload page, then both are stored with a link each', async () => {
    await page.goto(`${journey.baseUrl}/soundings/upload`);
    await page.getByLabel('Choose files').setInputFiles(files.map((f) => ({ name: f.name, mimeType: 'text/csv', buffer: Buffer.from(f.csv) })));
    const results = page.getByRole('list', { name: 'Upload results' });
    await results.waitFor();
    await expect.poll(() => page.getByText('2 files stored.').count()).toBe(1);
    for (const { name } of files) {
      const row = results.getByRole('listitem').filter({ hasText: name }).first();
      expect(await row.getAttribute('data-status')).toMatch(/^accepted/);
      const href = await row.getByRole('link', { name: `Open ${name}` }).getAttribute('href');
      expect(href).toMatch(/^\/soundings\/[^/]+$/);
      links.set(name, href ?? '');
    }
    await expectAccessible(page, 'upload results');
  });

  it('When the capped sounding opens, then its surface-based CIN shows the cap and it carries no quality flag', async () => {
    await page.goto(`${journey.baseUrl}${links.get(cappedFile) ?? ''}`);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toContain('MV91');
    await page.getByRole('rowheader', { name: 'SBCIN', exact: true }).first().waitFor();
    cappedCin = await indexNumber(page, 'SBCIN');
    // The cap's flat part alone is −161 J/kg (hand calculation in ./capped-sounding.ts); the lowest
    // LFC (in the shallow area under the cap) would have left almost no CIN.
    expect(cappedCin).toBeLessThan(-150);
    // The independent integration (RK4, 1 hPa, ./capped-sounding.ts) on the same profile: within
    // 10 % (the engine test's tolerance for CIN against it).
    expect(Math.abs(cappedCin - profile.reference.cin)).toBeLessThan(0.1 * Math.abs(profile.reference.cin));
    // The main area's CAPE (≈ 1261 J/kg by hand) is reported as CAPE.
    expect(await indexNumber(page, 'SBCAPE')).toBeGreaterThan(1100);
    expect(await page.getByRole('heading', { name: /quality flags?$/ }).count()).toBe(0);
    await expectAccessible(page, 'capped sounding');
  });

  it('When the sounding with heights in feet opens, then the quality flag says so in words and the computed heights give the same CIN', async () => {
    await page.goto(`${journey.baseUrl}${links.get(feetFile) ?? ''}`);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toContain('MV92');
    const flags = page.getByRole('region', { name: '1 quality flag' });
    await flags.waitFor();
    const text = (await flags.textContent()) ?? '';
    expect(text).toContain('HEIGHTS_REPLACED');
    expect(text).toMatch(/Reported heights differ from the hypsometric equation by up to \d+ m/);
    expect(text).toContain('the computed heights are used');
    expect(text).toContain('Heights in feet labelled as metres do this.');
    // Same profile, computed heights: the CIN matches the capped sounding's within 2 %; heights
    // taken as given (3.28 times too large) would have scaled it by about 3.28.
    const feetCin = await indexNumber(page, 'SBCIN');
    expect(Math.abs(feetCin / cappedCin - 1)).toBeLessThan(0.02);
    await expectAccessible(page, 'sounding with heights in feet');
  });

  it('When a draft covers both soundings, then its evidence panel says 2 soundings inside, 1 with quality flags', async () => {
    const headers = { Origin: journey.baseUrl };
    const created = await page.request.post(`${journey.baseUrl}/api/outlooks`, { headers, data: { day: 1, issuanceTime: '2030-06-10T15:00:00Z', headline: 'Capped warm sector' } });
    expect(created.status()).toBe(201);
    const outlook = (await created.json()) as { id: string; version: number; validFrom: string; validUntil: string };
    const square = { type: 'Polygon', coordinates: [[[-92.6, 37.9], [-91.6, 37.9], [-91.6, 38.5], [-92.6, 38.5], [-92.6, 37.9]]] };
    const saved = await page.request.put(`${journey.baseUrl}/api/outlooks/${outlook.id}`, {
      headers,
      data: { version: outlook.version, headline: 'Capped warm sector', discussion: 'A strong cap holds until late afternoon.', hazardNotes: {}, validFrom: outlook.validFrom, validUntil: outlook.validUntil, areas: [{ levelKey: 'level1', hazards: [], geometry: square, label: 'Capped' }] },
    });
    expect(saved.status()).toBe(200);

    await page.goto(`${journey.baseUrl}/outlooks/${outlook.id}`);
    const panel = page.getByRole('complementary', { name: 'Evidence panel' });
    await page.getByRole('tab', { name: 'All areas' }).click();
    await panel.getByRole('table', { name: /Risk areas of this outlook/ }).getByRole('button', { name: /^Select / }).first().click();
    await expect.poll(() => page.getByRole('tab', { name: 'Selected area' }).getAttribute('aria-selected')).toBe('true');
    await expect.poll(() => panel.getByTestId('evidence-count').textContent()).toBe('2');
    expect(await panel.getByTestId('evidence-flagged-count').textContent()).toBe(' (1 with quality flags)');
    await expectAccessible(page, 'workspace evidence');
  });
});
