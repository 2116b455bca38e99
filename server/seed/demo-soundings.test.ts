import { describe, expect, it } from 'vitest';
import { defaultRiskLadder } from '../../shared/contracts/office';
import { soundingsInside, type EvidenceSounding } from '../../shared/evidence/evidence';
import { defaultSupportGuidance } from '../../shared/evidence/guidance';
import { checkSupport } from '../../shared/evidence/support-check';
import { analyzeSounding } from '../../shared/sounding/analyze';
import { keyFiguresFromAnalysis } from '../../shared/sounding/key-figures';
import { validateSounding } from '../../shared/sounding/validate';
import type { SoundingKeyFigures } from '../../shared/contracts/soundings';
import { demoOutlookAreas } from './demo-outlook';
import { demoRegion, generateDemoSoundings } from './demo-soundings';

const demoDay = new Date(Date.UTC(2027, 3, 18));
const soundings = generateDemoSoundings(demoDay);

/** The demo soundings as evidence, with the engine's key figures (only those valid at `hours` UTC). */
function evidenceAt(hours: string[]): EvidenceSounding[] {
  return soundings.flatMap((s) => {
    if (!hours.includes(s.metadata.validTime.slice(11, 13))) return [];
    const parsed = validateSounding(s);
    if (!parsed.ok) throw new Error(`${s.metadata.station} is invalid`);
    const analysis = analyzeSounding(parsed.value.levels, { latitude: s.metadata.latitude });
    return [{ ...s.metadata, id: `${s.metadata.station}@${s.metadata.validTime}`, stationId: s.metadata.station, modified: false, figures: keyFiguresFromAnalysis(analysis) }];
  });
}

// The demo draft is valid from 15 UTC to the next morning: the 18 and 00 UTC soundings.
const draftPeriod = evidenceAt(['18', '00']);
const area = (label: string) => {
  const found = demoOutlookAreas.find((a) => a.label === label);
  if (!found) throw new Error(`no demo area "${label}"`);
  return found;
};
function median(label: string, key: keyof SoundingKeyFigures): number {
  const values = soundingsInside(area(label).geometry, draftPeriod)
    .map((s) => s.figures[key])
    .filter((v): v is number => v !== null)
    .sort((a, b) => a - b);
  if (values.length === 0) throw new Error(`no ${key} values in "${label}"`);
  return values[Math.floor(values.length / 2)] ?? Number.NaN;
}

describe('demo soundings', () => {
  it('When the demo day is generated, then there are 120 valid soundings: 40 stations at 12, 18 and 00 UTC, inside the region', () => {
    expect(soundings).toHaveLength(120);
    expect(new Set(soundings.map((s) => s.metadata.station)).size).toBe(40);
    expect(new Set(soundings.map((s) => s.metadata.validTime))).toEqual(new Set(['2027-04-18T12:00:00.000Z', '2027-04-18T18:00:00.000Z', '2027-04-19T00:00:00.000Z']));
    for (const s of soundings) {
      const parsed = validateSounding(s);
      expect(parsed.ok, s.metadata.station).toBe(true);
      expect(s.metadata.longitude).toBeGreaterThan(demoRegion.west);
      expect(s.metadata.longitude).toBeLessThan(demoRegion.east);
      expect(s.metadata.latitude).toBeGreaterThan(demoRegion.south);
      expect(s.metadata.latitude).toBeLessThan(demoRegion.north);
    }
  });

  it('When it is generated twice, then the profiles are the same (seeded, the same on every machine)', () => {
    expect(generateDemoSoundings(demoDay)).toEqual(soundings);
  });

  it('When the draft period is read area by area, then the fields follow the invented day the areas were drawn on', () => {
    // Backed winds under the low-level jet along the warm front: the most 0–1 km helicity there.
    expect(median('Warm-front corridor', 'srh0to1km')).toBeGreaterThan(1.5 * median('Warm sector', 'srh0to1km'));
    expect(median('Warm-front corridor', 'srh0to1km')).toBeGreaterThan(1.5 * median('Southern lowlands', 'srh0to1km'));
    // Deep moisture in the lowlands: the most precipitable water.
    for (const other of ['Warm sector', 'Warm-front corridor', 'Dryline and low']) {
      expect(median('Southern lowlands', 'precipitableWaterMm')).toBeGreaterThan(median(other, 'precipitableWaterMm'));
    }
    // West of the dryline: hot, dry, deeply mixed air: the highest cloud base and downdraft CAPE.
    for (const other of ['Warm sector', 'Warm-front corridor', 'Southern lowlands']) {
      expect(median('Dryline and low', 'mlLclHeightM')).toBeGreaterThan(median(other, 'mlLclHeightM') + 500);
      expect(median('Dryline and low', 'dcape')).toBeGreaterThan(median(other, 'dcape'));
    }
    // The cap holds longest in the east: at 18 UTC the strongest MLCIN is east of 89° W.
    const noon = evidenceAt(['18']);
    const strongestCin = (west: number, east: number) => Math.min(...noon.filter((s) => s.longitude >= west && s.longitude < east).map((s) => s.figures.mlCin ?? 0));
    expect(strongestCin(-89, demoRegion.east)).toBeLessThan(-150);
    expect(strongestCin(demoRegion.west, -93)).toBeGreaterThan(-100);
  });

  it('When the support check judges the demo draft, then its results are not all the same', () => {
    const results = demoOutlookAreas.map((a) => checkSupport({ inside: soundingsInside(a.geometry, draftPeriod), levelKey: a.levelKey, hazards: a.hazards, ladder: defaultRiskLadder, guidance: defaultSupportGuidance }).result);
    expect(new Set(results).size).toBeGreaterThanOrEqual(3);
    expect(results).toContain('supported');
    expect(results).not.toContain('none');
  });
});
