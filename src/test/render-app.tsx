import { configure, render } from '@testing-library/react';
import { createMemoryRouter, RouterProvider } from 'react-router';
import { vi } from 'vitest';
import { AppProviders } from '../app/providers';
import { createRoutes } from '../app/router';
import { createQueryClient } from '../lib/query-client';
import { defaultRiskLadder, type OfficeSettings } from '../../shared/contracts/office';
import type { Me } from '../../shared/contracts/users';
import type { Role } from '../../shared/contracts/common';

// Route modules are lazy imports; the first one in a test run can take over a second to transform.
configure({ asyncUtilTimeout: 5000 });

/** Test doubles for the server. Only the answers a test needs; anything else is a 404. */
export type FakeRoute = (request: { method: string; path: string; body: unknown }) => { status: number; body?: unknown } | undefined;

export const demoOffice: OfficeSettings = {
  id: 'office-1',
  name: 'Meridian Valley Weather Office',
  region: { west: -96.5, south: 35.5, east: -87.5, north: 41.5 },
  timeZone: 'America/Chicago',
  riskLadder: defaultRiskLadder,
  guidance: { levels: {}, hazards: {} },
  allowSelfApproval: false,
  version: 3,
  updatedAt: '2026-12-01T12:00:00.000Z',
  baseMap: { tileUrl: null, attribution: null },
};

export function meFor(role: Role): Me {
  return {
    user: { id: `user-${role}`, name: `Demo ${role}`, email: `${role}@demo.stormdraft.test`, role },
    preferences: { units: { temperature: 'C', height: 'm', speed: 'kt' } },
  };
}

export interface FakeServer {
  requests: { method: string; path: string; body: unknown }[];
}

/** Replaces `fetch` with a router over `routes`; `/api/me` and `/api/office` have defaults. */
export function fakeServer(options: { role: Role | null; routes?: FakeRoute[] }): FakeServer {
  const server: FakeServer = { requests: [] };
  const defaults: FakeRoute = ({ method, path }) => {
    if (method === 'GET' && path === '/api/me') {
      return options.role ? { status: 200, body: meFor(options.role) } : { status: 401, body: { error: { code: 'UNAUTHENTICATED', message: 'Please sign in to continue.' } } };
    }
    if (method === 'GET' && path === '/api/office') return { status: 200, body: demoOffice };
    return undefined;
  };
  vi.stubGlobal('fetch', async (input: RequestInfo | URL, init?: RequestInit) => {
    const url = new URL(typeof input === 'string' ? input : input instanceof URL ? input.href : input.url, 'http://localhost');
    const method = (init?.method ?? 'GET').toUpperCase();
    const body: unknown = typeof init?.body === 'string' ? JSON.parse(init.body) : undefined;
    const request = { method, path: url.pathname, body };
    server.requests.push(request);
    for (const route of [...(options.routes ?? []), defaults]) {
      const answer = route(request);
      if (answer) {
        return new Response(answer.body === undefined ? '' : JSON.stringify(answer.body), {
          status: answer.status,
          headers: { 'Content-Type': 'application/json' },
        });
      }
    }
    return new Response(JSON.stringify({ error: { code: 'NOT_FOUND', message: 'We could not find that.' } }), { status: 404 });
  });
  return server;
}

/** Renders the whole app (real providers, real routes) at `path`. */
export function renderApp(path: string) {
  const queryClient = createQueryClient();
  const router = createMemoryRouter(createRoutes(queryClient), { initialEntries: [path] });
  const view = render(
    <AppProviders queryClient={queryClient}>
      <RouterProvider router={router} />
    </AppProviders>,
  );
  return { ...view, router, queryClient };
}
