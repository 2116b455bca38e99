import { describe, expect, it } from 'vitest';
import { defaultRiskLadder, supportGuidanceSchema, type GuidanceRuleSet, type SupportGuidance } from '../contracts/office';
import type { SoundingKeyFigures } from '../contracts/soundings';
import { emptyKeyFigures } from '../sounding/key-figures';
import type { EvidenceSounding } from './evidence';
import { defaultSupportGuidance, supportGuidanceFromStored } from './guidance';
import { checkSupport, type HazardFlag } from './support-check';

/*
 * The rule values below are invented test guidance (like the demo defaults): these tests check
 * how rules combine, not what a Level 3 should need.
 */

let serial = 0;
function sounding(figures: Partial<SoundingKeyFigures>): EvidenceSounding {
  serial += 1;
  return { id: `s${serial}`, stationId: `X${serial}`, latitude: 40, longitude: -95, validTime: '2027-04-18T18:00:00Z', source: 'model', modified: false, figures: { ...emptyKeyFigures(), ...figures } };
}

const rules = (set: Partial<GuidanceRuleSet> & Pick<GuidanceRuleSet, 'rules'>): GuidanceRuleSet => ({ minimumCount: 3, minimumSharePercent: null, ...set });

/** Level 3 needs instability, shear and helicity together, and a cap no stronger than −100 J/kg. */
const guidance: SupportGuidance = {
  levels: {
    level2: rules({ rules: [{ figure: 'mlCape', bound: 'min', value: 1000 }, { figure: 'bulkShear0to6kmMs', bound: 'min', value: 15 }] }),
    level3: rules({
      rules: [
        { figure: 'mlCape', bound: 'min', value: 1500 },
        { figure: 'bulkShear0to6kmMs', bound: 'min', value: 20 },
        { figure: 'mlCin', bound: 'min', value: -100 },
      ],
    }),
    level4: rules({ rules: [{ figure: 'mlCape', bound: 'min', value: 2500 }, { figure: 'bulkShear0to6kmMs', bound: 'min', value: 25 }] }),
    level5: rules({ rules: [{ figure: 'stp', bound: 'min', value: 4 }], minimumCount: 3 }),
  },
  hazards: {},
};

const check = (inside: EvidenceSounding[], levelKey = 'level3', hazards: HazardFlag[] = [], g: SupportGuidance = guidance) =>
  checkSupport({ inside, levelKey, hazards, ladder: defaultRiskLadder, guidance: g });

const backingLevel3 = () => sounding({ mlCape: 1800, bulkShear0to6kmMs: 22, mlCin: -40 });

