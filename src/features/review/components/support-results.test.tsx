// @vitest-environment jsdom
import { cleanup, render, screen, within } from '@testing-library/react';
import { afterEach, describe, expect, it } from 'vitest';
import { defaultRiskLadder } from '../../../../shared/contracts/office';
import type { AreaEvidenceReport } from '../../../../shared/contracts/outlooks';
import type { EvidenceSounding } from '../../../../shared/evidence/evidence';
import { defaultSupportGuidance } from '../../../../shared/evidence/guidance';
import { checkSupport } from '../../../../shared/evidence/support-check';
import { emptyKeyFigures } from '../../../../shared/sounding/key-figures';
import { SupportResults } from './support-results';

afterEach(cleanup);

const sounding = (id: string, figures: Partial<EvidenceSounding['figures']>): EvidenceSounding => ({
  id,
  stationId: id,
  latitude: 38,
  longitude: -92,
  validTime: '2027-04-18T18:00:00Z',
  source: 'model',
  modified: false,
  figures: { ...emptyKeyFigures(), ...figures },
});

describe('SupportResults', () => {
  it('shows the level result with its counts in words and one line per hazard flag', () => {
    // Constructed soundings against the invented demo guidance: instability and shear in
    // different soundings, so none backs Level 3; the wind ingredients are all there.
    const wind = { dcape: 900, meanWind0to6kmMs: 15, lapseRate0to3kmCKm: 7.5 };
    const inside = [
      sounding('a', { mlCape: 3000, bulkShear0to6kmMs: 8, srh0to1km: 150, mlCin: -10, ...wind }),
      sounding('b', { mlCape: 3000, bulkShear0to6kmMs: 8, srh0to1km: 150, mlCin: -10, ...wind }),
      sounding('c', { mlCape: 300, bulkShear0to6kmMs: 30, srh0to1km: 150, mlCin: -10, ...wind }),
    ];
    const area = { id: 'area-1', levelKey: 'level3', hazards: [{ hazard: 'wind' as const, significant: false }, { hazard: 'tornado' as const, significant: true }], geometry: { type: 'Polygon' as const, coordinates: [] }, label: 'Valley', sortOrder: 0 };
    const support = checkSupport({ inside, levelKey: 'level3', hazards: area.hazards, ladder: defaultRiskLadder, guidance: defaultSupportGuidance });
    const report: AreaEvidenceReport = { areaId: 'area-1', levelKey: 'level3', evidence: { areaId: 'area-1', count: 3, flaggedCount: 0, soundingIds: ['a', 'b', 'c'], stats: {} }, support, checks: [] };
    render(<SupportResults reports={[report]} areas={[area]} ladder={defaultRiskLadder} />);

    expect(screen.getByText(/^0 of 3 soundings back Level 3 · Numerous; 3 fall short/)).not.toBeNull();
    const hazards = screen.getByRole('list', { name: 'Hazard checks of Valley' });
    const lines = within(hazards).getAllByRole('listitem').map((item) => item.textContent ?? '');
    expect(lines[0]).toMatch(/^damaging wind supported3 of 3 soundings back damaging wind/);
    expect(lines[1]).toMatch(/^significant tornado thin support0 of 3 soundings back significant tornado; 3 fall short \(0–1 km SRH below 200 m²\/s²: 3\)/);
  });
});
