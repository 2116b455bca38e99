import { cleanup, fireEvent, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { demoOffice, fakeServer, renderApp } from '../../../test/render-app';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('office settings page', () => {
  it('when someone else saved first, offers Keep mine, which re-sends my values with the newer version', async () => {
    let officeVersion = demoOffice.version;
    let puts = 0;
    const server = fakeServer({
      role: 'admin',
      routes: [
        ({ method, path, body }) => {
          if (path !== '/api/office') return undefined;
          if (method === 'GET') return { status: 200, body: { ...demoOffice, version: officeVersion } };
          puts += 1;
          if (puts === 1) {
            officeVersion = 4; // another admin saved in the meantime
            return { status: 409, body: { error: { code: 'CONFLICT', message: 'This was changed by someone else since you opened it.' } } };
          }
          return { status: 200, body: { ...demoOffice, ...(body as object), version: 5 } };
        },
      ],
    });
    renderApp('/admin/settings');
    const name = await screen.findByLabelText('Office name');
    fireEvent.change(name, { target: { value: 'Meridian Valley Office' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));

    expect((await screen.findByText('Changed by someone else since you opened it')).closest('[role="alert"], [role="status"]')).not.toBeNull();
    fireEvent.click(screen.getByRole('button', { name: 'Keep mine' }));
    expect((await screen.findByText('Settings saved. Every page now uses them.')).closest('[role="status"]')).not.toBeNull();

    const sent = server.requests.filter((request) => request.method === 'PUT').map((request) => request.body as { name: string; version: number });
    expect(sent).toEqual([expect.objectContaining({ name: 'Meridian Valley Office', version: 3 }), expect.objectContaining({ name: 'Meridian Valley Office', version: 4 })]);
  });

  it('shows the server’s field messages beside the region fields', async () => {
    fakeServer({
      role: 'admin',
      routes: [
        ({ method, path }) =>
          method === 'PUT' && path === '/api/office'
            ? {
                status: 400,
                body: { error: { code: 'VALIDATION_FAILED', message: 'Some fields need attention.', issues: [{ path: 'region.north', message: 'The region lies outside the service area.' }] } },
              }
            : undefined,
      ],
    });
    renderApp('/admin/settings');
    await screen.findByLabelText('Office name');
    fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    const north = screen.getByLabelText('North');
    expect((await screen.findByText('The region lies outside the service area.')).id).toMatch(/error$/);
    expect(north.getAttribute('aria-invalid')).toBe('true');
  });

  it('checks the form with the shared schema before sending', async () => {
    const server = fakeServer({ role: 'admin' });
    renderApp('/admin/settings');
    fireEvent.change(await screen.findByLabelText('East'), { target: { value: '-100' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    expect((await screen.findByText('East must be greater than west.')).id).toMatch(/error$/);
    expect(server.requests.some((request) => request.method === 'PUT')).toBe(false);
  });
});
