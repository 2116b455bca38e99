import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startBrowserJourney, type BrowserJourney, signIn } from './browser';

let journey: BrowserJourney;
beforeAll(async () => {
  journey = await startBrowserJourney();
});
afterAll(async () => {
  await journey?.close();
});

describe('verification journey', () => {
  it('a lead opens a past issuance, sees the reports and the scores, then the Verification page plots the levels', async () => {
    const page = await journey.browser.newPage();
    await signIn(page, journey.baseUrl, 'lead@demo.stormdraft.test', '/review');

    // The demo's past issuance: the one whose period has ended.
    const archive = (await (await page.request.get(`${journey.baseUrl}/api/public/issuances`)).json()) as { issuances: { number: string; validUntil: string }[] };
    const past = archive.issuances.find((i) => Date.parse(i.validUntil) < Date.now());
    expect(past?.number).toMatch(/^\d{4}-\d{4}$/);

    await page.getByRole('link', { name: 'Verification' }).click();
    await page.waitForURL((url) => url.pathname === '/verification');
    const diagram = page.getByRole('img', { name: /Performance diagram/ });
    await diagram.waitFor();
    // The diagram's accessible title lists each scored level with its POD and success ratio.
    expect(await diagram.locator('title').textContent()).toMatch(/Level 1 POD \d\.\d\d, success ratio \d\.\d\d/);
    await page.getByRole('link', { name: past!.number }).click();
    await page.waitForURL((url) => url.pathname === `/issuances/${past!.number}`);

    const panel = page.getByRole('region', { name: 'Verification' });
    await panel.getByText(/storm reports? fell in the region/).waitFor();
    const reportSymbols = panel.locator('.stormdraft-marker');
    expect(await reportSymbols.count()).toBeGreaterThan(10);
    const levelTable = panel.getByRole('table', { name: /By risk level/ });
    const thunderRow = levelTable.getByRole('row', { name: /Thunderstorms or higher/ });
    const cells = await thunderRow.getByRole('cell').allTextContents();
    // hits, false alarms, misses, correct negatives, then the four scores
    expect(Number(cells[0])).toBeGreaterThan(0);
    expect(cells[4]).toMatch(/^\d\.\d\d$/);
    await page.close();
  });
});
