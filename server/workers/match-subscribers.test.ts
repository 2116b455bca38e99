import { describe, expect, it } from 'vitest';
import type { AreaGeometry, RiskArea } from '../../shared/contracts/outlooks';
import { areaSetVariant, matchSubscribers } from './match-subscribers';

const box = (w: number, s: number, e: number, n: number): AreaGeometry => ({ type: 'Polygon', coordinates: [[[w, s], [e, s], [e, n], [w, n], [w, s]]] });
const ladderKeys = ['thunder', 'level1', 'level2', 'level3'];
const riskAreas: Pick<RiskArea, 'levelKey' | 'hazards' | 'geometry'>[] = [{ levelKey: 'level2', hazards: [{ hazard: 'hail', significant: false }], geometry: box(-94, 37, -92, 39) }];
const inside = box(-93.5, 37.5, -93, 38);
const farAway = box(-80, 30, -79, 31);

describe('areaSetVariant', () => {
  it('When the same areas come in another order, then the variant is the same; other areas give another', () => {
    expect(areaSetVariant([inside, farAway])).toBe(areaSetVariant([farAway, inside]));
    expect(areaSetVariant([inside])).not.toBe(areaSetVariant([farAway]));
  });
});

describe('matchSubscribers', () => {
  it('When subscribers share an area, then both are alerted and share one alert map; those out of reach or above their threshold are not', () => {
    const out = matchSubscribers({
      riskAreas,
      ladderKeys,
      subscribers: [
        { subscriptionId: 'a', geometries: [inside], hazards: [], alertThreshold: 'level1', earlierLevelKey: null },
        { subscriptionId: 'b', geometries: [inside], hazards: [], alertThreshold: 'level2', earlierLevelKey: null },
        { subscriptionId: 'c', geometries: [farAway], hazards: [], alertThreshold: 'thunder', earlierLevelKey: null },
        { subscriptionId: 'd', geometries: [inside], hazards: [], alertThreshold: 'level3', earlierLevelKey: null },
        { subscriptionId: 'e', geometries: [], hazards: [], alertThreshold: 'thunder', earlierLevelKey: null },
      ],
    });
    expect(out.notices.map((n) => [n.subscriptionId, n.kind, n.highestLevelKey])).toEqual([
      ['a', 'alert', 'level2'],
      ['b', 'alert', 'level2'],
    ]);
    expect(Object.keys(out.highlights)).toEqual([areaSetVariant([inside])]);
  });

  it('When an amendment takes the risk away from an alerted subscriber, then they get a "cleared" notice', () => {
    const out = matchSubscribers({ riskAreas: [], ladderKeys, subscribers: [{ subscriptionId: 'a', geometries: [inside], hazards: [], alertThreshold: 'level1', earlierLevelKey: 'level2' }] });
    expect(out.notices.map((n) => n.kind)).toEqual(['cleared']);
  });
});
