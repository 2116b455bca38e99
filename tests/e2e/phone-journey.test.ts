import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Locator, Page } from 'playwright-core';
import { demoPassword } from '../../server/services/seed.service';
import { signedInAgent } from '../api/helpers/test-app';
import { startBrowserJourney, type BrowserJourney } from './browser';

/**
 * Issue 13 items 1 and 3 in a real browser at phone size (390 × 844 CSS pixels, a common
 * phone viewport): no page scrolls sideways, the main actions are on screen and work, and the
 * bulletin never shows an expired outlook as current.
 */
const phone = { width: 390, height: 844 };

let journey: BrowserJourney;
let page: Page;
let expiredDay2Number: string;

beforeAll(async () => {
  journey = await startBrowserJourney();
  page = await journey.browser.newPage();
  await page.setViewportSize(phone);

  // A Day 2 issued long ago (its valid period ended in 2025), published through the real API.
  // The app only takes writes from its own origin (the journey's PUBLIC_URL).
  const forecaster = await signedInAgent(journey.sd.app, 'forecaster', demoPassword, journey.baseUrl);
  const lead = await signedInAgent(journey.sd.app, 'lead', demoPassword, journey.baseUrl);
  const created = (await forecaster.post('/api/outlooks').send({ day: 2, issuanceTime: '2025-05-01T15:00:00Z', headline: 'Expired Day 2 headline' })).body;
  const square = { type: 'Polygon', coordinates: [[[-94, 37], [-92, 37], [-92, 39], [-94, 39], [-94, 37]]] };
  let version: number = (
    await forecaster.put(`/api/outlooks/${created.id}`).send({ version: created.version, headline: 'Expired Day 2 headline', discussion: 'Old.', hazardNotes: {}, validFrom: created.validFrom, validUntil: created.validUntil, areas: [{ levelKey: 'level1', hazards: [], geometry: square }] })
  ).body.version;
  for (const [agent, action] of [[forecaster, 'submit'], [lead, 'approve'], [lead, 'publish']] as const) {
    const res = await agent.post(`/api/outlooks/${created.id}/${action}`).send({ version });
    if (res.status !== 200) throw new Error(`${action} failed: ${res.status} ${res.text}`);
    version = res.body.version;
    if (action === 'publish') expiredDay2Number = res.body.issuanceNumber;
  }
}, 90_000);
afterAll(async () => {
  await journey?.close();
});

/** The page does not scroll sideways: nothing is wider than the viewport. */
async function expectNoSidewaysScroll(where: string) {
  const widths = await page.evaluate(() => ({ scroll: document.documentElement.scrollWidth, inner: window.innerWidth }));
  expect(widths.scroll, `${where} scrolls sideways`).toBeLessThanOrEqual(widths.inner);
}

/** Visible, enabled and wholly inside the viewport's width once scrolled to. */
async function expectUsable(locator: Locator, what: string) {
  await locator.scrollIntoViewIfNeeded();
  expect(await locator.isVisible(), `${what} is visible`).toBe(true);
  expect(await locator.isEnabled(), `${what} is enabled`).toBe(true);
  const box = await locator.boundingBox();
  expect(box, `${what} has a box`).not.toBeNull();
  expect(box?.x ?? -1, `${what} starts on screen`).toBeGreaterThanOrEqual(0);
  expect((box?.x ?? 0) + (box?.width ?? Number.POSITIVE_INFINITY), `${what} ends on screen`).toBeLessThanOrEqual(phone.width);
}

const homes = { forecaster: '/desk', lead: '/review', subscriber: '/alerts', admin: '/admin/users' } as const;

async function signInAs(person: keyof typeof homes) {
  await journey.browser.clearCookies();
  await page.goto(`${journey.baseUrl}/sign-in`);
  await expectNoSidewaysScroll('/sign-in');
  await page.getByLabel('E-mail').fill(`${person}@demo.stormdraft.test`);
  await page.getByLabel('Password', { exact: true }).fill(demoPassword);
  await expectUsable(page.getByRole('button', { name: 'Sign in', exact: true }), 'Sign in');
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL((url) => url.pathname === homes[person]);
}

