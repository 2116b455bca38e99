import { cleanup, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { fakeServer, renderApp } from '../test/render-app';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const navLinks = async () => {
  const nav = await screen.findByRole('navigation', { name: 'Main' });
  return within(nav)
    .getAllByRole('link')
    .map((link) => link.textContent);
};

describe('app shell by role', () => {
  it('when a lead opens the forecast desk, the navigation offers review and the desk but no admin pages', async () => {
    fakeServer({ role: 'lead' });
    renderApp('/desk');
    await screen.findByRole('heading', { level: 1, name: 'Forecast desk' });
    expect(screen.getAllByRole('heading', { level: 1 }).map((heading) => heading.textContent)).toEqual(['Forecast desk']);
    expect(await navLinks()).toEqual(['Review queue', 'Forecast desk', 'Soundings', 'Intake', 'Verification', 'Subscribers', 'Public bulletin', 'Account']);
  });

  it('when an admin is signed in, the navigation lists users, settings, subscribers, outbox, webhooks and mail', async () => {
    fakeServer({ role: 'admin', routes: [({ path }) => (path === '/api/users' ? { status: 200, body: { users: [] } } : undefined)] });
    renderApp('/admin/users');
    await screen.findByRole('heading', { level: 1, name: 'Users' });
    expect(screen.getAllByRole('heading', { level: 1 }).map((heading) => heading.textContent)).toEqual(['Users']);
    expect(await navLinks()).toEqual(['Users', 'Office settings', 'Subscribers', 'Outbox', 'Webhooks', 'Mail catcher', 'Soundings', 'Intake', 'Verification', 'Public bulletin', 'Account']);
  });

  it('when a subscriber opens an admin page, a panel names their role and no admin data is requested', async () => {
    const server = fakeServer({ role: 'subscriber' });
    renderApp('/admin/users');
    await screen.findByRole('heading', { name: 'Your role (subscriber) cannot open this page' });
    expect(screen.queryByRole('heading', { level: 1, name: 'Users' })).toBeNull();
    expect(server.requests.some((request) => request.path === '/api/users')).toBe(false);
  });

  it('when nobody is signed in, / opens the public bulletin with the caution', async () => {
    fakeServer({
      role: null,
      routes: [({ path }) => (path === '/api/public/bulletin' ? { status: 200, body: { issuances: [], caution: 'planning guidance, not a warning' } } : undefined)],
    });
    renderApp('/');
    await screen.findByRole('heading', { level: 1, name: 'Severe-thunderstorm outlook' });
    expect(screen.getAllByRole('heading', { level: 1 }).map((heading) => heading.textContent)).toEqual(['Severe-thunderstorm outlook']);
    expect((await screen.findByText('No outlook has been published yet')).closest('a')).toBeNull();
    expect(screen.getByRole('complementary', { name: 'Caution' }).textContent).toContain('planning guidance, not a warning');
  });

  it('when a signed-in forecaster opens /, they land on the forecast desk', async () => {
    fakeServer({ role: 'forecaster' });
    const { router } = renderApp('/');
    await screen.findByRole('heading', { level: 1, name: 'Forecast desk' });
    expect(screen.getAllByRole('heading', { level: 1 }).map((heading) => heading.textContent)).toEqual(['Forecast desk']);
    expect(router.state.location.pathname).toBe('/desk');
  });

  it('when nobody is signed in, a staff page sends them to sign in and remembers where they were going', async () => {
    fakeServer({ role: null });
    const { router } = renderApp('/review');
    await screen.findByRole('heading', { level: 1, name: 'Sign in to Stormdraft' });
    expect(screen.getAllByRole('heading', { level: 1 }).map((heading) => heading.textContent)).toEqual(['Sign in to Stormdraft']);
    expect(router.state.location.search).toBe('?next=%2Freview');
  });

  it('when the path is unknown, the 404 page says so', async () => {
    fakeServer({ role: null });
    renderApp('/no/such/page');
    await screen.findByRole('heading', { level: 1, name: 'We could not find that page' });
    expect(screen.getAllByRole('heading', { level: 1 }).map((heading) => heading.textContent)).toEqual(['We could not find that page']);
  });
});
