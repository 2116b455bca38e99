import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { expectAccessible, startBrowserJourney, type BrowserJourney, signIn } from './browser';

let journey: BrowserJourney;
beforeAll(async () => {
  journey = await startBrowserJourney();
});
afterAll(async () => {
  await journey?.close();
});

describe('browser journey: the admin edits the support-check guidance (issue 14)', () => {
  it('When the admin adds a maximum to Level 1 with the keyboard and saves, then the office stores it in SI units', async () => {
    const page = await journey.browser.newPage();
    await signIn(page, journey.baseUrl, 'admin@demo.stormdraft.test', '/admin/users');
    await page.goto(`${journey.baseUrl}/admin/settings`);
    const add = page.getByRole('button', { name: 'Add a rule to Level 1 · Isolated' });
    await add.waitFor();
    await page.getByText('Where these ingredients come from').click();
    await expectAccessible(page, 'office settings with the guidance editor');

    await add.focus();
    await page.keyboard.press('Enter');
    // The new rule is the level's third (the demo Level 1 has two). Keyboard only from here.
    const figure = page.getByLabel('Figure (Level 1 · Isolated, rule 3)');
    await figure.focus();
    await figure.selectOption('mlLclHeightM');
    await page.keyboard.press('Tab');
    await page.getByLabel('Bound (Level 1 · Isolated, rule 3)').selectOption('max');
    await page.keyboard.press('Tab');
    await page.keyboard.type('1800');
    await page.getByRole('button', { name: 'Save settings' }).focus();
    await page.keyboard.press('Enter');
    await page.getByText('Settings saved. Every page now uses them.').waitFor();

    const office = await page.request.get(`${journey.baseUrl}/api/office`);
    const body = (await office.json()) as { guidance: { levels: Record<string, { rules: unknown[] }> } };
    // The demo admin's height unit is metres, so 1800 is stored as 1800 m.
    expect(body.guidance.levels.level1?.rules).toContainEqual({ figure: 'mlLclHeightM', bound: 'max', value: 1800 });
    await page.close();
  });
});
