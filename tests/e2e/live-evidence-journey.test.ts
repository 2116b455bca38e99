import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page, Request } from 'playwright-core';
import { expectAccessible, startBrowserJourney, type BrowserJourney, signIn } from './browser';

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

const savePhase = (page: Page) => page.getByRole('status', { name: 'Save state' }).getAttribute('data-phase');

describe('browser journey: evidence follows a vertex before any save', () => {
  let page: Page;
  let outlookId = '';
  const saves: Request[] = [];

  beforeAll(async () => {
    page = await journey.browser.newPage();
    await signInAsForecaster(page);
    const list = await page.request.get(`${journey.baseUrl}/api/outlooks?state=draft&day=1`);
    const drafts = ((await list.json()) as { outlooks: { id: string; headline: string }[] }).outlooks;
    const draft = drafts.find((o) => o.headline.startsWith('Scattered severe storms'));
    if (!draft) throw new Error('The demo draft is missing.');
    outlookId = draft.id;
    page.on('request', (request) => {
      if (request.method() === 'PUT' && new URL(request.url()).pathname === `/api/outlooks/${outlookId}`) saves.push(request);
    });
  });
  afterAll(async () => {
    await page?.close();
  });

  it('When a small area is drawn, dragged out by one vertex and released, then the count, the result and the map shapes change before the autosave, and the saved check agrees', async () => {
    await page.goto(`${journey.baseUrl}/outlooks/${outlookId}`);
    const map = page.getByRole('region', { name: 'Outlook map' });
    await map.waitFor();
    await expect.poll(() => savePhase(page)).toBe('saved');
    const box = await map.boundingBox();
    if (!box) throw new Error('The map has no size.');
    const at = (fx: number, fy: number) => ({ x: box.x + box.width * fx, y: box.y + box.height * fy });

    // A thin sliver across the north of the region: few soundings, if any, inside it.
    await page.getByRole('button', { name: 'Draw area' }).click();
    await expect.poll(() => map.getAttribute('data-mode')).toBe('draw');
    const corners = [at(0.5, 0.33), at(0.3, 0.3), at(0.7, 0.3)];
    for (const corner of corners) {
      await page.mouse.click(corner.x, corner.y);
      await page.waitForTimeout(120);
    }
    const first = corners[0];
    if (!first) throw new Error('No corners.');
    await page.mouse.click(first.x, first.y);
    await expect.poll(() => map.getAttribute('data-mode')).toBe('select');

    // Once saved, the server's answer is shown (not a preview).
    const panel = page.getByRole('complementary', { name: 'Evidence panel' });
    const evidence = panel.locator('[data-evidence]');
    await expect.poll(() => savePhase(page), { timeout: 15_000 }).toBe('saved');
    await expect.poll(() => evidence.getAttribute('data-evidence'), { timeout: 15_000 }).toBe('record');
    const count = async () => Number((await panel.getByTestId('evidence-count').textContent()) ?? 'NaN');
    const result = async () => (await panel.getByTestId('support-result').textContent()) ?? '';
    const countBefore = await count();
    const resultBefore = await result();
    const savesBefore = saves.length;
    await expectAccessible(page, 'workspace with the small area saved');

    // Drag the sliver's southern vertex far south, holding the mouse down: a wide triangle.
    await page.getByRole('button', { name: 'Edit vertices' }).click();
    await expect.poll(() => map.getAttribute('data-mode')).toBe('edit');
    await page.mouse.move(first.x, first.y);
    await page.mouse.down();
    const target = at(0.52, 0.9);
    await page.mouse.move(target.x, target.y, { steps: 25 });

    await expect.poll(() => evidence.getAttribute('data-evidence')).toBe('preview');
    await expect.poll(count).toBeGreaterThan(countBefore + 2);
    await expect.poll(result).not.toBe(resultBefore);
    expect(await panel.getByTestId('evidence-preview').count()).toBe(1);
    // The map marks every sounding of the previewed count with its judgement shape.
    await expect.poll(() => map.locator('.sd-judgement').count()).toBe(await count());
    expect(saves.length, 'no save has been sent while dragging').toBe(savesBefore);
    await expectAccessible(page, 'live preview while dragging');

    await page.mouse.up();
    const liveCount = await count();
    const liveResult = await result();
    expect(saves.length, 'the autosave waits after the release').toBe(savesBefore);

    // After the autosave the server's answer replaces the preview, and agrees with it.
    await expect.poll(() => saves.length, { timeout: 15_000 }).toBeGreaterThan(savesBefore);
    await expect.poll(() => evidence.getAttribute('data-evidence'), { timeout: 15_000 }).toBe('record');
    expect(await count()).toBe(liveCount);
    expect(await result()).toBe(liveResult);
    expect(await panel.getByTestId('evidence-preview').count()).toBe(0);
    const legend = page.getByTestId('judgement-legend');
    expect(await legend.textContent()).toContain('Soundings in the selected area');
  });
});
