import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyzeSounding } from './analyze';
import { liftModifiedSurfaceParcel, liftParcel, liftParcelFromLevel } from './parcel';
import { buildSounding, soundingRecipe } from './testing/random-sounding';
import { weismanKlempSounding } from './testing/weisman-klemp';
import type { SoundingLevel } from './types';

/** A simple sounding in which every value is chosen by hand. */
function handSounding(rows: [p: number, z: number, t: number, td: number][]): SoundingLevel[] {
  return rows.map(([pressureHpa, heightM, temperatureC, dewpointC]) => ({ pressureHpa, heightM, temperatureC, dewpointC, uMs: null, vMs: null }));
}

describe('Weisman and Klemp (1982) analytic sounding', () => {
  // WeismanKlemp1982 report CAPE ≈ 2200 m² s⁻² for q_v0 = 14 g/kg (from memory). Their
  // buoyancy used θ and their model's moist thermodynamics, and their parcel was a
  // near-surface one; ours adds the virtual-temperature correction (docs/analysis.md). We
  // therefore allow 10 % and check the mixed-layer and the most-unstable parcel, which
  // bracket the published value.
  const analysis = analyzeSounding(weismanKlempSounding(0.014));

  it('mixed-layer CAPE for q_v0 = 14 g/kg is within 10 % of 2200 J/kg', () => {
    expect(Math.abs(analysis.mixedLayer.cape / 2200 - 1)).toBeLessThan(0.1);
  });

  it('most-unstable CAPE for q_v0 = 14 g/kg is within 10 % of 2200 J/kg', () => {
    expect(Math.abs(analysis.mostUnstable.cape / 2200 - 1)).toBeLessThan(0.1);
  });

  it('CAPE grows with the surface mixing ratio, 11 → 16 g/kg (WeismanKlemp1982 Fig. 2 ordering)', () => {
    const capes = [11, 12, 13, 14, 15, 16].map((q) => analyzeSounding(weismanKlempSounding(q / 1000)).mixedLayer.cape);
    for (let i = 1; i < capes.length; i++) expect(capes[i]).toBeGreaterThan(capes[i - 1] as number);
  });
});

describe('fast moist ascent (table) against the fine reference (RK4, 1 hPa steps)', () => {
  it('keeps CAPE within 1 % (or 1 J/kg) on varied soundings', () => {
    fc.assert(
      fc.property(soundingRecipe(), (recipe) => {
        const levels = buildSounding(recipe);
        const fast = analyzeSounding(levels);
        const reference = analyzeSounding(levels, { moistAscent: 'reference' });
        for (const key of ['surfaceBased', 'mixedLayer', 'mostUnstable'] as const) {
          const a = fast[key].cape;
          const b = reference[key].cape;
          expect(Math.abs(a - b)).toBeLessThanOrEqual(Math.max(1, 0.01 * b));
        }
      }),
      { numRuns: 40 },
    );
  });

  it('keeps CAPE within 1 % on the Weisman–Klemp soundings', () => {
    for (const q of [11, 14, 16]) {
      const levels = weismanKlempSounding(q / 1000, 250);
      const fast = analyzeSounding(levels).surfaceBased.cape;
      const reference = analyzeSounding(levels, { moistAscent: 'reference' }).surfaceBased.cape;
      expect(Math.abs(fast / reference - 1)).toBeLessThan(0.01);
    }
  });
});

