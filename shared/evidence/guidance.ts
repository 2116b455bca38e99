import {
  legacyGuidanceThresholdsSchema,
  supportGuidanceSchema,
  type GuidanceRule,
  type GuidanceRuleSet,
  type SupportGuidance,
} from '../contracts/office';
import type { HazardKind } from '../contracts/risk-areas';
import { keyFigureKeys, type KeyFigureKey } from '../sounding/key-figures';

/**
 * What the support check needs to know about each key figure a rule may use: its label, its
 * SI unit, how many decimals to show, which display unit family it converts to (the editor
 * shows heights, speeds and temperatures in the person's units) and the published basis of
 * the ingredient, shown in the guidance editor's help.
 */
export interface GuidanceFigure {
  label: string;
  unit: string;
  digits: number;
  quantity: 'height' | 'speed' | 'temperature' | 'plain';
  /** Published basis of the ingredient, or how it is used (shown in the editor's help). */
  basis: string;
  /** CIN is negative: a minimum reads "no stronger than". */
  negativeIsStronger?: boolean;
}

const STP_BASIS = 'Thompson et al. 2003, Wea. Forecasting 18; Thompson et al. 2012, Wea. Forecasting 27';
const SRH_BASIS = 'Coffer et al. 2019, Wea. Forecasting 34 (0–500 m SRH discriminates tornadic supercells better than 0–1 km SRH)';
const HAIL_BASIS = 'Johnson and Sugden 2014, E-Journal Severe Storms Meteor. 9 (5), "Evaluation of sounding-derived thermodynamic and wind-related parameters associated with large hail events"';
const FLOOD_BASIS = 'ingredients approach of Doswell, Brooks and Maddox 1996, Wea. Forecasting 11';
const CORFIDI_BASIS = 'Corfidi 2003, Wea. Forecasting 18 (slow system motion: set a maximum)';
const WIND_BASIS = 'damaging-wind ingredient (common practice; no single published threshold, tune to the office climate)';
const PARCEL_BASIS = 'parcel theory, as the sounding analysis computes it (docs/analysis.md)';

export const guidanceFigures: Record<KeyFigureKey, GuidanceFigure> = {
  mlCape: { label: 'MLCAPE', unit: 'J/kg', digits: 0, quantity: 'plain', basis: PARCEL_BASIS },
  muCape: { label: 'MUCAPE', unit: 'J/kg', digits: 0, quantity: 'plain', basis: `hail: ${HAIL_BASIS}` },
  mlCin: { label: 'MLCIN', unit: 'J/kg', digits: 0, quantity: 'plain', basis: `${PARCEL_BASIS}; negative: a minimum of −100 means "no stronger than −100"`, negativeIsStronger: true },
  mlLclHeightM: { label: 'LCL height', unit: 'm', digits: 0, quantity: 'height', basis: `tornado: a low cloud base, as in STP (${STP_BASIS}); set a maximum` },
  precipitableWaterMm: { label: 'Precipitable water', unit: 'mm', digits: 0, quantity: 'plain', basis: `flash flooding: moisture, ${FLOOD_BASIS}` },
  bulkShear0to6kmMs: { label: '0–6 km shear', unit: 'm/s', digits: 0, quantity: 'speed', basis: `organised storms, as in STP and SCP (${STP_BASIS})` },
  srh0to1km: { label: '0–1 km SRH', unit: 'm²/s²', digits: 0, quantity: 'plain', basis: `tornado: ${SRH_BASIS}` },
  stp: { label: 'STP', unit: '', digits: 1, quantity: 'plain', basis: `tornado: ${STP_BASIS}` },
  scp: { label: 'SCP', unit: '', digits: 1, quantity: 'plain', basis: 'supercells: Thompson et al. 2003, Wea. Forecasting 18' },
  surfaceDewpointC: { label: 'Surface dewpoint', unit: '°C', digits: 1, quantity: 'temperature', basis: 'low-level moisture (common practice)' },
  surfaceMixingRatioGkg: { label: 'Surface mixing ratio', unit: 'g/kg', digits: 1, quantity: 'plain', basis: 'low-level moisture (common practice)' },
  srh0to500m: { label: '0–500 m SRH', unit: 'm²/s²', digits: 0, quantity: 'plain', basis: `tornado: ${SRH_BASIS}` },
  criticalAngleDeg: { label: 'Critical angle', unit: '°', digits: 0, quantity: 'plain', basis: 'tornado: Esterheld and Giuliano 2008, E-Journal Severe Storms Meteor. 3 (near 90° favours tornadoes)' },
  mlLclLfcGapM: { label: 'LCL–LFC gap', unit: 'm', digits: 0, quantity: 'height', basis: 'tornado and initiation: a small gap between cloud base and free convection (common practice); set a maximum' },
  lapseRate0to3kmCKm: { label: '0–3 km lapse rate', unit: '°C/km', digits: 1, quantity: 'plain', basis: `damaging wind: low-level lapse rate, ${WIND_BASIS}` },
  lapseRate3to6kmCKm: { label: '3–6 km lapse rate', unit: '°C/km', digits: 1, quantity: 'plain', basis: 'mid-level lapse rate (common practice)' },
  lapseRate850to500CKm: { label: '850–500 hPa lapse rate', unit: '°C/km', digits: 1, quantity: 'plain', basis: 'mid-level lapse rate (common practice)' },
  lapseRate700to500CKm: { label: '700–500 hPa lapse rate', unit: '°C/km', digits: 1, quantity: 'plain', basis: `hail: ${HAIL_BASIS}` },
  muCapeHailZone: { label: 'MUCAPE −10 to −30 °C', unit: 'J/kg', digits: 0, quantity: 'plain', basis: `hail: CAPE in the hail-growth layer, ${HAIL_BASIS}` },
  freezingLevelM: { label: 'Freezing level', unit: 'm', digits: 0, quantity: 'height', basis: `hail: ${HAIL_BASIS}; a high freezing level melts hail, set a maximum` },
  effectiveBulkShearMs: { label: 'Effective shear', unit: 'm/s', digits: 0, quantity: 'speed', basis: `hail: ${HAIL_BASIS}; effective layer as in ${STP_BASIS}` },
  bulkShear0to8kmMs: { label: '0–8 km shear', unit: 'm/s', digits: 0, quantity: 'speed', basis: 'deep-layer shear for long-lived supercells (common practice)' },
  dcape: { label: 'DCAPE', unit: 'J/kg', digits: 0, quantity: 'plain', basis: `damaging wind: downdraft CAPE, ${WIND_BASIS}` },
  meanWind0to6kmMs: { label: '0–6 km mean wind', unit: 'm/s', digits: 0, quantity: 'speed', basis: `damaging wind: momentum carried down, ${WIND_BASIS}` },
  corfidiUpwindMs: { label: 'Corfidi upwind speed', unit: 'm/s', digits: 0, quantity: 'speed', basis: `flash flooding: ${CORFIDI_BASIS}` },
  corfidiDownwindMs: { label: 'Corfidi downwind speed', unit: 'm/s', digits: 0, quantity: 'speed', basis: `forward-propagating systems: ${CORFIDI_BASIS.replace(' (slow system motion: set a maximum)', '')}` },
  warmCloudDepthM: { label: 'Warm-cloud depth', unit: 'm', digits: 0, quantity: 'height', basis: `flash flooding: efficient warm-rain growth, ${FLOOD_BASIS}` },
};