describe('the public bulletin on a phone', () => {
  it('When the bulletin opens at 390 px, then it fits, shows the static map first and opens the interactive map on request', async () => {
    await page.goto(`${journey.baseUrl}/bulletin`);
    await page.getByRole('heading', { name: 'Severe-thunderstorm outlook' }).waitFor();
    const staticMap = page.getByRole('img', { name: /^Risk map of issuance/ });
    await staticMap.waitFor();
    // The static map draws the boundary lines once the light overview level has loaded.
    await expect.poll(() => staticMap.locator('path[stroke="#7d8898"]').getAttribute('d').then((d) => (d ?? '').length)).toBeGreaterThan(100);
    expect(await page.locator('.leaflet-container').count()).toBe(0);
    await expectNoSidewaysScroll('/bulletin');

    const open = page.getByRole('button', { name: /Open the interactive map/ });
    await expectUsable(open, 'Open the interactive map');
    await open.click();
    await page.locator('.leaflet-container').waitFor();
    await expectNoSidewaysScroll('/bulletin with the interactive map');
  });

  it('When a Day 2 issuance has expired, then the Day 2 tab says none is in force and never shows it', async () => {
    await page.goto(`${journey.baseUrl}/bulletin`);
    const day2 = page.getByRole('tab', { name: /Day 2/ });
    await expectUsable(day2, 'the Day 2 tab');
    expect(await day2.textContent()).toMatch(/none in force/);
    await day2.click();
    await page.getByText(/No Day 2 outlook in force since .+ UTC/).waitFor();
    const text = (await page.locator('main').textContent()) ?? '';
    expect(text).not.toContain(expiredDay2Number);
    expect(text).not.toContain('Expired Day 2 headline');
    await expectNoSidewaysScroll('/bulletin, Day 2');
  });

  it('When the archive opens at 390 px, then it fits (its table scrolls inside itself)', async () => {
    await page.goto(`${journey.baseUrl}/archive`);
    await page.getByRole('heading', { level: 1 }).waitFor();
    await page.getByRole('table').waitFor();
    await expectNoSidewaysScroll('/archive');
  });
});

describe("the subscriber's pages on a phone", () => {
  it('When a subscriber signs in at 390 px, then My alerts fits, the map and forms stack, and the actions are usable', async () => {
    await signInAs('subscriber');
    await page.getByRole('heading', { name: 'My alerts' }).waitFor();
    await page.locator('.leaflet-container').waitFor();
    await expectNoSidewaysScroll('/alerts');
    // Stacked: the alert settings start below the map, not beside it.
    const mapBox = await page.locator('.leaflet-container').boundingBox();
    const saveBox = await page.getByRole('button', { name: 'Save settings' }).boundingBox();
    expect((saveBox?.y ?? 0) > (mapBox?.y ?? 0) + (mapBox?.height ?? 0)).toBe(true);
    await expectUsable(page.getByRole('button', { name: 'Draw an area' }), 'Draw an area');
    await expectUsable(page.getByRole('button', { name: 'Pause alerts' }), 'Pause alerts');
    await expectUsable(page.getByRole('radio', { name: /Level 3/ }), 'the Level 3 threshold');
  });

  it('When the subscriber opens the menu, then the navigation appears and leads to their account page, which fits', async () => {
    const menu = page.getByRole('button', { name: 'Menu' });
    await expectUsable(menu, 'Menu');
    // Collapsed on a phone: the page links are hidden until the menu opens.
    expect(await page.getByRole('link', { name: 'Account' }).isVisible()).toBe(false);
    await menu.click();
    expect(await menu.getAttribute('aria-expanded')).toBe('true');
    await expectUsable(page.getByRole('link', { name: 'Account' }), 'the Account link');
    await page.getByRole('link', { name: 'Account' }).click();
    await page.waitForURL((url) => url.pathname === '/account');
    await page.getByRole('heading', { level: 1 }).waitFor();
    expect(await page.getByRole('link', { name: 'My alerts' }).isVisible()).toBe(false);
    await expectNoSidewaysScroll('/account');
  });
});

describe('signed-in staff pages on a phone', () => {
  const pages: { person: keyof typeof homes; paths: string[] }[] = [
    { person: 'forecaster', paths: ['/desk', '/soundings'] },
    { person: 'lead', paths: ['/review'] },
    { person: 'admin', paths: ['/admin/users', '/admin/settings', '/admin/outbox', '/admin/mail'] },
  ];
  for (const { person, paths } of pages) {
    it(`When ${person === 'admin' ? 'an' : 'a'} ${person} opens ${paths.join(', ')} at 390 px, then no page scrolls sideways`, async () => {
      await signInAs(person);
      for (const pathname of paths) {
        await page.goto(`${journey.baseUrl}${pathname}`);
        await page.getByRole('heading', { level: 1 }).first().waitFor();
        await page.waitForLoadState('networkidle');
        await expectNoSidewaysScroll(pathname);
        await expectUsable(page.getByRole('button', { name: 'Menu' }), `Menu on ${pathname}`);
        // Each list's first item opens a detail page (an outlook, a sounding, a review): it fits too.
        const detail = { '/desk': 'a[href^="/outlooks/"]', '/soundings': 'a[href^="/soundings/"]:not([href$="/map"]):not([href$="/upload"])', '/review': 'a[href^="/review/"]' }[pathname];
        if (detail === undefined) continue;
        const href = await page.locator(detail).first().getAttribute('href');
        expect(href, `a detail link on ${pathname}`).toMatch(/^\/(outlooks|soundings|review)\/[0-9a-f-]{36}$/);
        await page.goto(`${journey.baseUrl}${href ?? ''}`);
        await page.getByRole('heading', { level: 1 }).first().waitFor();
        await page.waitForLoadState('networkidle');
        await expectNoSidewaysScroll(href ?? pathname);
      }
    });
  }
});
