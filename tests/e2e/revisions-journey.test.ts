import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserJourney, type BrowserJourney, signIn } from './browser';

/**
 * Issue 12 item 3: opening revision 1 of the demo amendment showed "The server sent an answer
 * this page does not understand". Every revision of every demo outlook must open in the browser.
 */
let journey: BrowserJourney;
beforeAll(async () => {
  journey = await startBrowserJourney();
});
afterAll(async () => {
  await journey?.close();
});

describe('revision pages', () => {
  it('When a forecaster opens every revision of every demo outlook, then each shows its revision number, valid period and map', async () => {
    const page = await journey.browser.newPage();
    await signIn(page, journey.baseUrl, 'forecaster@demo.stormdraft.test');

    const list = (await (await page.request.get(`${journey.baseUrl}/api/outlooks`)).json()) as { outlooks: { id: string; headline: string; amendsIssuanceId?: string | null }[] };
    expect(list.outlooks.length).toBeGreaterThanOrEqual(3);
    const pages: string[] = [];
    for (const outlook of list.outlooks) {
      const revisions = (await (await page.request.get(`${journey.baseUrl}/api/outlooks/${outlook.id}/revisions`)).json()) as { revisions: { id: string; revisionNumber: number }[] };
      for (const revision of revisions.revisions) {
        await page.goto(`${journey.baseUrl}/outlooks/${outlook.id}/revisions/${revision.id}`);
        await page.getByRole('heading', { name: `Revision ${revision.revisionNumber} (read only)` }).waitFor();
        await expect(page.getByText(/does not understand/).count()).resolves.toBe(0);
        await expect(page.getByText(/Valid /).first().isVisible()).resolves.toBe(true);
        pages.push(`${outlook.headline} #${revision.revisionNumber}`);
      }
    }
    // The demo amendment's first revision is among the pages opened.
    const amendment = (await (await page.request.get(`${journey.baseUrl}/api/outlooks?state=draft`)).json()) as { outlooks: { id: string; headline: string }[] };
    const amendmentDraft = amendment.outlooks.find((o) => o.headline.startsWith('Scattered severe storms'));
    expect(pages.some((p) => amendmentDraft !== undefined && p === `${amendmentDraft.headline} #1`)).toBe(true);
    expect(pages.length).toBeGreaterThanOrEqual(6);
    await page.close();
  });
});