/** The figures each hazard's rules are built from (the editor offers these first). */
export const hazardIngredients: Record<HazardKind, KeyFigureKey[]> = {
  tornado: ['srh0to1km', 'srh0to500m', 'mlLclHeightM', 'stp', 'criticalAngleDeg'],
  hail: ['muCape', 'muCapeHailZone', 'lapseRate700to500CKm', 'freezingLevelM', 'effectiveBulkShearMs'],
  wind: ['dcape', 'meanWind0to6kmMs', 'lapseRate0to3kmCKm'],
  flood: ['precipitableWaterMm', 'corfidiUpwindMs', 'warmCloudDepthM'],
};

/** When a rule set gives no minimum share, at least half of the judged soundings must back it (invented default). */
export const DEFAULT_MINIMUM_SHARE_PERCENT = 50;

const min = (figure: KeyFigureKey, value: number): GuidanceRule => ({ figure, bound: 'min', value });
const max = (figure: KeyFigureKey, value: number): GuidanceRule => ({ figure, bound: 'max', value });
const set = (rules: GuidanceRule[], minimumCount = 3, minimumSharePercent: number | null = null): GuidanceRuleSet => ({ rules, minimumCount, minimumSharePercent });

/**
 * INVENTED demo guidance: a starting point for an admin to tune to the office's climate. None
 * of these values is taken from a published scheme; the published basis of each ingredient is
 * named in `guidanceFigures` and in the guidance editor's help.
 */
