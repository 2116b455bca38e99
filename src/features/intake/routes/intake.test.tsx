// @vitest-environment jsdom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { IntakeFile, IntakeStatus } from '../../../../shared/contracts/intake';
import { fakeServer, renderApp, type FakeRoute } from '../../../test/render-app';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const base: IntakeFile = {
  id: 'f1',
  origin: 'folder',
  sourceName: 'intake folder',
  fileName: 'morning.bufr',
  sizeBytes: 1206,
  format: 'bufr',
  state: 'done',
  progressDone: 3,
  progressTotal: 3,
  soundingCount: 3,
  duplicateSoundingCount: 0,
  runIds: [],
  notes: [],
  failure: null,
  receivedAt: '2027-04-18T12:00:00.000Z',
  startedAt: '2027-04-18T12:00:00.000Z',
  finishedAt: '2027-04-18T12:00:01.500Z',
  durationMs: 1500,
};
const running: IntakeFile = { ...base, id: 'f2', fileName: 'rm3-f006.grib2', format: 'grib2', origin: 'pull', sourceName: 'Regional model', state: 'processing', progressDone: 1200, progressTotal: 40000, soundingCount: 0, finishedAt: null, durationMs: null, sizeBytes: 12_400_000 };
const failed: IntakeFile = { ...base, id: 'f3', fileName: 'cut.bufr', state: 'failed', soundingCount: 0, failure: 'bufr_dump could not read the file (unreadable message).' };

const statusWith = (available: boolean): IntakeStatus => ({ eccodes: { available, version: available ? '2.28.0' : null, installHint: 'apt-get install -y libeccodes-tools' }, folder: { watching: true, path: '/srv/stormdraft/data/intake' } });

function routes(available: boolean, files: IntakeFile[]): FakeRoute {
  return ({ method, path }) => {
    if (method === 'GET' && path === '/api/intake/status') return { status: 200, body: statusWith(available) };
    if (method === 'GET' && path === '/api/intake-files') return { status: 200, body: { files, active: files.filter((f) => f.state === 'processing').length } };
    if (method === 'GET' && path === '/api/intake-sources') return { status: 200, body: { sources: [] } };
    return undefined;
  };
}

describe('intake page', () => {
  it('when a forecaster opens it, each file shows source, size, state, soundings made, time taken and the reason of a failure, with progress of a running one', async () => {
    const server = fakeServer({ role: 'forecaster', routes: [routes(true, [running, base, failed])] });
    renderApp('/intake');
    const table = await screen.findByRole('table');
    const rows = within(table).getAllByRole('row');
    expect(rows).toHaveLength(4);
    const done = within(rows[2] as HTMLElement);
    expect(done.getByText('morning.bufr')).not.toBeNull();
    expect(done.getByText('intake folder')).not.toBeNull();
    expect(done.getByText('1 kB')).not.toBeNull();
    expect(done.getByText('Done')).not.toBeNull();
    expect(done.getByText('3 new')).not.toBeNull();
    expect(done.getByText('1.5 s')).not.toBeNull();
    const run = within(rows[1] as HTMLElement);
    expect(run.getByText('Regional model')).not.toBeNull();
    expect(run.getByText('1200 of 40000 soundings analysed')).not.toBeNull();
    expect(run.getByRole('progressbar', { name: 'Progress of rm3-f006.grib2' })).not.toBeNull();
    expect(within(rows[3] as HTMLElement).getByText('bufr_dump could not read the file (unreadable message).')).not.toBeNull();
    expect(screen.getByText('1 file being taken in…')).not.toBeNull();
    expect(screen.queryByRole('heading', { name: 'Scheduled pulls' })).toBeNull();
    expect(server.requests.some((r) => r.path === '/api/intake-sources')).toBe(false);
    expect(screen.queryByText(/ecCodes is not installed/)).toBeNull();
  });

  it('when ecCodes is missing on the server, the page says GRIB2 and BUFR need libeccodes-tools and how to install it', async () => {
    fakeServer({ role: 'lead', routes: [routes(false, [])] });
    renderApp('/intake');
    const notice = await screen.findByText('GRIB2 and BUFR files cannot be read: ecCodes is not installed');
    const box = notice.closest('[role="status"]');
    if (!(box instanceof HTMLElement)) throw new Error('the notice is not a status box');
    expect(box.textContent).toContain('libeccodes-tools');
    expect(box.textContent).toContain('sudo apt-get install -y libeccodes-tools');
    expect(await screen.findByText('Nothing taken in yet.')).not.toBeNull();
  });

  it('when an admin adds a pull source with a bad hour, the field says so without calling the server; a good one is sent with its credentials', async () => {
    const server = fakeServer({
      role: 'admin',
      routes: [
        ({ method, path }) =>
          method === 'POST' && path === '/api/intake-sources'
            ? { status: 201, body: { id: 's1', name: 'Regional model', urlTemplate: 'https://data.example.org/{yyyy}{mm}{dd}/{hh}/f{fff}.grib2', cycleHours: [0, 12], forecastHours: [0, 6], delayMinutes: 0, intervalMinutes: 15, model: null, hasAuthorization: true, enabled: true, lastPolledAt: null, lastError: null } }
            : undefined,
        routes(true, []),
      ],
    });
    renderApp('/intake');
    fireEvent.change(await screen.findByLabelText('Name'), { target: { value: 'Regional model' } });
    fireEvent.change(screen.getByLabelText('Address template'), { target: { value: 'https://data.example.org/{yyyy}{mm}{dd}/{hh}/f{fff}.grib2' } });
    fireEvent.change(screen.getByLabelText('Cycle hours (UTC)'), { target: { value: '0, 25' } });
    fireEvent.click(screen.getByRole('button', { name: 'Add pull source' }));
    expect(await screen.findByText('A cycle hour is at most 23.')).not.toBeNull();
    expect(server.requests.some((r) => r.method === 'POST')).toBe(false);

    fireEvent.change(screen.getByLabelText('Cycle hours (UTC)'), { target: { value: '0, 12' } });
    fireEvent.change(screen.getByLabelText('Forecast hours'), { target: { value: '0 6' } });
    fireEvent.change(screen.getByLabelText('Authorization (optional)'), { target: { value: 'Bearer abc' } });
    fireEvent.click(screen.getByRole('button', { name: 'Add pull source' }));
    await waitFor(() => expect(server.requests.find((r) => r.method === 'POST')?.body).toMatchObject({ name: 'Regional model', cycleHours: [0, 12], forecastHours: [0, 6], authorization: 'Bearer abc' }));
  });

  it('when a subscriber opens it, a panel names their role and no intake data is requested', async () => {
    const server = fakeServer({ role: 'subscriber' });
    renderApp('/intake');
    await screen.findByRole('heading', { name: 'Your role (subscriber) cannot open this page' });
    expect(server.requests.some((r) => r.path.startsWith('/api/intake'))).toBe(false);
  });
});
