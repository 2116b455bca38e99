import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { chromium, type BrowserContext } from 'playwright-core';
import { createServer } from 'node:net';
import { listen, type Stormdraft } from '../../server/start';
import { startTestApp } from '../api/helpers/test-app';

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
export async function startBrowserJourney(): Promise<BrowserJourney> {
  // PUBLIC_URL must name the real port (better-auth checks the Origin), so pick a free port first.
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  const sd = await startTestApp({ port, publicUrl: baseUrl }, 'dist');
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
