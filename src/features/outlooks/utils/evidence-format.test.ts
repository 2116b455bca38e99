import { describe, expect, it } from 'vitest';
import { evidenceParameters } from '../../../../shared/evidence/evidence';
import { keyFigureKeys } from '../../../../shared/sounding/key-figures';
import type { UnitFormatters } from '../../../hooks/use-units';
import { formatEvidenceValue } from './evidence-format';

/** Formatters that say which of the person's units they were asked for. */
const units: UnitFormatters = {
  units: { temperature: 'F', height: 'ft', speed: 'kt' },
  temperature: (k) => `${k} as °F`,
  height: (m) => `${m} as ft`,
  speed: (ms) => `${ms} as kt`,
};

describe('evidence values', () => {
  it('the evidence panel lists every key figure, the hazard ingredients included', () => {
    expect(evidenceParameters.map((parameter) => parameter.key).sort()).toEqual([...keyFigureKeys].sort());
  });

  it('heights and speeds of the hazard ingredients follow the person\'s units; the rest carry their own unit', () => {
    for (const key of ['mlLclLfcGapM', 'freezingLevelM', 'warmCloudDepthM'] as const) expect(formatEvidenceValue(key, 1200, units)).toBe('1200 as ft');
    for (const key of ['effectiveBulkShearMs', 'bulkShear0to8kmMs', 'meanWind0to6kmMs', 'corfidiUpwindMs', 'corfidiDownwindMs'] as const) {
      expect(formatEvidenceValue(key, 12, units)).toBe('12 as kt');
    }
    expect(formatEvidenceValue('srh0to500m', 150, units)).toBe('150\u202fm²/s²');
    expect(formatEvidenceValue('muCapeHailZone', 800, units)).toBe('800\u202fJ/kg');
    expect(formatEvidenceValue('lapseRate700to500CKm', 7.25, units)).toMatch(/^7\.\d\u202f°C\/km$/);
    expect(formatEvidenceValue('criticalAngleDeg', 88, units)).toBe('88\u202f°');
  });
});
