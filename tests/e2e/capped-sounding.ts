import { liftIndependently } from '../../shared/sounding/testing/independent-parcel';
import { cappedTemperatures } from '../../shared/sounding/testing/capped-temperature';
import type { SoundingLevel } from '../../shared/sounding/types';

/**
 * A capped sounding with two positive areas, built for the browser journeys (exchange CSV).
 *
 * Construction (the same recipe as the engine's convention test, shared/sounding/conventions.test.ts,
 * written out here so the journey does not depend on that file): one surface parcel (1000 hPa,
 * 30 °C, dewpoint 22 °C) is lifted by the independent test integration
 * (shared/sounding/testing/independent-parcel.ts: RK4 on the pseudo-adiabat with 1 hPa steps,
 * not the engine's method). The environment, every 10 hPa from 1000 to 150 hPa, is that
 * parcel's virtual temperature plus an offset:
 *   +1 K below the parcel's LCL (no buoyancy while it rises dry),
 *   −1 K from the LCL to 860 hPa — the shallow positive area,
 *   +5 K from 850 to 760 hPa — the cap (a strong inversion above the shallow area),
 *   −4 K from 750 to 250 hPa — the main positive area,
 *   +10 K above 240 hPa, with linear ramps between.
 * Above the surface the air is dry (dewpoint 40 K below the temperature), so its Tᵥ is within
 * 0.2 K of T. Hand calculation with ∫ R_d ΔTᵥ d ln p (R_d = 287.04 J kg⁻¹ K⁻¹): the shallow area
 * ≈ 287 · 1 · ln(≈900/860) ≈ 13 J/kg; the cap's flat part ≈ −287 · 5 · ln(850/760) ≈ −161 J/kg
 * (more with the ramps); the main area ≈ 287 · 4 · ln(750/250) ≈ 1261 J/kg. Under the cap-aware
 * convention (docs/analysis.md) the LFC is the base of the main area, so the CIN holds the cap.
 *
 * Heights (above sea level, the surface at `elevationM`) come from the hypsometric equation
 * Δz = (R_d T̄ / g) ln(p₁/p₂) (WallaceHobbs2006 eq. 3.29) with the layer-mean temperature rather
 * than virtual temperature: a few metres lower than the engine's own fill, far inside its
 * tolerance of 50 m + 5 % (docs/analysis.md), so the reported heights are accepted as they are.
 * Winds veer from 170° at 10 kt at the surface to 260° at 70 kt at 150 hPa (a plausible profile;
 * no check depends on them, they only keep the wind indices defined).
 */
export interface CappedProfile {
  levels: SoundingLevel[];
  /** The independent integration's results for the surface parcel on this environment. */
  reference: { cin: number; cape: number; lfcPressure: number | null; positiveAreaBelowLfc: number };
}

const RD = 287.04;
const G = 9.80665;

export function cappedProfile(elevationM = 120): CappedProfile {
  const { temperatureCAt } = cappedTemperatures();
  const levels: SoundingLevel[] = [];
  for (let p = 1000; p >= 150; p -= 10) {
    const temperatureC = temperatureCAt(p);
    const previous = levels[levels.length - 1];
    const meanK = previous ? (previous.temperatureC + temperatureC) / 2 + 273.15 : 0;
    const heightM = previous ? previous.heightM + ((RD * meanK) / G) * Math.log(previous.pressureHpa / p) : elevationM;
    const f = (1000 - p) / 850;
    const directionRad = ((170 + 90 * f) * Math.PI) / 180;
    const speedMs = (10 + 60 * f) * 0.514444;
    levels.push({
      pressureHpa: p,
      heightM,
      temperatureC,
      dewpointC: p === 1000 ? 22 : temperatureC - 40,
      uMs: -speedMs * Math.sin(directionRad),
      vMs: -speedMs * Math.cos(directionRad),
    });
  }
  const reference = liftIndependently(levels, { pressureHpa: 1000, temperatureC: 30, dewpointC: 22 });
  return { levels, reference };
}

const METRES_TO_FEET = 1 / 0.3048; // international foot (exact definition, 1959)

/**
 * The profile as exchange CSV with the metadata a library upload needs. `heightsInFeet` writes
 * the heights in feet under the `height_m` header (the mistake the HEIGHTS_REPLACED flag catches).
 */
export function cappedCsv(
  profile: CappedProfile,
  meta: { station: string; name: string; latitude: number; longitude: number; elevationM: number; valid: string },
  heightsInFeet = false,
): string {
  const lines = [
    `# station: ${meta.station}`,
    `# name: ${meta.name}`,
    `# latitude: ${meta.latitude}`,
    `# longitude: ${meta.longitude}`,
    `# elevation_m: ${meta.elevationM}`,
    `# valid: ${meta.valid}`,
    '# source: model',
    'pressure_hPa,height_m,temperature_C,dewpoint_C,wind_direction_deg,wind_speed_kt',
  ];
  for (const level of profile.levels) {
    const u = level.uMs ?? 0;
    const v = level.vMs ?? 0;
    const speedKt = Math.hypot(u, v) / 0.514444;
    const directionDeg = ((Math.atan2(-u, -v) * 180) / Math.PI + 360) % 360;
    const height = heightsInFeet ? level.heightM * METRES_TO_FEET : level.heightM;
    lines.push(
      [level.pressureHpa.toFixed(1), height.toFixed(0), level.temperatureC.toFixed(2), (level.dewpointC ?? NaN).toFixed(2), directionDeg.toFixed(0), speedKt.toFixed(0)].join(','),
    );
  }
  return `${lines.join('\n')}\n`;
}
