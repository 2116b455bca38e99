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
  areas: { id: string; levelKey: string }[];
}

/** Signs in (the browser context shares its session, so a later page may already be signed in). */
async function signInAsForecaster(page: Page) {
  await page.goto(`${journey.baseUrl}/sign-in`);
  await page.waitForURL((url) => url.pathname === '/sign-in' || url.pathname === '/desk');
  await page.getByRole('heading', { level: 1 }).first().waitFor();
  if (new URL(page.url()).pathname === '/desk') return;
  await page.getByLabel('E-mail').fill('forecaster@demo.stormdraft.test');
  await page.getByLabel('Password', { exact: true }).fill(demoPassword);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL((url) => url.pathname === '/desk');
}

async function readOutlook(page: Page, outlookId: string): Promise<ApiOutlook> {
  const response = await page.request.get(`${journey.baseUrl}/api/outlooks/${outlookId}`);
  expect(response.status()).toBe(200);
  return (await response.json()) as ApiOutlook;
}

const savePhase = (page: Page) => page.getByRole('status', { name: 'Save state' }).getAttribute('data-phase');

/** Rows of the "All areas" table at one level (the table lists every area of the document). */
async function areasAtLevel(page: Page, levelLabel: string): Promise<number> {
  await page.getByRole('tab', { name: 'All areas' }).click();
  const table = page.getByRole('table', { name: /Risk areas of this outlook/ });
  await table.waitFor();
  return table.getByRole('button', { name: `Select ${levelLabel}` }).count();
}

describe('browser journey: a forecaster draws a risk area on the demo draft', () => {
  let page: Page;
  let outlookId = '';
  let before: ApiOutlook;
  let newAreaId = '';
  let level2Before = 0;

  beforeAll(async () => {
    page = await journey.browser.newPage();
    await signInAsForecaster(page);
  });
  afterAll(async () => {
    await page?.close();
  });

  it('When the forecaster opens the demo draft from the desk, then the workspace shows its map, areas and save state', async () => {
    await page.getByRole('link', { name: /Day 1: Scattered severe storms/ }).first().click();
    await page.waitForURL((url) => /^\/outlooks\/[^/]+$/.test(url.pathname));
    outlookId = new URL(page.url()).pathname.split('/')[2] ?? '';
    before = await readOutlook(page, outlookId);
    expect(before.areas.length).toBeGreaterThanOrEqual(4);
    await page.getByRole('region', { name: 'Outlook map' }).waitFor();
    await expect.poll(() => savePhase(page)).toBe('saved');
    expect(await page.getByRole('region', { name: 'Status' }).getByText('Draft', { exact: true }).count()).toBe(1);
    level2Before = await areasAtLevel(page, 'Level 2 · Scattered');
    await expectAccessible(page, 'workspace');
  });

  it('When single keys are pressed outside the map, then they do nothing; with the map focused, N draws and Esc stops; arrow keys move between the panel tabs', async () => {
    const map = page.getByRole('region', { name: 'Outlook map' });
    const panel = page.getByRole('complementary', { name: 'Evidence panel' });
    // Select an existing area from the "All areas" tab; focus stays outside the map.
    await page.getByRole('tab', { name: 'All areas' }).click();
    await panel.getByRole('table', { name: /Risk areas of this outlook/ }).getByRole('button', { name: /^Select / }).first().click();
    const selectedTab = page.getByRole('tab', { name: 'Selected area' });
    await expect.poll(() => selectedTab.getAttribute('aria-selected')).toBe('true');
    const areaHeading = panel.getByRole('tabpanel').getByRole('heading', { level: 2 }).first();
    const title = await areaHeading.textContent();
    await selectedTab.focus();
    for (const key of ['n', 'Backspace', 'Delete', '3']) await page.keyboard.press(key);
    expect(await map.getAttribute('data-mode')).toBe('select');
    expect(await areaHeading.textContent()).toBe(title);

    // The tabs follow the WAI-ARIA pattern: arrows move the selection and the focus.
    await page.keyboard.press('ArrowRight');
    const allAreas = page.getByRole('tab', { name: 'All areas' });
    expect(await allAreas.getAttribute('aria-selected')).toBe('true');
    expect(await allAreas.evaluate((el) => el === document.activeElement)).toBe(true);
    expect(await selectedTab.getAttribute('tabindex')).toBe('-1');
    await page.keyboard.press('ArrowLeft');
    expect(await selectedTab.getAttribute('aria-selected')).toBe('true');

    await map.locator('.leaflet-container').focus();
    await page.keyboard.press('n');
    await expect.poll(() => map.getAttribute('data-mode')).toBe('draw');
    await page.keyboard.press('Escape');
    await expect.poll(() => map.getAttribute('data-mode')).toBe('select');
  });

  it('When a polygon is drawn by clicking map points and Level 2 is chosen, then it autosaves and the evidence panel fills in', async () => {
    const map = page.getByRole('region', { name: 'Outlook map' });
    const box = await map.boundingBox();
    if (!box) throw new Error('The map has no size.');
    await page.getByRole('button', { name: 'Draw area' }).click();
    await expect.poll(() => map.getAttribute('data-mode')).toBe('draw');
    // A quadrilateral over the middle of the demo region, where the demo soundings are.
    const corners = [
      [0.3, 0.3],
      [0.7, 0.3],
      [0.7, 0.75],
      [0.3, 0.75],
    ].map(([fx = 0, fy = 0]) => ({ x: box.x + box.width * fx, y: box.y + box.height * fy }));
    for (const corner of corners) {
      await page.mouse.click(corner.x, corner.y);
      await page.waitForTimeout(120);
    }
    const first = corners[0];
    if (!first) throw new Error('No corners.');
    await page.mouse.click(first.x, first.y);
    await expect.poll(() => map.getAttribute('data-mode')).toBe('select');

    const panel = page.getByRole('complementary', { name: 'Evidence panel' });
    await panel.getByRole('radio', { name: 'Level 2 · Scattered' }).check();
    await expect.poll(() => savePhase(page), { timeout: 15_000 }).toBe('saved');

    const after = await readOutlook(page, outlookId);
    expect(after.version).toBeGreaterThan(before.version);
    const added = after.areas.filter((a) => !before.areas.some((b) => b.id === a.id));
    expect(added).toHaveLength(1);
    expect(added[0]?.levelKey).toBe('level2');
    newAreaId = added[0]?.id ?? '';

    await expect.poll(async () => Number((await panel.getByTestId('evidence-count').textContent()) ?? '0'), { timeout: 15_000 }).toBeGreaterThan(0);
    expect(await panel.getByText(/supported|thin support|environment exceeds level|no soundings inside/).count()).toBeGreaterThan(0);
    await expectAccessible(page, 'workspace with a new area selected');
  });

  it('When the page is reloaded, then the new area is still there with its level', async () => {
    await page.reload();
    await page.getByRole('region', { name: 'Outlook map' }).waitFor();
    await expect.poll(() => areasAtLevel(page, 'Level 2 · Scattered')).toBe(level2Before + 1);
    const reloaded = await readOutlook(page, outlookId);
    expect(reloaded.areas.find((a) => a.id === newAreaId)?.levelKey).toBe('level2');
  });
});

