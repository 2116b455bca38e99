import type { SoundingLevel } from '../types';
import { liftIndependently } from './independent-parcel';

/**
 * The environment of the capped two-positive-area test sounding, built around an independently
 * lifted surface parcel (1000 hPa, 30 °C, dewpoint 22 °C): 1 K cooler than the parcel up to
 * 860 hPa (a shallow positive layer), 5 K warmer from 850 to 760 hPa (the cap), 4 K cooler again
 * up to 250 hPa (the main positive area), and warmer above. Used by the engine's convention test
 * and the browser journey, so both check the same profile.
 */
export function cappedTemperatures(): { temperatureCAt: (pressureHpa: number) => number; lclPressure: number } {
  const flat: SoundingLevel[] = [1000, 100].map((pressureHpa) => ({ pressureHpa, heightM: 0, temperatureC: 0, dewpointC: null, uMs: null, vMs: null }));
  const parcel = liftIndependently(flat, { pressureHpa: 1000, temperatureC: 30, dewpointC: 22 });
  const parcelVirtualC = (p: number): number => {
    const point = parcel.path.find((q) => Math.abs(q.pressureHpa - p) < 0.5);
    if (!point) throw new Error(`no path point at ${p} hPa`);
    return point.virtualK - 273.15;
  };
  const offset = (p: number): number => {
    if (p > parcel.lclPressure) return 1;
    if (p >= 860) return -1;
    if (p > 850) return -1 + ((860 - p) / 10) * 6;
    if (p >= 760) return 5;
    if (p > 750) return 5 - ((760 - p) / 10) * 9;
    if (p >= 250) return -4;
    if (p > 240) return -4 + ((250 - p) / 10) * 14;
    return 10;
  };
  return { temperatureCAt: (p) => (p === 1000 ? 30 : parcelVirtualC(p) + offset(p)), lclPressure: parcel.lclPressure };
}