describe('parcel properties (fast-check)', () => {
  it('CAPE ≥ 0, CIN ≤ 0, LCL at or above the surface, LFC ≤ LCL pressure, EL above LFC; no NaN', () => {
    fc.assert(
      fc.property(soundingRecipe(), (recipe) => {
        const levels = buildSounding(recipe);
        const analysis = analyzeSounding(levels);
        for (const parcel of [analysis.surfaceBased, analysis.mixedLayer, analysis.mostUnstable]) {
          expect(parcel.cape).toBeGreaterThanOrEqual(0);
          expect(parcel.cin).toBeLessThanOrEqual(0);
          expect(parcel.cape0to3km).toBeLessThanOrEqual(parcel.cape + 1e-9);
          expect(parcel.lclPressure).toBeLessThanOrEqual(parcel.parcelPressure + 1e-9);
          if (parcel.lclHeight !== null) expect(parcel.lclHeight).toBeGreaterThanOrEqual(0);
          if (parcel.lfcPressure !== null) expect(parcel.lfcPressure).toBeLessThanOrEqual(parcel.lclPressure + 1e-9);
          if (parcel.elPressure !== null && parcel.lfcPressure !== null) expect(parcel.elPressure).toBeLessThan(parcel.lfcPressure);
          if (parcel.lfcPressure === null) {
            expect(parcel.cape).toBe(0);
            expect(parcel.cin).toBe(0);
            expect(parcel.elPressure).toBeNull();
          }
        }
        expect(JSON.stringify(analysis)).not.toMatch(/NaN|Infinity/);
        expect(Object.values(analysis.surfaceBased).every((v) => v === null || typeof v !== 'number' || Number.isFinite(v))).toBe(true);
      }),
      { numRuns: 150 },
    );
  });

  it('gives the same results when the levels arrive in reverse order', () => {
    fc.assert(
      fc.property(soundingRecipe(), (recipe) => {
        const levels = buildSounding(recipe);
        expect(analyzeSounding([...levels].reverse())).toEqual(analyzeSounding(levels));
      }),
      { numRuns: 60 },
    );
  });

  it('a warmer surface temperature gives a higher LCL (lower LCL pressure)', () => {
    fc.assert(
      fc.property(soundingRecipe(), fc.double({ min: 0.5, max: 8, noNaN: true }), (recipe, warming) => {
        const levels = buildSounding(recipe);
        const surface = levels[0] as SoundingLevel;
        const base = liftModifiedSurfaceParcel(levels, { temperatureC: surface.temperatureC });
        const warmer = liftModifiedSurfaceParcel(levels, { temperatureC: surface.temperatureC + warming });
        expect(warmer.lclPressure).toBeLessThan(base.lclPressure);
        if (base.lclHeight !== null && warmer.lclHeight !== null) expect(warmer.lclHeight).toBeGreaterThan(base.lclHeight);
      }),
      { numRuns: 150 },
    );
  });

  it('a moister surface gives CAPE that is not lower (0.5 J/kg tolerance for the piecewise-linear buoyancy)', () => {
    fc.assert(
      fc.property(soundingRecipe(), fc.double({ min: 0.2, max: 6, noNaN: true }), (recipe, moistening) => {
        const levels = buildSounding(recipe);
        const surface = levels[0] as SoundingLevel;
        const dewpoint = surface.dewpointC as number;
        fc.pre(dewpoint + moistening <= surface.temperatureC);
        const base = liftModifiedSurfaceParcel(levels, { dewpointC: dewpoint });
        const moister = liftModifiedSurfaceParcel(levels, { dewpointC: dewpoint + moistening });
        expect(moister.cape).toBeGreaterThanOrEqual(base.cape - 0.5);
      }),
      { numRuns: 150 },
    );
  });
});

describe('parcel conventions (docs/analysis.md)', () => {
  // A stable sounding: isothermal 20 °C, dry: no parcel becomes buoyant.
  const stable = handSounding([
    [1000, 0, 20, 0],
    [900, 900, 20, -5],
    [800, 1900, 20, -10],
    [700, 3000, 20, -15],
    [500, 5800, 20, -30],
  ]);

  it('no LFC: CAPE = 0, CIN = 0, LFC and EL null', () => {
    const parcel = liftParcelFromLevel(stable, 1000);
    expect(parcel).toMatchObject({ cape: 0, cin: 0, lfcPressure: null, lfcHeight: null, elPressure: null, elHeight: null });
  });

  it('lifted index is environment minus parcel temperature at 500 hPa, positive when stable (Galway1956)', () => {
    const parcel = liftParcelFromLevel(stable, 1000);
    expect(parcel.liftedIndex).toBeGreaterThan(10);
  });

  it('a saturated parcel has its LCL at its start (Bolton1980 eq. 15 with T_d = T)', () => {
    const parcel = liftParcel(stable, { pressureHpa: 1000, temperatureC: 20, dewpointC: 20 });
    expect(parcel.lclPressure).toBeCloseTo(1000, 6);
    expect(parcel.lclHeight).toBeCloseTo(0, 6);
  });

  it('positive area below the LCL (superadiabatic surface layer) is not CAPE', () => {
    // Hot dry surface parcel in a stable profile: buoyant near the ground, LCL high, no LFC.
    const parcel = liftParcel(stable, { pressureHpa: 1000, temperatureC: 35, dewpointC: -10 });
    expect(parcel.cape).toBe(0);
    expect(parcel.lfcPressure).toBeNull();
  });

  it('returns the trace only when asked, from the start to the top', () => {
    expect(liftParcelFromLevel(stable, 1000).trace).toBeUndefined();
    const trace = liftParcelFromLevel(stable, 1000, { trace: true }).trace ?? [];
    expect(trace[0]?.pressureHpa).toBe(1000);
    expect(trace.at(-1)?.pressureHpa).toBe(500);
    expect(trace.length).toBe(6); // five levels + the LCL
    for (const point of trace) expect(point.virtualTemperatureC).toBeGreaterThanOrEqual(point.temperatureC);
  });

  it('the 0–3 km CAPE never exceeds the CAPE and is zero when the LFC is above 3 km', () => {
    const wk = weismanKlempSounding(0.014);
    const parcel = liftParcelFromLevel(wk, wk[0]?.pressureHpa ?? 1000);
    expect(parcel.cape0to3km).toBeLessThan(parcel.cape);
    if ((parcel.lfcHeight ?? 0) > 3000) expect(parcel.cape0to3km).toBe(0);
  });
});
