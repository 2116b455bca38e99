import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { demoPassword } from '../../server/services/seed.service';
import type { Role } from '../../shared/contracts/common';
import { expectAccessible, startBrowserJourney, type BrowserJourney } from './browser';

const homes: Record<Role, { path: string; heading: string }> = {
  forecaster: { path: '/desk', heading: 'Forecast desk' },
  lead: { path: '/review', heading: 'Review queue' },
  subscriber: { path: '/alerts', heading: 'My alerts' },
  admin: { path: '/admin/users', heading: 'Users' },
};

let journey: BrowserJourney;
beforeAll(async () => {
  journey = await startBrowserJourney();
});
afterAll(async () => {
  await journey?.close();
});

async function signIn(page: Page, role: Role) {
  await page.goto(`${journey.baseUrl}/sign-in`);
  await page.getByLabel('E-mail').waitFor();
  await expectAccessible(page, 'sign-in');
  await page.getByLabel('E-mail').fill(`${role}@demo.stormdraft.test`);
  await page.getByLabel('Password', { exact: true }).fill(demoPassword);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
}

describe('browser journey: sign in as each demo role', () => {
  it('When nobody is signed in, then the public bulletin shows the caution', async () => {
    const page = await journey.browser.newPage();
    await page.goto(journey.baseUrl);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Severe-thunderstorm outlook');
    expect(await page.getByText('planning guidance, not a warning', { exact: false }).count()).toBeGreaterThan(0);
    await expectAccessible(page, 'public bulletin');
    await page.close();
  });

  it.each(Object.keys(homes) as Role[])('When the demo %s signs in, then that role’s home opens, and signing out ends the session', async (role) => {
    const page = await journey.browser.newPage();
    await signIn(page, role);
    await page.waitForURL((url) => url.pathname === homes[role].path);
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe(homes[role].heading);
    await expectAccessible(page, `${role} home`);
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL((url) => url.pathname === '/sign-in' || url.pathname === '/bulletin');
    const me = await page.request.get(`${journey.baseUrl}/api/me`);
    expect(me.status()).toBe(401);
    await page.close();
  });

  it('When a forecaster opens an admin page, then the page refuses and says why', async () => {
    const page = await journey.browser.newPage();
    await signIn(page, 'forecaster');
    await page.waitForURL((url) => url.pathname === '/desk');
    await page.goto(`${journey.baseUrl}/admin/users`);
    await expect.poll(() => page.getByText('Your role (forecaster) cannot open this page').count()).toBe(1);
    await expectAccessible(page, 'refused');
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.close();
  });
});
