import { describe, expect, it } from 'vitest';
import { defaultRiskLadder } from '../../shared/contracts/office';
import { riskAreaInputSchema, type RiskAreaInput } from '../../shared/contracts/outlooks';
import { areaOutsideKm2, checkAreas, selfIntersects, unionOf } from '../../shared/geometry/area-checks';
import { countVertices, MAX_VERTICES_PER_AREA, MAX_VERTICES_PER_OUTLOOK } from '../../shared/geometry/limits';
import { demoOffice } from '../services/seed.service';
import { demoDay2Areas, demoOutlookAreas } from './demo-outlook';

const ladderKeys = defaultRiskLadder.map((l) => l.key);

/** Distinct positions of an area's outer ring (the closing position counted once). */
function distinctVertices(area: RiskAreaInput): number {
  const ring = area.geometry.type === 'Polygon' ? area.geometry.coordinates[0] : area.geometry.coordinates[0]?.[0];
  return new Set((ring ?? []).map(([lon, lat]) => `${lon},${lat}`)).size;
}

describe.each([
  ['the Day 1 demo draft', demoOutlookAreas],
  ['the Day 2 demo draft', demoDay2Areas],
])('%s', (_name, areas) => {
  it('When its areas are parsed by the save contract, then every one is accepted', () => {
    for (const area of areas) expect(riskAreaInputSchema.safeParse(area).success, area.label).toBe(true);
  });

  it('When the geometry checks run over the demo office region, then they report no problem', () => {
    const checked = areas.map((a, i) => ({ id: `${i}:${a.label}`, levelKey: a.levelKey, geometry: a.geometry }));
    const findings = checkAreas(checked, ladderKeys, demoOffice.region);
    expect(Object.values(findings).flat()).toEqual([]);
    for (const area of areas) expect(selfIntersects(area.geometry), area.label).toBe(false);
  });

  it('When each area is compared with the union of the level below, then it lies inside it', () => {
    for (const area of areas) {
      const index = ladderKeys.indexOf(area.levelKey);
      expect(index, area.label).toBeGreaterThanOrEqual(0);
      if (index === 0) continue;
      const below = unionOf(areas.filter((a) => a.levelKey === ladderKeys[index - 1]).map((a) => a.geometry));
      expect(below, `${area.label} has a level below it`).not.toBeNull();
      expect(areaOutsideKm2(area.geometry, below), area.label).toBeLessThan(1);
    }
  });

  it('When the outlines are counted, then each is hand-drawn (more than 5 distinct vertices, not a box) and within the vertex limits', () => {
    for (const area of areas) {
      expect(distinctVertices(area), area.label).toBeGreaterThan(5);
      expect(countVertices(area.geometry)).toBeLessThanOrEqual(MAX_VERTICES_PER_AREA);
    }
    expect(areas.reduce((n, a) => n + countVertices(a.geometry), 0)).toBeLessThanOrEqual(MAX_VERTICES_PER_OUTLOOK);
  });
});

describe('the Day 1 demo draft', () => {
  it('When its levels are listed, then it climbs from thunder to Level 3 and its first three areas (the early issuance) are thunder, Level 1 and Level 2', () => {
    expect(new Set(demoOutlookAreas.map((a) => a.levelKey))).toEqual(new Set(['thunder', 'level1', 'level2', 'level3']));
    expect(demoOutlookAreas.slice(0, 3).map((a) => a.levelKey)).toEqual(['thunder', 'level1', 'level2']);
  });

  it('When hazards are read, then the flags differ between areas (tornado only in the corridor, flooding only in the lowlands)', () => {
    const flagged = (hazard: string) => demoOutlookAreas.filter((a) => a.hazards.some((h) => h.hazard === hazard)).map((a) => a.label);
    expect(flagged('tornado')).toEqual(['Warm-front corridor']);
    expect(flagged('flood')).toEqual(['Southern lowlands']);
    expect(demoOutlookAreas.find((a) => a.label === 'Warm-front corridor')?.hazards).toContainEqual({ hazard: 'hail', significant: true });
  });
});