export const defaultSupportGuidance: SupportGuidance = {
  levels: {
    thunder: set([min('muCape', 100)]),
    level1: set([min('mlCape', 250), min('bulkShear0to6kmMs', 10)]),
    level2: set([min('mlCape', 1000), min('bulkShear0to6kmMs', 15), min('mlCin', -200)]),
    level3: set([min('mlCape', 1500), min('bulkShear0to6kmMs', 20), min('srh0to1km', 100), min('mlCin', -100)]),
    level4: set([min('mlCape', 2000), min('bulkShear0to6kmMs', 25), min('srh0to1km', 200), min('stp', 2), min('mlCin', -75)], 4),
    level5: set([min('mlCape', 3000), min('bulkShear0to6kmMs', 30), min('srh0to1km', 300), min('stp', 4), min('mlCin', -50)], 5, 60),
  },
  hazards: {
    tornado: {
      ordinary: set([min('srh0to1km', 100), max('mlLclHeightM', 1500), min('stp', 1)]),
      significant: set([min('srh0to500m', 150), min('srh0to1km', 200), max('mlLclHeightM', 1000), min('stp', 3)]),
    },
    hail: {
      ordinary: set([min('muCape', 1000), min('lapseRate700to500CKm', 6.5), min('effectiveBulkShearMs', 15)]),
      significant: set([min('muCape', 2000), min('muCapeHailZone', 400), min('lapseRate700to500CKm', 7), max('freezingLevelM', 4300), min('effectiveBulkShearMs', 20)]),
    },
    wind: {
      ordinary: set([min('dcape', 700), min('meanWind0to6kmMs', 12), min('lapseRate0to3kmCKm', 7)]),
      significant: set([min('dcape', 1100), min('meanWind0to6kmMs', 18), min('lapseRate0to3kmCKm', 8)]),
    },
    flood: {
      ordinary: set([min('precipitableWaterMm', 38), max('corfidiUpwindMs', 8), min('warmCloudDepthM', 3000)]),
      significant: set([min('precipitableWaterMm', 50), max('corfidiUpwindMs', 5), min('warmCloudDepthM', 3500)]),
    },
  },
};

const legacyKeys = new Set<string>(keyFigureKeys);

/**
 * The office guidance as stored: the issue-14 rules when present; otherwise the minimum medians
 * stored before (`guidance_thresholds`), each turned into a per-sounding minimum rule with the
 * default hazard rules; otherwise the invented defaults. Never throws on old or odd data.
 */
export function supportGuidanceFromStored(stored: unknown, legacy: unknown): SupportGuidance {
  if (stored !== null && stored !== undefined) {
    const parsed = supportGuidanceSchema.safeParse(stored);
    if (parsed.success) return parsed.data;
  }
  const old = legacyGuidanceThresholdsSchema.safeParse(legacy);
  if (!old.success || Object.keys(old.data).length === 0) return defaultSupportGuidance;
  const levels: SupportGuidance['levels'] = {};
  for (const [levelKey, thresholds] of Object.entries(old.data)) {
    const rules = Object.entries(thresholds).flatMap(([figure, value]) => (legacyKeys.has(figure) && Number.isFinite(value) ? [{ figure: figure as KeyFigureKey, bound: 'min' as const, value }] : []));
    levels[levelKey] = set(rules.slice(0, 12));
  }
  return { levels, hazards: defaultSupportGuidance.hazards };
}

const MINUS_SIGN = '\u2212';

/** One formatter per number of decimals: building an Intl.NumberFormat per call costs more than the whole check. */
const numberFormats = new Map<number, Intl.NumberFormat>();
function numberFormat(digits: number): Intl.NumberFormat {
  let format = numberFormats.get(digits);
  if (!format) {
    format = new Intl.NumberFormat('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits });
    numberFormats.set(digits, format);
  }
  return format;
}

/** A figure's value in its SI unit for reasons in words: grouped digits, a true minus sign. */
export function formatFigure(figure: KeyFigureKey, value: number): string {
  const { digits, unit } = guidanceFigures[figure];
  const text = numberFormat(digits).format(Math.abs(value));
  const signed = value < 0 && Number(text.replace(/,/g, '')) !== 0 ? `${MINUS_SIGN}${text}` : text;
  return unit === '' ? signed : unit === '°' ? `${signed}°` : `${signed} ${unit}`;
}

/** A rule in words: "MLCAPE ≥ 1,500 J/kg", "LCL height ≤ 1,000 m", "MLCIN no stronger than −100 J/kg". */
export function describeRule(rule: GuidanceRule): string {
  const figure = guidanceFigures[rule.figure];
  const value = formatFigure(rule.figure, rule.value);
  if (figure.negativeIsStronger) return `${figure.label} ${rule.bound === 'min' ? 'no stronger than' : 'at least as strong as'} ${value}`;
  return `${figure.label} ${rule.bound === 'min' ? '≥' : '≤'} ${value}`;
}

/** How a sounding misses a rule, in words: "MLCAPE below 1,500 J/kg", "MLCIN stronger than −100 J/kg". */
export function describeMiss(rule: GuidanceRule): string {
  const figure = guidanceFigures[rule.figure];
  const value = formatFigure(rule.figure, rule.value);
  if (figure.negativeIsStronger) return `${figure.label} ${rule.bound === 'min' ? 'stronger than' : 'weaker than'} ${value}`;
  return `${figure.label} ${rule.bound === 'min' ? 'below' : 'above'} ${value}`;
}

/** Words for a hazard form: "tornado", "significant large hail". */
export function hazardFormLabel(hazard: HazardKind, significant: boolean): string {
  const words: Record<HazardKind, string> = { tornado: 'tornado', hail: 'large hail', wind: 'damaging wind', flood: 'flash flooding' };
  return significant ? `significant ${words[hazard]}` : words[hazard];
}

