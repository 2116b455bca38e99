import { cleanup, fireEvent, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { demoOffice, fakeServer, renderApp } from '../../../test/render-app';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

/** Test guidance (invented values): Level 3 needs MLCAPE and shear; significant tornado caps the LCL height. */
const guidance = {
  levels: {
    level3: {
      rules: [
        { figure: 'mlCape', bound: 'min', value: 1500 },
        { figure: 'bulkShear0to6kmMs', bound: 'min', value: 20 },
      ],
      minimumSharePercent: null,
      minimumCount: 3,
    },
  },
  hazards: { tornado: { significant: { rules: [{ figure: 'mlLclHeightM', bound: 'max', value: 1000 }], minimumSharePercent: 60, minimumCount: 4 } } },
};

type Sent = { guidance: { levels: Record<string, { rules: { figure: string; bound: string; value: number }[] }>; hazards: Record<string, unknown> } };

function serve() {
  return fakeServer({
    role: 'admin',
    routes: [
      ({ method, path, body }) => {
        if (path !== '/api/office') return undefined;
        if (method === 'GET') return { status: 200, body: { ...demoOffice, guidance } };
        return { status: 200, body: { ...demoOffice, ...(body as object), version: demoOffice.version + 1 } };
      },
    ],
  });
}

const sentBodies = (server: ReturnType<typeof fakeServer>) => server.requests.filter((r) => r.method === 'PUT').map((r) => r.body as Sent);

describe('guidance editor', () => {
  it('shows a speed rule in the person’s units (kt) and sends the stored SI value back unchanged when not edited', async () => {
    const server = serve();
    renderApp('/admin/settings');
    // 20 m/s = 38.88 kt (1 kt = 1852/3600 m/s, by definition of the knot).
    const shear = await screen.findByLabelText(/^Value \(kt\) \(Level 3 · Numerous, rule 2\)/);
    expect((shear as HTMLInputElement).value).toBe('38.88');
    fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    await screen.findByText('Settings saved. Every page now uses them.');
    const [sent] = sentBodies(server);
    expect(sent?.guidance.levels.level3?.rules[1]).toEqual({ figure: 'bulkShear0to6kmMs', bound: 'min', value: 20 });
    expect(sent?.guidance.hazards).toEqual(guidance.hazards);
  });

  it('converts a typed value from kt to m/s, removes a rule, and adds a hazard rule with a maximum', async () => {
    const server = serve();
    renderApp('/admin/settings');
    fireEvent.change(await screen.findByLabelText(/^Value \(kt\) \(Level 3 · Numerous, rule 2\)/), { target: { value: '30' } });
    fireEvent.click(screen.getByRole('button', { name: 'Remove Level 3 · Numerous, rule 1' }));
    fireEvent.click(screen.getByRole('button', { name: 'Add a rule to flash flooding' }));
    fireEvent.change(screen.getByLabelText(/^Figure \(flash flooding, rule 1\)/), { target: { value: 'corfidiUpwindMs' } });
    fireEvent.change(screen.getByLabelText(/^Bound \(flash flooding, rule 1\)/), { target: { value: 'max' } });
    fireEvent.change(screen.getByLabelText(/^Value \(kt\) \(flash flooding, rule 1\)/), { target: { value: '10' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    await screen.findByText('Settings saved. Every page now uses them.');
    const [sent] = sentBodies(server);
    const [shear] = sent?.guidance.levels.level3?.rules ?? [];
    expect(shear?.figure).toBe('bulkShear0to6kmMs');
    // 30 kt × 1852/3600 = 15.4333 m/s.
    expect(shear?.value).toBeCloseTo(15.4333, 4);
    expect(sent?.guidance.levels.level3?.rules).toHaveLength(1);
    const flood = (sent?.guidance.hazards as { flood?: { ordinary?: { rules: { figure: string; bound: string; value: number }[] } } }).flood;
    expect(flood?.ordinary?.rules[0]?.bound).toBe('max');
    // 10 kt = 5.1444 m/s.
    expect(flood?.ordinary?.rules[0]?.value).toBeCloseTo(5.1444, 4);
  });

  it('checks rules with the shared schema before sending: an empty value and a share over 100 % are named beside their fields', async () => {
    const server = serve();
    renderApp('/admin/settings');
    fireEvent.click(await screen.findByRole('button', { name: 'Add a rule to Level 1 · Isolated' }));
    fireEvent.change(screen.getByLabelText(/^Minimum share \(%\) for Level 1 · Isolated/), { target: { value: '150' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    const value = await screen.findByLabelText(/^Value \(J\/kg\) \(Level 1 · Isolated, rule 1\)/);
    expect(value.getAttribute('aria-invalid')).toBe('true');
    const levelOne = value.closest('fieldset');
    if (!levelOne) throw new Error('each level is a fieldset');
    expect(within(levelOne as HTMLElement).getByText('The rule needs a number.')).not.toBeNull();
    expect(within(levelOne as HTMLElement).getByText('The minimum share is between 1 and 100 %.')).not.toBeNull();
    expect(server.requests.some((request) => request.method === 'PUT')).toBe(false);
  });

  it('names the published basis of each hazard ingredient in its help', async () => {
    serve();
    renderApp('/admin/settings');
    fireEvent.click(await screen.findByText('Where these ingredients come from'));
    expect(screen.getAllByText(/Coffer et al\. 2019, Wea\. Forecasting 34/).length).toBeGreaterThan(0);
    expect(screen.getAllByText(/Corfidi 2003, Wea\. Forecasting 18/).length).toBeGreaterThan(0);
    expect(screen.getAllByText(/Esterheld and Giuliano 2008/).length).toBe(1);
  });
});
