import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import axe from 'axe-core';
import { createServer } from 'node:net';
import type { Config } from '../../server/config';
import { listen, type Stormdraft } from '../../server/start';
import { startTestApp } from '../api/helpers/test-app';
import { demoPassword } from '../../server/services/seed.service';

export const chromiumPath = '/usr/bin/chromium';

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as AddressInfo;
      probe.close(() => resolve(port));
    });
  });
}

export interface BrowserJourney {
  baseUrl: string;
  browser: BrowserContext;
  sd: Stormdraft;
  close(): Promise<void>;
}

/**
 * Starts the real app serving the built client (dist/) on a free loopback port, and Debian's
 * chromium through playwright-core with a fresh profile.
 */
export async function startBrowserJourney(overrides: Partial<Config> = {}): Promise<BrowserJourney> {
  if (!existsSync(path.resolve(import.meta.dirname, '../../dist/index.html'))) {
    throw new Error('The client is not built: run `npm test` (it builds with vite first) or `npx vite build`.');
  }
  // PUBLIC_URL must name the real port (better-auth checks the Origin), so pick a free port first.
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const sd = await startTestApp({ ...overrides, port, publicUrl: baseUrl }, 'dist');
  const server: Server = await listen(sd.app, port);
  const profile = mkdtempSync(path.join(tmpdir(), 'stormdraft-chromium-'));
  const browser = await chromium.launchPersistentContext(profile, {
    executablePath: chromiumPath,
    headless: true,
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    viewport: { width: 1280, height: 800 },
  });
  // Fail fast with a readable locator error instead of hanging until the test timeout.
  browser.setDefaultTimeout(15_000);
  return {
    baseUrl,
    browser,
    sd,
    async close() {
      await browser.close();
      server.closeAllConnections();
      await new Promise((resolve) => server.close(resolve));
      await sd.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** The axe-core rule tags the journeys hold every page to: WCAG 2.0 and 2.1, levels A and AA. */
export const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'];

type AxeWindow = Window & { axe?: typeof axe };

/**
 * Runs axe-core on the page as it is now and fails with a readable list of every WCAG 2.1 A/AA
 * violation (rule, elements and what is wrong). Call it once on every page a journey visits,
 * after the page's content has arrived. axe is evaluated through the DevTools protocol, so the
 * app's Content-Security-Policy does not block it.
 */
export async function expectAccessible(page: Page, what = ''): Promise<void> {
  if (!(await page.evaluate(() => Boolean((window as AxeWindow).axe)))) await page.evaluate(axe.source);
  const results = await page.evaluate(async (tags) => {
    const engine = (window as AxeWindow).axe;
    if (!engine) throw new Error('axe-core did not load');
    const run = await engine.run(document, { runOnly: { type: 'tag', values: tags }, resultTypes: ['violations'] });
    return run.violations.map((v) => ({
      id: v.id,
      impact: v.impact ?? 'unknown',
      help: v.help,
      nodes: v.nodes.map((n) => `${n.target.join(' ')}: ${(n.failureSummary ?? '').replace(/\s+/g, ' ').slice(0, 240)}`),
    }));
  }, WCAG_TAGS);
  if (results.length === 0) return;
  const where = `${new URL(page.url()).pathname}${what ? ` (${what})` : ''}`;
  const lines = results.flatMap((v) => [`- ${v.id} [${v.impact}] ${v.help}: ${v.nodes.length} element(s)`, ...v.nodes.map((n) => `    ${n}`)]);
  throw new Error(`axe-core found ${results.length} WCAG 2.1 A/AA violation(s) on ${where}:\n${lines.join('\n')}`);
}

/** Signs a demo account in through the sign-in page and waits for the page it lands on. */
export async function signIn(page: Page, baseUrl: string, email: string, landing = '/desk'): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(demoPassword);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.waitForURL((url) => url.pathname === landing);
}
