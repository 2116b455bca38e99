import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyzeSounding } from './analyze';
import { layerThickness } from './hypsometric';
import { effectiveInflowLayer } from './kinematics';
import { meetsEffectiveInflowCriteria } from './parcel';
import { parseSoundingCsv } from './parse-csv';
import { buildProfile } from './profile';
import { liftIndependently } from './testing/independent-parcel';
import { cappedTemperatures } from './testing/capped-temperature';
import { buildSounding, oddSoundingRecipe, type OddKind } from './testing/random-sounding';
import type { ParsedSounding, SoundingLevel } from './types';

const FIXTURES = ['bna_20021111_00z.csv', 'bna_20140728_00z.csv', 'oax_20140616_19z.csv'];
const fixtureText = (name: string): string => readFileSync(new URL(`../../tests/fixtures/soundings/${name}`, import.meta.url), 'utf8');
function parse(text: string, name = 'test.csv'): ParsedSounding {
  const result = parseSoundingCsv(text, name);
  if (!result.ok) throw new Error(`${name}: ${result.error.map((i) => i.message).join('; ')}`);
  return result.value;
}

/**
 * A capped sounding built around one parcel (1000 hPa, 30 °C, dewpoint 22 °C), whose path
 * comes from the independent integration (not the engine): the environment's virtual
 * temperature is the parcel's minus 1 K from the LCL to 860 hPa (a shallow positive area),
 * plus 5 K from 850 to 760 hPa (the cap), minus 4 K from 750 to 250 hPa (the main area) and
 * plus 10 K above. The environment is dry above the surface (dewpoint 40 K below the
 * temperature), so its Tᵥ is within 0.2 K of T.
 * Hand calculation with ∫ R_d ΔTᵥ d ln p (R_d = 287.04): shallow area ≈ 287 · 1 · ln(≈900/860)
 * ≈ 13 J/kg; cap ≈ −287 · 5 · ln(850/760) ≈ −161 J/kg (plus the ramps on each side); main area
 * ≈ 287 · 4 · ln(750/250) ≈ 1261 J/kg.
 */
function cappedSounding(): { levels: SoundingLevel[]; lclPressure: number } {
  const { temperatureCAt, lclPressure } = cappedTemperatures();
  const levels: SoundingLevel[] = [];
  for (let p = 1000; p >= 150; p -= 10) {
    const temperatureC = temperatureCAt(p);
    const previous = levels[levels.length - 1];
    const heightM = previous ? previous.heightM + layerThickness(previous.pressureHpa, p, previous.temperatureC + 273.15, temperatureC + 273.15) : 0;
    levels.push({ pressureHpa: p, heightM, temperatureC, dewpointC: p === 1000 ? 22 : temperatureC - 40, uMs: null, vMs: null });
  }
  return { levels, lclPressure };
}

describe('cap-aware parcel convention (docs/analysis.md)', () => {
  it('with a shallow positive area under a strong cap, the LFC is the base of the main area, CIN shows the cap and the shallow area is reported apart', () => {
    const { levels, lclPressure } = cappedSounding();
    expect(lclPressure).toBeGreaterThan(870); // the shallow area exists: LCL below 860 hPa
    const parcel = analyzeSounding(levels).surfaceBased;
    // LFC where the main area starts (between 760 and 750 hPa by construction).
    expect(parcel.lfcPressure).toBeGreaterThan(749);
    expect(parcel.lfcPressure).toBeLessThan(761);
    // CIN holds the cap: at least the −161 J/kg of the flat part (hand calculation above).
    expect(parcel.cin).toBeLessThan(-150);
    // The shallow area (≈ 13 J/kg by hand) is reported, not dropped and not in CAPE.
    expect(parcel.positiveAreaBelowLfc).toBeGreaterThan(5);
    expect(parcel.positiveAreaBelowLfc).toBeLessThan(30);
    // CAPE ≈ 1261 J/kg of the main area (hand calculation; ±10 % for the ramps and Tᵥ of the dry air).
    expect(parcel.cape).toBeGreaterThan(1130);
    expect(parcel.cape).toBeLessThan(1400);
    // EL at the top of the main area (between 250 and 240 hPa by construction).
    expect(parcel.elPressure).toBeGreaterThan(239);
    expect(parcel.elPressure).toBeLessThan(251);
    expect(parcel.negativeAreaLfcToEl).toBe(0);
  });

  it('when the low positive area holds more energy than the one above a negative layer, the LFC stays low and the negative layer is reported between LFC and EL', () => {
    const { levels } = cappedSounding();
    // Low area 10 K warmer parcel from the LCL to 860 hPa: ≈ 287 · 11 · ln(890/860) ≈ 108 J/kg
    // or more; the upper area cut at 710 hPa: ≈ 287 · 4 · ln(750/710) ≈ 63 J/kg plus a ramp.
    const edited = levels.map((level) => {
      if (level.pressureHpa < 890 && level.pressureHpa >= 860) return { ...level, temperatureC: level.temperatureC - 10 };
      if (level.pressureHpa < 710 && level.pressureHpa > 150) return { ...level, temperatureC: level.temperatureC + 14 };
      return level;
    });
    const parcel = analyzeSounding(edited).surfaceBased;
    expect(parcel.lfcPressure).toBeGreaterThan(860);
    expect(parcel.negativeAreaLfcToEl).toBeLessThan(-100);
    expect(parcel.positiveAreaBelowLfc).toBeLessThan(1);
  });
});

