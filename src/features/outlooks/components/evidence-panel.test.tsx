// @vitest-environment jsdom
import { render, screen } from '@testing-library/react';
import { MemoryRouter } from 'react-router';
import { describe, expect, it } from 'vitest';
import { areaEvidenceReportSchema } from '../../../../shared/contracts/outlooks';
import { defaultUnits } from '../../../../shared/contracts/users';
import type { UnitFormatters } from '../../../hooks/use-units';
import { EvidencePanel } from './evidence-panel';

const units: UnitFormatters = { units: defaultUnits, temperature: (k) => `${k}`, height: (m) => `${m} m`, speed: (s) => `${s} m/s` };
const stats = { count: 3, min: 100, median: 900, p90: 1500, max: 1600, histogram: [{ from: 100, to: 1600, count: 3 }] };
const runId = '22222222-2222-4222-8222-222222222222';
const observedId = '33333333-3333-4333-8333-333333333333';
const report = areaEvidenceReportSchema.parse({
  areaId: 'a1',
  levelKey: 'level1',
  evidence: { areaId: 'a1', count: 3, flaggedCount: 0, soundingIds: [observedId, `${runId}:17`, `${runId}:18`], stats: { mlCape: stats } },
  support: { result: 'thin', reasons: ['only 3 soundings inside'] },
  checks: [],
});

describe('EvidencePanel with grid soundings', () => {
  it('when soundings came from a model run, then the panel names the run beside the statistics and links only the observed sounding', () => {
    render(
      <MemoryRouter>
        <EvidencePanel report={report} stale={false} units={units} stationOf={() => 'KXYZ'} sources={[{ label: 'observed and uploaded soundings', count: 1 }, { label: 'VALLEY3 2031-06-01 12Z +6 h', count: 2 }]} />
      </MemoryRouter>,
    );
    expect(screen.getByTestId('evidence-sources').textContent).toBe('Statistics from observed and uploaded soundings (1), VALLEY3 2031-06-01 12Z +6 h (2)');
    const links = screen.getAllByRole('link');
    expect(links.map((l) => l.getAttribute('href'))).toEqual([`/soundings/${observedId}`]);
  });
});
