import type { SoundingLevel } from '../types';

/**
 * An independent parcel integration for tests, written apart from the engine and with other
 * methods, so agreement means something:
 * - saturation vapour pressure: Magnus form of AlduchovEskridge1996 (eq. 21: 6.1094 exp(17.625 T/(T + 243.04))),
 *   not Bolton1980 eq. 10;
 * - LCL: found by lifting the parcel dry in 1 hPa steps until its mixing ratio reaches
 *   saturation, not Bolton's T_L formula;
 * - moist ascent: RK4 in pressure with 1 hPa steps on the textbook pseudo-adiabatic lapse rate
 *   dT/dp = (R_d T + L_v r_s) / (p (c_p + L_v² r_s ε / (R_d T²))) (WallaceHobbs2006 eq. 3.89 recast in
 *   pressure, constant L_v, no heat capacity of condensate), not the engine's exact entropy form;
 * - areas: ∫ R_d (Tᵥ,parcel − Tᵥ,env) d ln p on the 1 hPa grid (the hydrostatic equivalent of
 *   ∫ B dz), not the engine's trapezoid in height on the sounding's levels.
 * The conventions (LFC at the base of the positive area holding the most energy, EL the highest
 * crossing above it, CIN all negative area below the LFC) are those of docs/analysis.md.
 */
const RD = 287.04;
const CP = 1005.7;
const EPS = 287.04 / 461.5;
const LV = 2.501e6;
const KAPPA = RD / CP;

const es = (temperatureK: number): number => {
  const c = temperatureK - 273.15;
  return 6.1094 * Math.exp((17.625 * c) / (c + 243.04));
};
const ws = (temperatureK: number, pressureHpa: number): number => (EPS * es(temperatureK)) / (pressureHpa - es(temperatureK));
const virtual = (temperatureK: number, w: number): number => (temperatureK * (w + EPS)) / (EPS * (1 + w));

function lapse(pressureHpa: number, temperatureK: number): number {
  const r = ws(temperatureK, pressureHpa);
  return (RD * temperatureK + LV * r) / (pressureHpa * (CP + (LV * LV * r * EPS) / (RD * temperatureK * temperatureK)));
}

function rk4(pressureHpa: number, temperatureK: number, step: number): number {
  const k1 = lapse(pressureHpa, temperatureK);
  const k2 = lapse(pressureHpa + step / 2, temperatureK + (step / 2) * k1);
  const k3 = lapse(pressureHpa + step / 2, temperatureK + (step / 2) * k2);
  const k4 = lapse(pressureHpa + step, temperatureK + step * k3);
  return temperatureK + (step / 6) * (k1 + 2 * k2 + 2 * k3 + k4);
}

/** Environment virtual temperature at a pressure, linear in ln p between levels. */
function environment(levels: readonly SoundingLevel[]): (pressureHpa: number) => number {
  const sorted = [...levels].sort((a, b) => b.pressureHpa - a.pressureHpa);
  const tv = sorted.map((l) => {
    const t = l.temperatureC + 273.15;
    return l.dewpointC === null ? t : virtual(t, ws(l.dewpointC + 273.15, l.pressureHpa));
  });
  return (p) => {
    let i = 0;
    while (i < sorted.length - 2 && (sorted[i + 1] as SoundingLevel).pressureHpa > p) i++;
    const a = sorted[i] as SoundingLevel;
    const b = sorted[i + 1] as SoundingLevel;
    const f = Math.log(a.pressureHpa / p) / Math.log(a.pressureHpa / b.pressureHpa);
    return (tv[i] as number) + f * ((tv[i + 1] as number) - (tv[i] as number));
  };
}

export interface IndependentParcel {
  cape: number;
  cin: number;
  lfcPressure: number | null;
  elPressure: number | null;
  lclPressure: number;
  positiveAreaBelowLfc: number;
  /** Parcel temperature (K) on the 1 hPa grid, from the start pressure upward. */
  path: { pressureHpa: number; temperatureK: number; virtualK: number }[];
}

/**
 * Lift a parcel from (p₀, T₀, T_d0) through `levels` to the top of the data.
 * @param levels - the sounding
 * @param start - starting pressure (hPa), temperature and dewpoint (°C)
 */
export function liftIndependently(levels: readonly SoundingLevel[], start: { pressureHpa: number; temperatureC: number; dewpointC: number }): IndependentParcel {
  const envTv = environment(levels);
  const top = Math.min(...levels.map((l) => l.pressureHpa));
  const w0 = ws(start.dewpointC + 273.15, start.pressureHpa);
  const theta = (start.temperatureC + 273.15) * Math.pow(1000 / start.pressureHpa, KAPPA);
  const path: IndependentParcel['path'] = [];
  let p = start.pressureHpa;
  let t = start.temperatureC + 273.15;
  let saturated = ws(t, p) <= w0;
  let lclPressure = saturated ? p : NaN;
  path.push({ pressureHpa: p, temperatureK: t, virtualK: virtual(t, saturated ? ws(t, p) : w0) });
  while (p - 1 >= top) {
    const next = p - 1;
    if (!saturated) {
      const tn = theta * Math.pow(next / 1000, KAPPA);
      if (ws(tn, next) <= w0) {
        saturated = true;
        lclPressure = next;
      }
      t = tn;
    } else {
      t = rk4(p, t, -1);
    }
    p = next;
    path.push({ pressureHpa: p, temperatureK: t, virtualK: virtual(t, saturated ? ws(t, p) : w0) });
  }
  // Areas on the grid, each step's buoyancy from the mean of its ends (trapezoid in ln p).
  interface Area { base: number; top: number | null; energy: number; negativeBefore: number; positiveBefore: number }
  const areas: Area[] = [];
  let negative = 0;
  let positive = 0;
  let open: Area | undefined;
  for (let i = 1; i < path.length; i++) {
    const a = path[i - 1] as IndependentParcel['path'][number];
    const b = path[i] as IndependentParcel['path'][number];
    const da = RD * (a.virtualK - envTv(a.pressureHpa));
    const db = RD * (b.virtualK - envTv(b.pressureHpa));
    const step = Math.log(a.pressureHpa / b.pressureHpa);
    const energy = 0.5 * (da + db) * step;
    const aboveLcl = b.pressureHpa <= lclPressure;
    if (energy > 0 && aboveLcl) {
      if (!open) {
        open = { base: a.pressureHpa, top: null, energy: 0, negativeBefore: negative, positiveBefore: positive };
        areas.push(open);
      }
      open.energy += energy;
      positive += energy;
    } else {
      if (open) {
        open.top = a.pressureHpa;
        open = undefined;
      }
      if (energy > 0) positive += energy;
      else negative += energy;
    }
  }
  let chosen = -1;
  for (let i = 0; i < areas.length; i++) if (chosen < 0 || (areas[i] as Area).energy > (areas[chosen] as Area).energy) chosen = i;
  if (chosen < 0) return { cape: 0, cin: 0, lfcPressure: null, elPressure: null, lclPressure, positiveAreaBelowLfc: 0, path };
  const lfc = areas[chosen] as Area;
  const last = areas[areas.length - 1] as Area;
  return {
    cape: areas.slice(chosen).reduce((sum, area) => sum + area.energy, 0),
    cin: lfc.negativeBefore,
    lfcPressure: lfc.base,
    elPressure: last.top,
    lclPressure,
    positiveAreaBelowLfc: lfc.positiveBefore,
    path,
  };
}