describe('browser journey: two authors save the same draft', () => {
  it('When the second author saves a stale version, then the conflict prompt appears, nothing is overwritten, and Keep mine saves on top', async () => {
    const first = await journey.browser.newPage();
    const second = await journey.browser.newPage();
    await signInAsForecaster(first);
    const list = await first.request.get(`${journey.baseUrl}/api/outlooks?state=draft&day=1`);
    const drafts = ((await list.json()) as { outlooks: { id: string; headline: string }[] }).outlooks;
    const draft = drafts.find((o) => o.headline.startsWith('Scattered severe storms'));
    if (!draft) throw new Error('The demo draft is missing.');
    const url = `${journey.baseUrl}/outlooks/${draft.id}`;

    await first.goto(url);
    await second.goto(url);
    for (const page of [first, second]) {
      await page.getByLabel('Headline', { exact: true }).waitFor();
      await expect.poll(() => savePhase(page)).toBe('saved');
    }

    await first.getByLabel('Headline', { exact: true }).fill('First author: storms along the river valleys');
    await expect.poll(() => savePhase(first), { timeout: 15_000 }).toBe('saved');
    expect((await readOutlook(first, draft.id)).headline).toBe('First author: storms along the river valleys');

    await second.getByLabel('Headline', { exact: true }).fill('Second author: storms mainly after dark');
    await expect.poll(() => savePhase(second), { timeout: 15_000 }).toBe('conflict');
    await second.getByText('Changed by someone else since you opened it').first().waitFor();
    await expectAccessible(second, 'conflict prompt');
    // The stale save did not overwrite the first author's work.
    expect((await readOutlook(second, draft.id)).headline).toBe('First author: storms along the river valleys');

    await second.getByRole('button', { name: 'Keep mine' }).click();
    await expect.poll(() => savePhase(second), { timeout: 15_000 }).toBe('saved');
    const saved = await readOutlook(second, draft.id);
    expect(saved.headline).toBe('Second author: storms mainly after dark');

    // The first author's version is still a revision anyone can open.
    const revisions = (await (await second.request.get(`${journey.baseUrl}/api/outlooks/${draft.id}/revisions`)).json()) as { revisions: { id: string; revisionNumber: number }[] };
    const headlines = await Promise.all(
      revisions.revisions.map(async (r) => ((await (await second.request.get(`${journey.baseUrl}/api/outlook-revisions/${r.id}`)).json()) as { snapshot: { headline: string } }).snapshot.headline),
    );
    expect(headlines).toContain('First author: storms along the river valleys');

    // Reload in the first tab shows the kept version.
    await first.reload();
    await expect.poll(() => first.getByLabel('Headline', { exact: true }).inputValue()).toBe('Second author: storms mainly after dark');
    await first.close();
    await second.close();
  });
});
