import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { cleanup, fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { parseSoundingCsv, type SoundingLevel } from '../../../../shared/sounding';
import { SoundingWorkbench } from './sounding-workbench';

function fixture(name: string): SoundingLevel[] {
  const text = readFileSync(resolve(process.cwd(), 'tests/fixtures/soundings', name), 'utf8');
  const parsed = parseSoundingCsv(text, name);
  if (!parsed.ok) throw new Error(`fixture ${name} did not parse`);
  return parsed.value.levels;
}

// OAX 2014-06-16 19 UTC (tests/fixtures/soundings/oax_20140616_19z.csv): surface 27.8 °C / 23.8 °C.
const levels = fixture('oax_20140616_19z.csv');
const metric = { temperature: 'C', height: 'm', speed: 'kt' } as const;

/** The value cell of an index row, found by its row header. */
function indexValue(label: string): string {
  const header = screen.getByRole('rowheader', { name: label });
  const row = header.closest('tr');
  if (!row) throw new Error(`no row for ${label}`);
  return within(row).getByRole('cell').textContent ?? '';
}

afterEach(cleanup);

describe('SoundingWorkbench', () => {
  it('when the surface dewpoint is raised by 2 K, the shown SBCAPE and MLCAPE change and a delta line appears', () => {
    render(<SoundingWorkbench levels={levels} units={metric} />);
    const sbBefore = indexValue('SBCAPE');
    const mlBefore = indexValue('MLCAPE');
    expect(screen.getByText(/No change yet/)).toBeTruthy();

    const dewpoint = screen.getByLabelText('Surface dewpoint (°C)');
    expect((dewpoint as HTMLInputElement).value).toBe('23.8');
    fireEvent.change(dewpoint, { target: { value: '25.8' } });

    expect(indexValue('SBCAPE')).not.toBe(sbBefore);
    expect(indexValue('MLCAPE')).not.toBe(mlBefore);
    const deltas = screen.getByText('Surface-based:').closest('li');
    expect(deltas?.textContent).toMatch(/CAPE \+\d+\u202fJ\/kg/);
    expect(deltas?.textContent).toMatch(/LCL \u2212\d+\u202fm/);
  });

  it('refuses a dewpoint above the temperature with an inline message and keeps the indices', () => {
    render(<SoundingWorkbench levels={levels} units={metric} />);
    const before = indexValue('SBCAPE');
    fireEvent.change(screen.getByLabelText('Surface dewpoint (°C)'), { target: { value: '30' } });
    expect(screen.getByRole('alert').textContent).toMatch(/dewpoint cannot be higher than the temperature/);
    expect(indexValue('SBCAPE')).toBe(before);
  });

  it('reset brings back the original values', () => {
    render(<SoundingWorkbench levels={levels} units={metric} />);
    const before = indexValue('SBCAPE');
    fireEvent.change(screen.getByLabelText('Surface temperature (°C)'), { target: { value: '31' } });
    expect(indexValue('SBCAPE')).not.toBe(before);
    fireEvent.click(screen.getByRole('button', { name: 'Reset' }));
    expect(indexValue('SBCAPE')).toBe(before);
  });

  it('saves the what-if through onSave with the shared contract shape', async () => {
    const onSave = vi.fn(async () => undefined);
    render(<SoundingWorkbench levels={levels} units={metric} onSaveModified={onSave} />);
    fireEvent.change(screen.getByLabelText('Surface dewpoint (°C)'), { target: { value: '25.8' } });
    fireEvent.change(screen.getByLabelText('Lift a parcel from'), { target: { value: '925' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save as modified sounding' }));
    expect(screen.getByText('Give the modified sounding a name.')).toBeTruthy();
    fireEvent.change(screen.getByLabelText('Name'), { target: { value: 'Moister afternoon' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save as modified sounding' }));
    await waitFor(() => expect(onSave).toHaveBeenCalledTimes(1));
    expect(onSave).toHaveBeenCalledWith({ name: 'Moister afternoon', note: '', surfaceDewpointC: 25.8, parcelStartPressureHpa: 925 });
    expect(await screen.findByText(/Saved/)).toBeTruthy();
  });

  it('shows temperatures in °F when the person chose °F (27.8 °C = 82.04 °F)', () => {
    render(<SoundingWorkbench levels={levels} units={{ temperature: 'F', height: 'ft', speed: 'mph' }} />);
    expect((screen.getByLabelText('Surface temperature (°F)') as HTMLInputElement).value).toBe('82');
  });

  it('hides the editor and the drag handles when read-only', () => {
    render(<SoundingWorkbench levels={levels} units={metric} readOnly modifiedLabel="Moister afternoon" />);
    expect(screen.queryByLabelText('Surface dewpoint (°C)')).toBeNull();
    expect(screen.queryAllByRole('slider')).toHaveLength(0);
    expect(screen.getByText('Modified · Moister afternoon')).toBeTruthy();
  });

  it('moves the readout between levels with the arrow keys', () => {
    render(<SoundingWorkbench levels={levels} units={metric} />);
    const diagram = screen.getByRole('group', { name: 'Skew-T log-p diagram' });
    fireEvent.keyDown(diagram, { key: 'ArrowUp' });
    fireEvent.keyDown(diagram, { key: 'ArrowUp' });
    // The second level of the fixture: 962 hPa, 27.4 °C, dewpoint 22.8 °C.
    const live = document.querySelector('[aria-live="polite"]');
    expect(live?.textContent).toMatch(/962\u202fhPa/);
    expect(live?.textContent).toMatch(/Temperature 27\.4\u202f°C/);
  });

  it('shows the hazard ingredients in their own group, in the person\'s units (speeds in kt, heights in ft)', () => {
    render(<SoundingWorkbench levels={levels} units={{ temperature: 'F', height: 'ft', speed: 'kt' }} readOnly />);
    const hazards = screen.getByRole('table', { name: 'Hazard ingredients' });
    const rows = within(hazards).getAllByRole('rowheader').map((header) => header.textContent);
    expect(rows).toEqual(expect.arrayContaining(['SRH 0–500 m', 'Critical angle', 'ML LCL–LFC gap', 'Hail-zone CAPE', 'Shear 0–8 km', 'Mean wind 0–6 km', 'Corfidi upwind', 'Corfidi downwind', 'Warm-cloud depth']));
    expect(indexValue('SRH 0–500 m')).toMatch(/^\d+\u202fm²\/s²$/);
    expect(indexValue('Critical angle')).toMatch(/^\d+\u202f°$/);
    expect(indexValue('Hail-zone CAPE')).toMatch(/J\/kg$/);
    expect(indexValue('Warm-cloud depth')).toMatch(/ft$/);
    // A vector: direction it blows from, then its speed.
    expect(indexValue('Corfidi upwind')).toMatch(/^\d{3}° \d+\s?kt$/);
    expect(indexValue('Lapse rate 850–500 hPa')).toMatch(/K\/km$/);
  });

  it('marks missing index values with a dash and a title that explains why', () => {
    // An invented isothermal (0 °C) atmosphere without winds: a lifted parcel only cools below
    // its surroundings, so no parcel has an LFC, and nothing kinematic can be computed.
    // Heights from the hypsometric equation with a scale height of R·T/g ≈ 8000 m at 273 K.
    const stable: SoundingLevel[] = Array.from({ length: 19 }, (_, i) => {
      const pressureHpa = 1000 - i * 50;
      return { pressureHpa, heightM: 8000 * Math.log(1000 / pressureHpa), temperatureC: 0, dewpointC: -10, uMs: null, vMs: null };
    });
    render(<SoundingWorkbench levels={stable} units={metric} readOnly />);
    const groups = ['Instability', 'Moisture', 'Cloud base', 'Kinematics', 'Composites', 'Hazard ingredients'].map((name) => screen.getByRole('table', { name }));
    const missing = groups.flatMap((table) => within(table).getAllByRole('cell')).filter((cell) => cell.textContent?.startsWith('—'));
    expect(missing.length).toBeGreaterThan(0);
    for (const cell of missing) expect(cell.getAttribute('title') ?? '').toMatch(/^(Does not exist|Cannot be computed)/);
    expect(indexValue('SB LFC')).toMatch(/^—/);
    expect(screen.getByRole('rowheader', { name: 'SB LFC' }).closest('tr')?.querySelector('td')?.getAttribute('title')).toMatch(/no LFC/);
  });
});
