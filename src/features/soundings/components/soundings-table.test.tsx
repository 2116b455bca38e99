// @vitest-environment jsdom
import { cleanup, fireEvent, render, screen, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router';
import { afterEach, describe, expect, it } from 'vitest';
import type { SoundingSummary } from '../../../../shared/contracts/soundings';
import { emptyKeyFigures } from '../../../../shared/sounding/key-figures';
import type { UnitFormatters } from '../../../hooks/use-units';
import { formatHeight, formatSpeed, formatTemperature } from '../../../utils/units';
import { LIBRARY_COLUMNS_STORAGE_KEY } from '../utils/library-columns';
import { SoundingsTable } from './soundings-table';

const imperial = { temperature: 'F', height: 'ft', speed: 'kt' } as const;
const units: UnitFormatters = {
  units: imperial,
  temperature: (k, d) => formatTemperature(k, imperial.temperature, d),
  height: (m, d) => formatHeight(m, imperial.height, d),
  speed: (ms, d) => formatSpeed(ms, imperial.speed, d),
};

// An invented sounding summary: the figures are round numbers chosen for the test.
const sounding: SoundingSummary = {
  id: 's1',
  stationId: 'MV07',
  stationName: 'Cedar Ford',
  latitude: 38.4,
  longitude: -91.3,
  elevationM: 183,
  validTime: '2027-04-18T18:00:00Z',
  source: 'model',
  modifiedFromId: null,
  modificationName: null,
  uploadedBy: null,
  uploadedByName: null,
  createdAt: '2027-04-18T12:00:00Z',
  figures: { ...emptyKeyFigures(), mlCape: 1500, srh0to500m: 180, corfidiUpwindMs: 10.2889 },
};

function renderTable() {
  return render(
    <MemoryRouter>
      <SoundingsTable soundings={[sounding]} sort="validTime" order="desc" onSortChange={() => {}} units={units} timeZone="UTC" canDelete={() => false} onDelete={() => {}} busy={false} />
    </MemoryRouter>,
  );
}

afterEach(() => {
  cleanup();
  localStorage.clear();
});

describe('SoundingsTable extra columns', () => {
  it('when a hazard ingredient is chosen, then its column appears in the person\'s units and is remembered', () => {
    renderTable();
    expect(screen.queryByRole('columnheader', { name: /0–500 m SRH/ })).toBeNull();
    fireEvent.click(screen.getByText('More figures'));
    fireEvent.click(screen.getByRole('checkbox', { name: /0–500 m storm-relative helicity/ }));
    const corfidi = screen.getByRole('checkbox', { name: /Corfidi upwind vector speed/ });
    expect(corfidi.closest('label')?.textContent).toBe('Corfidi upwind vector speed (kt)');
    fireEvent.click(corfidi);
    expect(screen.getByRole('columnheader', { name: /0–500 m SRH/ })).toBeTruthy();
    const row = screen.getAllByRole('row')[1];
    if (!row) throw new Error('no data row');
    const cells = within(row).getAllByRole('cell').map((cell) => cell.textContent);
    expect(cells).toContain('180');
    // 10.2889 m/s = 20.0 kt (1 kt = 1852/3600 m/s).
    expect(cells).toContain('20');
    expect(JSON.parse(localStorage.getItem(LIBRARY_COLUMNS_STORAGE_KEY) ?? '[]')).toEqual(['srh0to500m', 'corfidiUpwindMs']);
  });

  it('when columns were chosen before, then the table opens with them', () => {
    localStorage.setItem(LIBRARY_COLUMNS_STORAGE_KEY, JSON.stringify(['warmCloudDepthM']));
    renderTable();
    expect(screen.getByRole('columnheader', { name: /Warm-cloud depth/ })).toBeTruthy();
  });
});
