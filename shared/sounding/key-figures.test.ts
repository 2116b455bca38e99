import { describe, expect, it } from 'vitest';
import { analyzeSounding } from './analyze';
import { keyFigureKeys, keyFiguresFromAnalysis } from './key-figures';
import { weismanKlempSounding } from './testing/weisman-klemp';

describe('key figures from an analysis', () => {
  // Weisman–Klemp thermodynamics, straight hodograph: u = 5 m/s per km to 6 km, then constant.
  const levels = weismanKlempSounding(0.014, 250).map((level) => ({ ...level, uMs: 0.005 * Math.min(level.heightM, 6000), vMs: 0 }));
  const analysis = analyzeSounding(levels);

  it('fills the hazard ingredients from the analysis, in the units of their names', () => {
    const figures = keyFiguresFromAnalysis(analysis);
    // Hand calculations of ingredients.test.ts: 2 · ½ · 2.5 · 7.5 = 18.75 m²/s²; 0–8 km shear 30 m/s.
    expect(figures.srh0to500m).toBeCloseTo(18.75, 6);
    expect(figures.bulkShear0to8kmMs).toBeCloseTo(30, 9);
    expect(figures.criticalAngleDeg).toBeCloseTo(153.435, 3);
    for (const key of ['mlLclLfcGapM', 'lapseRate0to3kmCKm', 'lapseRate3to6kmCKm', 'lapseRate850to500CKm', 'lapseRate700to500CKm', 'muCapeHailZone', 'freezingLevelM', 'effectiveBulkShearMs', 'dcape', 'meanWind0to6kmMs', 'corfidiUpwindMs', 'corfidiDownwindMs', 'warmCloudDepthM'] as const) {
      expect(typeof figures[key], key).toBe('number');
    }
  });

  it('when an analysis stored by an engine before 2.1.0 has no ingredients, then those figures are null and the others stay', () => {
    const { ingredients: _dropped, ...older } = analysis;
    const figures = keyFiguresFromAnalysis(older);
    expect(figures.srh0to500m).toBeNull();
    expect(figures.corfidiUpwindMs).toBeNull();
    expect(figures.mlCape).toBe(analysis.mixedLayer.cape);
    expect(figures.freezingLevelM).toBe(analysis.environment.freezingLevelHeight);
  });

  it('no analysis: every figure null', () => {
    const figures = keyFiguresFromAnalysis(null);
    for (const key of keyFigureKeys) expect(figures[key]).toBeNull();
  });
});
