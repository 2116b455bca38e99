import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserJourney, type BrowserJourney, signIn } from './browser';

/**
 * The review screen's buttons come from the same shared function the server enforces
 * (issue 12 item 1, issue 11 item 4): a lead who wrote the version under review is offered no
 * Approve button and is told why.
 */
let journey: BrowserJourney;
beforeAll(async () => {
  journey = await startBrowserJourney();
});
afterAll(async () => {
  await journey?.close();
});

describe('four-eyes on the review screen', () => {
  it('When the lead wrote and submitted the draft, then the lead sees Return but no Approve, and the reason', async () => {
    const page = await journey.browser.newPage();
    const headers = { Origin: journey.baseUrl };
    await signIn(page, journey.baseUrl, 'lead@demo.stormdraft.test', '/review');

    const created = await page.request.post(`${journey.baseUrl}/api/outlooks`, { headers, data: { day: 3, headline: 'Written by the lead' } });
    expect(created.status()).toBe(201);
    const outlook = (await created.json()) as { id: string; version: number };
    const submitted = await page.request.post(`${journey.baseUrl}/api/outlooks/${outlook.id}/submit`, { headers, data: { version: outlook.version } });
    expect(submitted.status()).toBe(200);

    await page.goto(`${journey.baseUrl}/review/${outlook.id}`);
    await page.getByRole('button', { name: 'Return with comment…' }).waitFor();
    await expect(page.getByRole('button', { name: 'Approve', exact: true }).count()).resolves.toBe(0);
    await expect(page.getByText(/another lead must approve it \(four-eyes rule\)/).isVisible()).resolves.toBe(true);
    await page.close();
  });
});
