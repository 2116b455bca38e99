import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { demoPassword } from '../../server/services/seed.service';
import { expectAccessible, startBrowserJourney, type BrowserJourney } from './browser';

let journey: BrowserJourney;
beforeAll(async () => {
  journey = await startBrowserJourney();
});
afterAll(async () => {
  await journey?.close();
});

interface ApiOutlook {
  id: string;
  version: number;
  headline: string;
  discussion: string;
  hazardNotes: Record<string, string>;
  validFrom: string;
  validUntil: string;
  areas: { levelKey: string; hazards: unknown[]; geometry: unknown; label: string }[];
}

const homes = { forecaster: '/desk', lead: '/review' } as const;
type Person = keyof typeof homes;

/** Ends any session in the shared browser context, then signs in through the form. */
async function signInAs(page: Page, person: Person) {
  await journey.browser.clearCookies();
  await page.goto(`${journey.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(`${person}@demo.stormdraft.test`);
  await page.getByLabel('Password', { exact: true }).fill(demoPassword);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL((url) => url.pathname === homes[person]);
}

const box = (w: number, s: number, e: number, n: number) => ({
  type: 'Polygon',
  coordinates: [
    [
      [w, s],
      [e, s],
      [e, n],
      [w, n],
      [w, s],
    ],
  ],
});

/** Writes go through the signed-in browser session; better-auth and the API want an Origin. */
const headers = () => ({ Origin: journey.baseUrl });

async function readOutlook(page: Page, outlookId: string): Promise<ApiOutlook> {
  const response = await page.request.get(`${journey.baseUrl}/api/outlooks/${outlookId}`);
  expect(response.status()).toBe(200);
  return (await response.json()) as ApiOutlook;
}

async function saveAreas(page: Page, outlook: ApiOutlook & { version: number }, areas: ApiOutlook['areas'], headline: string) {
  const response = await page.request.put(`${journey.baseUrl}/api/outlooks/${outlook.id}`, {
    headers: headers(),
    data: { version: outlook.version, headline, discussion: 'Storms form along the dryline by late afternoon.', hazardNotes: {}, validFrom: outlook.validFrom, validUntil: outlook.validUntil, areas },
  });
  expect(response.status()).toBe(200);
}

const stateOnScreen = (page: Page) => page.getByTestId('outlook-state').textContent();

describe('browser journey: review and publish', () => {
  let page: Page;
  let outlookId = '';
  let issuanceNumber = '';
  const headline = 'Journey: isolated severe storms in the western valley';
  const returnComment = 'Extend the level 1 area east to cover the river junction.';

  beforeAll(async () => {
    page = await journey.browser.newPage();
  });
  afterAll(async () => {
    await page.close();
  });

  it('When the forecaster submits a Day 3 draft from the review screen, then it is in review', async () => {
    await signInAs(page, 'forecaster');
    const created = await page.request.post(`${journey.baseUrl}/api/outlooks`, { headers: headers(), data: { day: 3, headline } });
    expect(created.status()).toBe(201);
    outlookId = ((await created.json()) as { id: string }).id;
    await saveAreas(page, await readOutlook(page, outlookId), [{ levelKey: 'level1', hazards: [{ hazard: 'hail', significant: false }], geometry: box(-95, 37, -92, 39.5), label: 'Western valley' }], headline);

    await page.goto(`${journey.baseUrl}/review/${outlookId}`);
    await expect.poll(() => stateOnScreen(page)).toBe('Draft');
    await expectAccessible(page, 'review screen, draft');
    await page.getByRole('button', { name: 'Submit for review' }).click();
    await expect.poll(() => stateOnScreen(page)).toBe('In review');
  });

  it('When the lead returns it with a comment, then it is returned', async () => {
    await signInAs(page, 'lead');
    await page.getByRole('link', { name: new RegExp(`Day 3: ${headline}`) }).waitFor();
    await expectAccessible(page, 'review queue');
    await page.getByRole('link', { name: new RegExp(`Day 3: ${headline}`) }).click();
    await page.waitForURL((url) => url.pathname === `/review/${outlookId}`);
    await expect.poll(() => stateOnScreen(page)).toBe('In review');
    await page.getByRole('button', { name: 'Return with comment…' }).click();
    await page.getByLabel('What needs changing').waitFor();
    await expectAccessible(page, 'return form');
    await page.getByLabel('What needs changing').fill(returnComment);
    await page.getByRole('button', { name: 'Return to author' }).click();
    await expect.poll(() => stateOnScreen(page)).toBe('Returned');
  });

  it('When the forecaster reads the comment, fixes the draft and resubmits, then it is in review again', async () => {
    await signInAs(page, 'forecaster');
    await page.goto(`${journey.baseUrl}/review/${outlookId}`);
    await expect.poll(() => stateOnScreen(page)).toBe('Returned');
    await expect.poll(() => page.getByText(returnComment).count()).toBeGreaterThan(0);
    await expectAccessible(page, 'returned draft with comment');

    const returned = await readOutlook(page, outlookId);
    await saveAreas(page, returned, [{ levelKey: 'level1', hazards: [{ hazard: 'hail', significant: false }], geometry: box(-95, 37, -90.5, 39.5), label: 'Western valley' }], headline);
    await page.reload();
    await expect.poll(() => stateOnScreen(page)).toBe('Returned');
    await expect.poll(() => page.getByText('Last edited by:').locator('..').textContent()).toContain('Felix Forecaster');
    await page.getByRole('button', { name: 'Submit for review' }).click();
    await expect.poll(() => stateOnScreen(page)).toBe('In review');
  });

  it('When the lead approves (the forecaster edited last) and publishes, then an issuance number is shown', async () => {
    await signInAs(page, 'lead');
    await page.goto(`${journey.baseUrl}/review/${outlookId}`);
    await expect.poll(() => stateOnScreen(page)).toBe('In review');
    // The change summary compares with the previous revision: the level 1 area grew eastward.
    await expect.poll(() => page.getByText(/^\+[\d,]+ km²$/).count()).toBeGreaterThan(0);
    await page.getByRole('button', { name: 'Approve' }).click();
    await expect.poll(() => stateOnScreen(page)).toBe('Approved');
    await page.getByRole('button', { name: 'Publish' }).click();
    await expect.poll(() => stateOnScreen(page)).toBe('Published');
    const link = page.getByRole('link', { name: /^\d{4}-\d{4}$/ });
    await link.waitFor();
    issuanceNumber = (await link.textContent()) ?? '';
    expect(issuanceNumber).toMatch(/^\d{4}-\d{4}$/);
    await expectAccessible(page, 'published');
  });

  it('When nobody is signed in, then the public bulletin shows the issuance and its GeoJSON download parses', async () => {
    await journey.browser.clearCookies();
    await page.goto(`${journey.baseUrl}/bulletin`);
    await page.getByRole('tab', { name: 'Day 3' }).click();
    await expect.poll(() => page.getByRole('link', { name: issuanceNumber, exact: true }).count()).toBe(1);
    expect(await page.getByText(headline).count()).toBeGreaterThan(0);
    expect(await page.getByText('planning guidance, not a warning', { exact: false }).count()).toBeGreaterThan(0);
    await expectAccessible(page, 'bulletin, Day 3');

    const href = await page.getByRole('link', { name: `GeoJSON of issuance ${issuanceNumber}` }).getAttribute('href');
    expect(href).toBe(`/api/public/issuances/${issuanceNumber}/geojson`);
    const download = await page.request.get(`${journey.baseUrl}${href ?? ''}`);
    expect(download.status()).toBe(200);
    const geojson = JSON.parse(await download.text()) as { type: string; features: { properties: { issuance: string } }[] };
    expect(geojson.type).toBe('FeatureCollection');
    expect(geojson.features.length).toBeGreaterThan(0);
    expect(geojson.features[0]?.properties.issuance).toBe(issuanceNumber);

    await page.getByRole('link', { name: issuanceNumber, exact: true }).click();
    await page.waitForURL((url) => url.pathname === `/issuances/${issuanceNumber}`);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe(`Outlook issuance ${issuanceNumber}`);
    await expectAccessible(page, 'issuance page');
  });
});
