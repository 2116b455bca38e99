import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { demoPassword } from '../../server/services/seed.service';
import { processOutbox } from '../../server/services/outbox.service';
import { processDistributionJobs } from '../../server/services/distribution.service';
import { expectAccessible, startBrowserJourney, type BrowserJourney } from './browser';

let journey: BrowserJourney;
let page: Page;
beforeAll(async () => {
  journey = await startBrowserJourney();
  page = await journey.browser.newPage();
}, 60_000);
afterAll(async () => {
  await journey?.close();
});

const homes = { forecaster: '/desk', lead: '/review', subscriber: '/alerts', admin: '/admin/users' } as const;
type Person = keyof typeof homes;

/** Ends any session in the shared browser context, then signs in through the form. */
async function signInAs(person: Person) {
  await journey.browser.clearCookies();
  await page.goto(`${journey.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(`${person}@demo.stormdraft.test`);
  await page.getByLabel('Password', { exact: true }).fill(demoPassword);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL((url) => url.pathname === homes[person]);
}

/** Writes go through the signed-in browser session; better-auth and the API want an Origin. */
const headers = () => ({ Origin: journey.baseUrl });

async function getJson<T>(url: string): Promise<T> {
  const response = await page.request.get(`${journey.baseUrl}${url}`);
  expect(response.status(), url).toBe(200);
  return (await response.json()) as T;
}

async function send(method: 'post' | 'put' | 'delete', url: string, data?: unknown) {
  const response = await page.request[method](`${journey.baseUrl}${url}`, { headers: headers(), data });
  expect(response.status(), `${method.toUpperCase()} ${url}: ${await response.text()}`).toBeLessThan(300);
  return (await response.json()) as unknown;
}

interface ApiSubscription {
  alertThreshold: string;
  areas: { id: string; name: string; kind: string }[];
}
interface ApiOutlook {
  id: string;
  version: number;
  validFrom: string;
  validUntil: string;
}
interface ApiRegion {
  region: { west: number; south: number; east: number; north: number };
}

const drawnName = 'Valley EOC jurisdiction';
const headline = 'Numerous severe storms across the valley this afternoon';
const subscriberAddress = 'subscriber@demo.stormdraft.test';

describe('browser journey: a subscriber’s drawn area gets the alert e-mail', () => {
  it('When the subscriber draws and names an area of interest on My alerts, then it is saved as a drawn area', async () => {
    await signInAs('subscriber');
    // Start from no areas, so only the drawn one can match.
    const before = await getJson<ApiSubscription>('/api/subscriptions/me');
    for (const area of before.areas) await send('delete', `/api/areas-of-interest/${area.id}`);
    await page.reload();
    await expect.poll(() => page.getByText('No areas yet, so no alerts can reach you.', { exact: false }).count()).toBe(1);

    const map = page.getByRole('region', { name: 'Areas of interest map' });
    await page.getByRole('button', { name: 'Draw an area' }).click();
    await expect.poll(() => map.getAttribute('data-mode')).toBe('draw');
    // Measure after the click: bringing the button into view may have scrolled the map.
    await map.scrollIntoViewIfNeeded();
    const box = await map.boundingBox();
    if (!box) throw new Error('The map has no size.');
    const corners = [
      [0.4, 0.4],
      [0.6, 0.4],
      [0.6, 0.6],
      [0.4, 0.6],
      [0.4, 0.4],
    ].map(([fx = 0, fy = 0]) => ({ x: box.x + box.width * fx, y: box.y + box.height * fy }));
    for (const corner of corners) {
      await page.mouse.click(corner.x, corner.y);
      await page.waitForTimeout(120);
    }
    await expect.poll(() => map.getAttribute('data-mode')).toBe('select');
    await page.getByLabel('Area name').fill(drawnName);
    await page.getByRole('button', { name: 'Save area' }).click();
    await expect.poll(() => page.getByRole('list', { name: 'Areas of interest' }).textContent()).toContain(drawnName);

    const after = await getJson<ApiSubscription>('/api/subscriptions/me');
    expect(after.areas).toEqual([expect.objectContaining({ name: drawnName, kind: 'drawn' })]);
    expect(after.alertThreshold).toBe('level2');
    await expectAccessible(page, 'my alerts');
  });

  it('When a forecaster drafts a Level 3 outlook over the region and a lead approves and publishes it, then the queued e-mails are sent', async () => {
    await signInAs('forecaster');
    const { region } = await getJson<ApiRegion>('/api/office');
    const created = (await send('post', '/api/outlooks', { day: 2, headline })) as ApiOutlook;
    const { west, south, east, north } = region;
    const geometry = { type: 'Polygon', coordinates: [[[west, south], [east, south], [east, north], [west, north], [west, south]]] };
    await send('put', `/api/outlooks/${created.id}`, {
      version: created.version,
      headline,
      discussion: 'A moist, unstable air mass and strong shear support supercells by mid-afternoon.',
      hazardNotes: {},
      validFrom: created.validFrom,
      validUntil: created.validUntil,
      areas: [{ levelKey: 'level3', hazards: [{ hazard: 'hail', significant: false }], geometry, label: 'Whole valley' }],
    });
    let outlook = await getJson<ApiOutlook>(`/api/outlooks/${created.id}`);
    await send('post', `/api/outlooks/${created.id}/submit`, { version: outlook.version });

    await signInAs('lead');
    for (const action of ['approve', 'publish'] as const) {
      outlook = await getJson<ApiOutlook>(`/api/outlooks/${created.id}`);
      await send('post', `/api/outlooks/${created.id}/${action}`, { version: outlook.version });
    }

    // The test app runs without the background workers: distribute the issuance and send the
    // queue once, as the distribution and outbox workers would.
    await processDistributionJobs(journey.sd.ctx.db, journey.sd.ctx.config);
    const result = await processOutbox(journey.sd.ctx.db, journey.sd.ctx.mailer);
    expect(result.failed).toBe(0);
    expect(result.sent).toBeGreaterThanOrEqual(1);
  });

  it('When the admin opens the mail catcher, then the subscriber’s message names Level 3 and carries the map image', async () => {
    await signInAs('admin');
    await page.goto(`${journey.baseUrl}/admin/mail`);
    const messages = page.getByRole('navigation', { name: 'Caught messages' });
    const link = messages.getByRole('link').filter({ hasText: subscriberAddress }).filter({ hasText: 'Level 3' }).first();
    await link.waitFor();
    expect(await link.textContent()).toContain('Your area is at Level 3 · Numerous');
    await link.click();

    const frame = page.locator('iframe[title^="HTML of"]');
    await frame.waitFor();
    await expectAccessible(page, 'mail catcher');
    const srcdoc = (await frame.getAttribute('srcdoc')) ?? '';
    expect(srcdoc).toContain(headline);
    expect(srcdoc).toContain(drawnName);
    expect(srcdoc).toMatch(/<img[^>]+src="data:image\/png;base64,/);
    const image = page.frameLocator('iframe[title^="HTML of"]').locator('img[alt^="Map of"]');
    await image.waitFor();
    const width = await image.evaluate((img) => (img instanceof HTMLImageElement ? img.naturalWidth : 0));
    expect(width).toBeGreaterThan(100);
  });
});
