import { describe, expect, it } from 'vitest';
import { ZERO_CELSIUS_K, dewpointFromMixingRatio, dryAdiabatTemperature, saturationMixingRatio } from '../../../../shared/sounding';
import { dryAdiabats, logPressureSamples, mixingRatioLines, pseudoAdiabats } from './diagram-lines';
import { skewT } from './skew-t-geometry';

const transform = skewT({
  left: 48,
  top: 16,
  width: 600,
  height: 560,
  pressureBottomHpa: 1050,
  pressureTopHpa: 100,
  temperatureLeftC: -40,
  temperatureRightC: 50,
  skew: 1,
});

/** Temperature read back from a drawn curve at a pressure: linear in y between the drawn points, as SVG draws it. */
function readDrawnTemperature(points: { pressureHpa: number; temperatureC: number }[], pressureHpa: number): number {
  const drawn = points.map((point) => transform.toPoint(point.pressureHpa, point.temperatureC));
  const y = transform.pressureToY(pressureHpa);
  for (let i = 1; i < drawn.length; i++) {
    const a = drawn[i - 1];
    const b = drawn[i];
    if (!a || !b) continue;
    if ((a.y - y) * (b.y - y) <= 0) {
      const x = a.x + ((y - a.y) / (b.y - a.y)) * (b.x - a.x);
      return transform.fromPoint({ x, y }).temperatureC;
    }
  }
  throw new Error(`pressure ${pressureHpa} hPa not on the curve`);
}

describe('logPressureSamples', () => {
  it('starts at the bottom and ends at the top pressure', () => {
    const samples = logPressureSamples(1050, 100, 10);
    expect(samples[0]).toBeCloseTo(1050, 9);
    expect(samples[10]).toBeCloseTo(100, 9);
  });
});

describe('dry adiabats', () => {
  // Check values: the engine's dryAdiabatTemperature (Poisson's equation, WallaceHobbs2006 eq. 3.54).
  // Tolerance 0.05 K: the drawn curve is a polyline with 41 points; between points the line is
  // straight in (x, y) while the adiabat curves slightly, and these pressures fall between points.
  it('the drawn 30 °C adiabat agrees with Poisson’s equation at 1000, 850, 700, 500 and 300 hPa', () => {
    const curve = dryAdiabats([30], 1050, 100)[0];
    if (!curve) throw new Error('no curve');
    for (const pressureHpa of [1000, 850, 700, 500, 300]) {
      const expected = dryAdiabatTemperature(pressureHpa, 30 + ZERO_CELSIUS_K) - ZERO_CELSIUS_K;
      expect(Math.abs(readDrawnTemperature(curve.points, pressureHpa) - expected)).toBeLessThan(0.05);
    }
  });

  it('passes through θ at 1000 hPa (definition of potential temperature)', () => {
    const curve = dryAdiabats([20], 1050, 100)[0];
    expect(readDrawnTemperature(curve?.points ?? [], 1000)).toBeCloseTo(20, 1);
  });
});

describe('mixing-ratio lines', () => {
  // Check value: the engine's dewpointFromMixingRatio (WallaceHobbs2006 eq. 3.59 with Bolton1980 eq. 11).
  it('the drawn 10 g/kg line passes through the dewpoint the engine gives at 900 and 700 hPa', () => {
    const curve = mixingRatioLines([10], 1050, 600)[0];
    for (const pressureHpa of [900, 700]) {
      const expected = dewpointFromMixingRatio(0.01, pressureHpa) - ZERO_CELSIUS_K;
      expect(Math.abs(readDrawnTemperature(curve?.points ?? [], pressureHpa) - expected)).toBeLessThan(0.05);
    }
  });

  it('each point of the line is saturated at 10 g/kg (saturationMixingRatio round trip)', () => {
    const curve = mixingRatioLines([10], 1050, 600)[0];
    for (const point of curve?.points ?? []) {
      expect(saturationMixingRatio(point.pressureHpa, point.temperatureC + ZERO_CELSIUS_K)).toBeCloseTo(0.01, 4);
    }
  });
});

describe('pseudo-adiabats', () => {
  it('the θw = 20 °C curve is at 20 °C at 1000 hPa and warmer than the 20 °C dry adiabat aloft (latent heat released)', () => {
    const curve = pseudoAdiabats([20], 1050, 200)[0];
    expect(readDrawnTemperature(curve?.points ?? [], 1000)).toBeCloseTo(20, 1);
    const dry500 = dryAdiabatTemperature(500, 20 + ZERO_CELSIUS_K) - ZERO_CELSIUS_K;
    expect(readDrawnTemperature(curve?.points ?? [], 500)).toBeGreaterThan(dry500);
  });
});

describe('zoomedFrame', () => {
  it('spans the lowest 300 hPa above the surface', async () => {
    const { zoomedFrame } = await import('./diagram-frame');
    const frame = zoomedFrame(
      [
        { pressureHpa: 965, heightM: 350, temperatureC: 27.8, dewpointC: 23.8, uMs: null, vMs: null },
        { pressureHpa: 600, heightM: 4400, temperatureC: -5, dewpointC: -20, uMs: null, vMs: null },
      ],
      [],
    );
    expect(frame.pressureTopHpa).toBe(665);
    expect(frame.pressureBottomHpa).toBe(977);
  });
});