describe('checkSupport: joint, per-sounding judgement (issue 14)', () => {
  it('When no sounding lies inside, then the result is "no soundings inside", for the level and each hazard', () => {
    const result = check([], 'level3', [{ hazard: 'hail', significant: false }]);
    expect(result.result).toBe('none');
    expect(result.hazards.map((h) => h.result)).toEqual(['none']);
  });

  it('When instability is in one half of the soundings and shear in the other, then the area is not supported although each median would pass', () => {
    // South half: 3000 J/kg but 5 m/s shear; north half: 40 m/s shear but 200 J/kg. Medians of
    // both halves together (1600 J/kg, 22.5 m/s) meet every Level 3 minimum; no sounding does.
    const south = [1, 2, 3].map(() => sounding({ mlCape: 3000, bulkShear0to6kmMs: 5, mlCin: -20 }));
    const north = [1, 2, 3].map(() => sounding({ mlCape: 200, bulkShear0to6kmMs: 40, mlCin: -20 }));
    const result = check([...south, ...north]);
    expect(result.result).toBe('thin');
    expect(result.backing).toEqual([]);
    expect(result.failing).toHaveLength(6);
    expect(result.reasons[0]).toMatch(/^0 of 6 soundings back Level 3 · Numerous; 6 fall short \(/);
    expect(result.reasons[0]).toContain('MLCAPE below 1,500 J/kg: 3');
    expect(result.reasons[0]).toContain('0–6 km shear below 20 m/s: 3');
  });

  it('When every sounding meets every Level 3 rule at once, then the same area is supported', () => {
    const inside = [1, 2, 3, 4, 5, 6].map(backingLevel3);
    const result = check(inside);
    expect(result.result).toBe('supported');
    expect(result.backing).toEqual(inside.map((s) => s.id));
    expect(result.reasons).toEqual(['6 of 6 soundings back Level 3 · Numerous', '100% of the 6 soundings with values back Level 3 · Numerous (50% needed)']);
  });

  it('When only one sounding has the value a rule uses, then a single-value parameter cannot make the level supported', () => {
    // One sounding with STP 6, four without STP: Level 5 needs 3 soundings with an STP value.
    const inside = [sounding({ stp: 6 }), ...[1, 2, 3, 4].map(() => sounding({ mlCape: 4000 }))];
    const result = check(inside, 'level5');
    expect(result.result).toBe('thin');
    expect(result.backing).toHaveLength(1);
    expect(result.lacking).toHaveLength(4);
    expect(result.reasons[0]).toBe('1 of 5 soundings backs Level 5 · Outbreak; 4 lack STP ≥ 4.0');
    expect(result.reasons[1]).toBe('only 1 sounding has every value Level 5 · Outbreak\'s rules use; 3 needed: thin support');
  });

  it('When a Level 3 area has CIN stronger than the office maximum, then it is not supported and the reason says so in words', () => {
    const capped = [1, 2, 3, 4].map(() => sounding({ mlCape: 2200, bulkShear0to6kmMs: 24, mlCin: -180 }));
    const result = check([...capped, backingLevel3()]);
    expect(result.result).toBe('thin');
    expect(result.reasons[0]).toBe('1 of 5 soundings backs Level 3 · Numerous; 4 fall short (MLCIN stronger than −100 J/kg: 4)');
    expect(result.reasons[1]).toBe('20% of the 5 soundings with values back Level 3 · Numerous; 50% needed: thin support');
  });

  it('When soundings lack a value, then they are counted apart, not as failing, and the count names the rule', () => {
    const inside = [backingLevel3(), backingLevel3(), backingLevel3(), sounding({ mlCape: 1800, bulkShear0to6kmMs: 22 }), sounding({ mlCape: 1800, bulkShear0to6kmMs: 22 })];
    const result = check(inside);
    expect(result.result).toBe('supported');
    expect(result.lacking).toHaveLength(2);
    expect(result.reasons[0]).toBe('3 of 5 soundings back Level 3 · Numerous; 2 lack MLCIN no stronger than −100 J/kg');
  });

  it('When a sounding fails one rule and lacks another, then it counts as failing (it cannot back the level)', () => {
    const result = check([sounding({ mlCape: 500, bulkShear0to6kmMs: 22 })]);
    expect(result.failing).toHaveLength(1);
    expect(result.lacking).toHaveLength(0);
  });

  it('When a maximum rule is set, then a value above it fails (LCL height no higher than 1,200 m)', () => {
    const g: SupportGuidance = { levels: { level1: rules({ rules: [{ figure: 'mlLclHeightM', bound: 'max', value: 1200 }] }) }, hazards: {} };
    const result = check([sounding({ mlLclHeightM: 1800 }), sounding({ mlLclHeightM: 1800 }), sounding({ mlLclHeightM: 900 })], 'level1', [], g);
    expect(result.result).toBe('thin');
    expect(result.reasons[0]).toBe('1 of 3 soundings backs Level 1 · Isolated; 2 fall short (LCL height above 1,200 m: 2)');
  });

  it('When the minimum share is set, then a share below it is thin support and one at it is supported', () => {
    const g: SupportGuidance = { levels: { level2: rules({ rules: [{ figure: 'mlCape', bound: 'min', value: 1000 }], minimumSharePercent: 75 }) }, hazards: {} };
    const three = [1, 2, 3].map(() => sounding({ mlCape: 1200 }));
    expect(check([...three, sounding({ mlCape: 100 }), sounding({ mlCape: 100 })], 'level2', [], g).result).toBe('thin');
    expect(check([...three, sounding({ mlCape: 100 })], 'level2', [], g).result).toBe('supported');
  });

  it('When every sounding also backs the next level, then the environment exceeds the level', () => {
    const inside = [1, 2, 3].map(() => sounding({ mlCape: 3000, bulkShear0to6kmMs: 30, mlCin: -10 }));
    const result = check(inside, 'level3');
    expect(result.result).toBe('exceeds');
    expect(result.reasons[2]).toBe('3 of 3 soundings also back Level 4 · Widespread: the environment exceeds Level 3 · Numerous');
  });

  it('When no rules are set for the level, then the reason says so and the count decides', () => {
    expect(check([backingLevel3()], 'thunder').result).toBe('thin');
    const result = check([1, 2, 3].map(backingLevel3), 'thunder');
    expect(result.result).toBe('supported');
    expect(result.reasons[0]).toMatch(/^No rules are set for Thunderstorms/);
  });
});

describe('checkSupport: hazard rules (issue 14), on constructed soundings with the invented demo defaults', () => {
  const g = defaultSupportGuidance;
  const hazardCheck = (inside: EvidenceSounding[], flag: HazardFlag) => {
    const [judgement] = check(inside, 'level1', [flag], g).hazards;
    if (!judgement) throw new Error('one judgement per hazard flag');
    return judgement;
  };
  const three = (figures: Partial<SoundingKeyFigures>) => [1, 2, 3].map(() => sounding(figures));

  it('Tornado: low LCL, strong 0–1 km SRH and STP back it; a high cloud base does not', () => {
    const flag = { hazard: 'tornado', significant: false } as const;
    expect(hazardCheck(three({ srh0to1km: 180, mlLclHeightM: 900, stp: 1.5 }), flag).result).toBe('supported');
    const high = hazardCheck(three({ srh0to1km: 180, mlLclHeightM: 2100, stp: 1.5 }), flag);
    expect(high.result).toBe('thin');
    expect(high.reasons[0]).toBe('0 of 3 soundings back tornado; 3 fall short (LCL height above 1,500 m: 3)');
  });

  it('Significant tornado: 0–500 m SRH is one of its rules; without it the soundings lack a value', () => {
    const flag = { hazard: 'tornado', significant: true } as const;
    expect(hazardCheck(three({ srh0to500m: 250, srh0to1km: 320, mlLclHeightM: 700, stp: 4 }), flag).result).toBe('supported');
    const without = hazardCheck(three({ srh0to1km: 320, mlLclHeightM: 700, stp: 4 }), flag);
    expect(without.result).toBe('thin');
    expect(without.reasons[0]).toBe('0 of 3 soundings back significant tornado; 3 lack 0–500 m SRH ≥ 150 m²/s²');
  });

  it('An ordinary tornado flag whose soundings back the significant form too: environment exceeds', () => {
    const judgement = hazardCheck(three({ srh0to500m: 250, srh0to1km: 320, mlLclHeightM: 700, stp: 4 }), { hazard: 'tornado', significant: false });
    expect(judgement.result).toBe('exceeds');
    expect(judgement.reasons[2]).toMatch(/also back significant tornado/);
  });

  it('Hail: steep mid-level lapse rates, MUCAPE and effective shear back it; significant hail fails on a high freezing level', () => {
    const figures = { muCape: 2500, muCapeHailZone: 600, lapseRate700to500CKm: 7.8, effectiveBulkShearMs: 24, freezingLevelM: 4800 };
    expect(hazardCheck(three(figures), { hazard: 'hail', significant: false }).result).toBe('supported');
    const significant = hazardCheck(three(figures), { hazard: 'hail', significant: true });
    expect(significant.result).toBe('thin');
    expect(significant.reasons[0]).toBe('0 of 3 soundings back significant large hail; 3 fall short (Freezing level above 4,300 m: 3)');
  });

  it('Damaging wind: DCAPE, 0–6 km mean wind and low-level lapse rate together', () => {
    const flag = { hazard: 'wind', significant: false } as const;
    expect(hazardCheck(three({ dcape: 900, meanWind0to6kmMs: 15, lapseRate0to3kmCKm: 7.5 }), flag).result).toBe('supported');
    expect(hazardCheck(three({ dcape: 400, meanWind0to6kmMs: 15, lapseRate0to3kmCKm: 7.5 }), flag).reasons[0]).toBe('0 of 3 soundings back damaging wind; 3 fall short (DCAPE below 700 J/kg: 3)');
  });

  it('Flash flooding: slow system motion is a maximum on the Corfidi upwind speed', () => {
    const flag = { hazard: 'flood', significant: false } as const;
    expect(hazardCheck(three({ precipitableWaterMm: 45, corfidiUpwindMs: 4, warmCloudDepthM: 3600 }), flag).result).toBe('supported');
    const fast = hazardCheck(three({ precipitableWaterMm: 45, corfidiUpwindMs: 15, warmCloudDepthM: 3600 }), flag);
    expect(fast.reasons[0]).toBe('0 of 3 soundings back flash flooding; 3 fall short (Corfidi upwind speed above 8 m/s: 3)');
  });

  it('Each flag gets its own judgement, in the order of the flags', () => {
    const result = check(three({ dcape: 900, meanWind0to6kmMs: 15, lapseRate0to3kmCKm: 7.5 }), 'level1', [{ hazard: 'wind', significant: false }, { hazard: 'hail', significant: true }], g);
    expect(result.hazards.map((h) => [h.hazard, h.significant, h.result])).toEqual([
      ['wind', false, 'supported'],
      ['hail', true, 'thin'],
    ]);
  });
});

describe('guidance schema and stored guidance', () => {
  it('When the demo defaults are parsed, then they pass the schema unchanged', () => {
    expect(supportGuidanceSchema.parse(defaultSupportGuidance)).toEqual(defaultSupportGuidance);
  });

  it('When a rule set has a maximum below its minimum for the same figure, then the schema names the rule', () => {
    const parsed = supportGuidanceSchema.safeParse({ levels: { level1: { rules: [{ figure: 'mlCape', bound: 'min', value: 500 }, { figure: 'mlCape', bound: 'max', value: 100 }] } } });
    expect(parsed.success).toBe(false);
    expect(parsed.error?.issues[0]?.path).toEqual(['levels', 'level1', 'rules', 1, 'value']);
  });

  it('When only thresholds from before issue 14 are stored, then they become minimum rules', () => {
    const converted = supportGuidanceFromStored(null, { level3: { mlCape: 1800, srh0to1km: 120 } });
    expect(converted.levels.level3?.rules).toEqual([
      { figure: 'mlCape', bound: 'min', value: 1800 },
      { figure: 'srh0to1km', bound: 'min', value: 120 },
    ]);
    expect(converted.hazards).toEqual(defaultSupportGuidance.hazards);
  });

  it('When nothing is stored, then the invented defaults apply', () => {
    expect(supportGuidanceFromStored(null, {})).toBe(defaultSupportGuidance);
  });
});