describe('heights in feet labelled as metres', () => {
  it('are flagged (HEIGHTS_REPLACED, with the tolerance) and the hypsometric heights are used', () => {
    const text = fixtureText('bna_20140728_00z.csv');
    const lines = text.split('\n');
    const header = lines.findIndex((line) => line.startsWith('pressure_hPa'));
    const feet = lines.map((line, i) => {
      if (i <= header || line.trim() === '') return line;
      const cells = line.split(',');
      if (cells[1] !== '' && cells[1] !== undefined) cells[1] = String(Math.round(Number(cells[1]) * 3.28084));
      return cells.join(',');
    });
    const original = analyzeSounding(parse(text).levels);
    const wrong = analyzeSounding(parse(feet.join('\n')).levels);
    const flag = wrong.flags.find((f) => f.code === 'HEIGHTS_REPLACED');
    expect(flag?.message).toMatch(/50 m \+ 5 %/);
    expect(original.flags.map((f) => f.code)).not.toContain('HEIGHTS_REPLACED');
    // The reported heights of the fixture agree with the hypsometric ones (no flag), so the
    // replaced heights give the same levels within 2 %.
    // The fixture's reported heights stay within the tolerance of the hypsometric ones (no flag),
    // so the replaced heights give nearly the same levels: within 3 % (the LCL height differs
    // by 30 m of 1.1 km, the largest), while the feet would have tripled them.
    expect(Math.abs((wrong.surfaceBased.lclHeight ?? 0) / (original.surfaceBased.lclHeight ?? 1) - 1)).toBeLessThan(0.03);
    expect(Math.abs((wrong.mostUnstable.elHeight ?? 0) / (original.mostUnstable.elHeight ?? 1) - 1)).toBeLessThan(0.03);
    expect(Math.abs(wrong.mostUnstable.cape / original.mostUnstable.cape - 1)).toBeLessThan(0.03);
  });
});

describe('observed fixtures against an independent fine-step integration (RK4 on the pseudo-adiabat, 1 hPa)', () => {
  // Tolerances: the two methods differ on purpose (Magnus constants of AlduchovEskridge1996 vs
  // Bolton1980; constant vs temperature-dependent L_v and no condensate heat capacity; ln p grid
  // vs height trapezoid on the levels). CAPE within 8 % (about 5 % found), CIN within 10 J/kg
  // or 10 %, LFC and EL within 10 hPa, LCL within 2 hPa (1 hPa grid).
  for (const name of FIXTURES) {
    for (const key of ['surfaceBased', 'mostUnstable'] as const) {
      it(`${name}, ${key} parcel: CAPE, CIN, LFC, EL and LCL agree`, () => {
        const sounding = parse(fixtureText(name), name);
        const engine = analyzeSounding(sounding.levels)[key];
        const level = sounding.levels.find((l) => l.pressureHpa === engine.parcelPressure);
        expect(level?.dewpointC).not.toBeNull();
        const reference = liftIndependently(sounding.levels, { pressureHpa: level?.pressureHpa ?? NaN, temperatureC: level?.temperatureC ?? NaN, dewpointC: level?.dewpointC ?? NaN });
        expect(engine.cape).toBeGreaterThan(0);
        expect(Math.abs(engine.cape / reference.cape - 1)).toBeLessThan(0.08);
        expect(Math.abs(engine.cin - reference.cin)).toBeLessThan(Math.max(10, 0.1 * Math.abs(reference.cin)));
        expect(Math.abs((engine.lfcPressure ?? NaN) - (reference.lfcPressure ?? NaN))).toBeLessThan(10);
        expect(Math.abs((engine.elPressure ?? NaN) - (reference.elPressure ?? NaN))).toBeLessThan(10);
        expect(Math.abs(engine.lclPressure - reference.lclPressure)).toBeLessThan(2);
      });
    }
  }
});

