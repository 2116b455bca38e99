import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { moistAdiabatTemperature, OUTSIDE_TABLE_STEP_HPA, PseudoAdiabatPath, pseudoAdiabatTable, pseudoAdiabaticLapseRate, saturatedVirtualTemperature, wetBulbPotentialTemperature } from './moist-adiabat';
import { saturationEquivalentPotentialTemperature } from './thermo';
import { wetBulbTemperature } from './wet-bulb';

describe('pseudo-adiabat', () => {
  it('cools more slowly than the dry adiabat and tends to it in cold air (WallaceHobbs2006 pg. 88)', () => {
    const dry = (0.2854 * 293.15) / 1000; // dT/dp of the dry adiabat at 1000 hPa, K/hPa
    expect(pseudoAdiabaticLapseRate(1000, 293.15)).toBeLessThan(dry);
    const coldDry = (0.2854 * 213.15) / 300;
    expect(pseudoAdiabaticLapseRate(300, 213.15) / coldDry).toBeGreaterThan(0.98);
  });

  it('has a lapse rate near 4–5 K/km at 20 °C and 1000 hPa (common practice, "about half the dry rate" in warm air)', () => {
    const kPerHpa = pseudoAdiabaticLapseRate(1000, 293.15);
    // hydrostatic: dp/dz = −p g/(Rd T) → K/km = dT/dp · p g/(Rd T) · 1000
    const kPerKm = ((kPerHpa * 1000 * 9.80665) / (287.04 * 293.15)) * 1000;
    expect(kPerKm).toBeGreaterThan(4);
    expect(kPerKm).toBeLessThan(5);
  });

  // Domain: pseudo-adiabats with θ_w from −40 to 27 °C (θₑ up to ≈ 368 K), which covers
  // nearly all observed soundings; beyond it Bolton's fit drifts (0.03 K at θ_w = 30 °C).
  // Tolerance 0.025 K: the accuracy Bolton1980 states for eq. 39, about 0.02 K (from memory),
  // plus 0.005 K for the slightly different constants of our integration.
  it('conserves θₑ (Bolton1980 eq. 39) along the reference integration within 0.025 K (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: -40, max: 27, noNaN: true }), fc.double({ min: 500, max: 1050, noNaN: true }), fc.double({ min: 100, max: 1050, noNaN: true }), (thetaWC, p0, p1) => {
        const t0 = moistAdiabatTemperature(1000, thetaWC + 273.15, p0, 1);
        const t1 = moistAdiabatTemperature(p0, t0, p1, 1);
        expect(Math.abs(saturationEquivalentPotentialTemperature(p1, t1) - saturationEquivalentPotentialTemperature(p0, t0))).toBeLessThan(0.025);
      }),
      { numRuns: 40 },
    );
  });

  it('conserves θₑ along the fast table within 0.035 K (property; 0.025 K of the method + 0.01 K table interpolation)', () => {
    const table = pseudoAdiabatTable();
    fc.assert(
      fc.property(fc.double({ min: -40, max: 27, noNaN: true }), fc.double({ min: 500, max: 1050, noNaN: true }), fc.double({ min: 100, max: 1050, noNaN: true }), (thetaWC, p0, p1) => {
        const t0 = table.temperature(thetaWC + 273.15, Math.log(p0));
        const t1 = table.temperature(table.thetaW(t0, Math.log(p0)), Math.log(p1));
        expect(Math.abs(saturationEquivalentPotentialTemperature(p1, t1) - saturationEquivalentPotentialTemperature(p0, t0))).toBeLessThan(0.035);
      }),
      { numRuns: 300 },
    );
  });

  it('the table matches the fine RK4 reference (0.5 hPa steps) within 0.02 K from 1100 to 10 hPa', () => {
    const table = pseudoAdiabatTable();
    let worst = 0;
    for (let thetaWC = -60; thetaWC <= 45; thetaWC += 2.37) {
      for (let p = 1090; p > 10.5; p *= 0.8) {
        const reference = moistAdiabatTemperature(1000, thetaWC + 273.15, p, 0.5);
        worst = Math.max(worst, Math.abs(table.temperature(thetaWC + 273.15, Math.log(p)) - reference));
      }
    }
    expect(worst).toBeLessThan(0.02);
  });

  it('outside the table, RK4 with 5 hPa steps stays within 0.001 K of 1 hPa steps (θ_w up to 70 °C)', () => {
    fc.assert(
      fc.property(fc.double({ min: -90, max: 70, noNaN: true }), fc.double({ min: 20, max: 1050, noNaN: true }), (thetaWC, p) => {
        const fine = moistAdiabatTemperature(1000, thetaWC + 273.15, p, 1);
        expect(Math.abs(moistAdiabatTemperature(1000, thetaWC + 273.15, p, OUTSIDE_TABLE_STEP_HPA) - fine)).toBeLessThan(0.001);
      }),
      { numRuns: 60 },
    );
  });

  it('the table of saturated virtual temperatures matches Tᵥ of the table temperature within 0.02 K', () => {
    const table = pseudoAdiabatTable();
    let worst = 0;
    for (let thetaWC = -60; thetaWC <= 45; thetaWC += 3.1) {
      for (let p = 1090; p > 10.5; p *= 0.83) {
        const path = new PseudoAdiabatPath(table, 1000, thetaWC + 273.15, thetaWC + 273.15);
        const virtual = path.virtualTemperatureAt(p, Math.log(p));
        worst = Math.max(worst, Math.abs(virtual - saturatedVirtualTemperature(table.temperature(thetaWC + 273.15, Math.log(p)), p)));
      }
    }
    expect(worst).toBeLessThan(0.02);
  });

  it('inverse lookup returns the curve label within 0.01 K', () => {
    const table = pseudoAdiabatTable();
    for (const thetaWC of [-35.3, -10.1, 0.7, 12.2, 24.9, 31.6]) {
      for (const p of [1050, 850, 600, 300]) {
        const t = table.temperature(thetaWC + 273.15, Math.log(p));
        expect(Math.abs(table.thetaW(t, Math.log(p)) - (thetaWC + 273.15))).toBeLessThan(0.01);
      }
    }
  });

  it('wet-bulb potential temperature by table and by reference agree within 0.02 K', () => {
    expect(wetBulbPotentialTemperature(700, 280)).toBeCloseTo(wetBulbPotentialTemperature(700, 280, 'reference'), 1);
  });
});

describe('wetBulbTemperature (Normand\'s rule, WallaceHobbs2006 pg. 85)', () => {
  it('lies between the dewpoint and the temperature, and equals both when saturated', () => {
    const tw = wetBulbTemperature(1000, 303.15, 293.15);
    expect(tw).toBeGreaterThan(293.15);
    expect(tw).toBeLessThan(303.15);
    expect(wetBulbTemperature(900, 285, 285)).toBeCloseTo(285, 2);
  });

  it('is about 22.9 °C for 30 °C / 20 °C dewpoint at 1000 hPa (psychrometric tables give 22.8–23.0 °C; from memory)', () => {
    expect(wetBulbTemperature(1000, 303.15, 293.15) - 273.15).toBeCloseTo(22.9, 0);
  });
});