describe('effective inflow layer with candidates at least 5 hPa apart', () => {
  /** The layer as a scan from the surface finds it (a parcel from every level). */
  function scanLayer(levels: SoundingLevel[]): [number, number] | null {
    const profile = buildProfile(levels);
    const limit = (profile.pressureHpa[0] as number) - 300;
    let bottom = -1;
    for (let k = 0; k <= profile.moistureTopIndex; k++) {
      if (bottom < 0 && (profile.pressureHpa[k] as number) < limit) break;
      const meets = meetsEffectiveInflowCriteria(profile, k);
      if (bottom < 0 && meets) bottom = k;
      else if (bottom >= 0 && !meets) return [profile.pressureHpa[bottom] as number, profile.pressureHpa[k - 1] as number];
    }
    return bottom < 0 ? null : [profile.pressureHpa[bottom] as number, profile.pressureHpa[profile.moistureTopIndex] as number];
  }

  it.each(FIXTURES)('gives the same layer as a scan of every level on %s', (name) => {
    const levels = parse(fixtureText(name), name).levels;
    const layer = effectiveInflowLayer(buildProfile(levels));
    const scanned = scanLayer(levels);
    expect(scanned).not.toBeNull();
    expect(layer ? [layer.bottomPressure, layer.topPressure] : null).toEqual(scanned);
  });
});

describe('odd soundings keep the invariants (CAPE ≥ 0, CIN ≤ 0, EL above LFC, side areas signed, no NaN)', () => {
  const kinds: [OddKind, number][] = [
    ['superadiabatic', 40],
    ['sparse', 60],
    ['truncated', 40],
    ['isothermal', 30],
    ['saturated', 40],
    ['dense', 4],
  ];
  it.each(kinds)('%s profiles', (kind, numRuns) => {
    fc.assert(
      fc.property(oddSoundingRecipe(kind), (recipe) => {
        const levels = buildSounding(recipe);
        if (kind === 'dense') expect(levels.length).toBeGreaterThanOrEqual(2000);
        if (kind === 'truncated') expect(levels[levels.length - 1]?.pressureHpa).toBeGreaterThan(599);
        const analysis = analyzeSounding(levels);
        for (const parcel of [analysis.surfaceBased, analysis.mixedLayer, analysis.mostUnstable]) {
          expect(parcel.cape).toBeGreaterThanOrEqual(0);
          expect(parcel.cin).toBeLessThanOrEqual(0);
          expect(parcel.positiveAreaBelowLfc).toBeGreaterThanOrEqual(0);
          expect(parcel.negativeAreaLfcToEl).toBeLessThanOrEqual(0);
          expect(parcel.elPressure === null || parcel.lfcPressure === null || parcel.elPressure < parcel.lfcPressure).toBe(true);
        }
        const json = JSON.stringify(analysis, (_key, value: unknown) => (typeof value === 'number' && !Number.isFinite(value) ? 'NOT FINITE' : value));
        expect(json).not.toContain('NOT FINITE');
      }),
      { numRuns },
    );
  });
});

describe('Southern Hemisphere: the left mover is the cyclonic deviant one (Bunkers2000)', () => {
  it('a mirrored hodograph south of the equator gives the negated helicity and the same composites', () => {
    const levels = parse(fixtureText('oax_20140616_19z.csv')).levels;
    const mirrored = levels.map((l) => ({ ...l, vMs: l.vMs === null ? null : -l.vMs }));
    const north = analyzeSounding(levels, { latitude: 41.3 });
    const south = analyzeSounding(mirrored, { latitude: -41.3 });
    expect(north.kinematics.deviantMover).toBe('right');
    expect(south.kinematics.deviantMover).toBe('left');
    expect(south.kinematics.stormMotionDeviant?.v).toBeCloseTo(-(north.kinematics.stormMotionDeviant?.v ?? NaN), 9);
    expect(north.srh0to1km).toBeGreaterThan(50);
    expect(south.srh0to1km).toBeCloseTo(-(north.srh0to1km ?? NaN), 6);
    expect(south.composites.significantTornadoFixedLayer).toBeCloseTo(north.composites.significantTornadoFixedLayer ?? NaN, 9);
    expect(south.composites.supercellComposite).toBeCloseTo(north.composites.supercellComposite ?? NaN, 9);
  });
});
