import type { GuidanceThresholds, RiskLadder, ThresholdParameterKey } from '../contracts/office';
import type { SupportCheckResult } from '../contracts/risk-areas';
import type { AreaEvidence } from './evidence';

/** Parameters an office may set a guidance threshold for; each is a minimum median expected for a level. */
export const thresholdParameters = {
  mlCape: { label: 'MLCAPE', unit: 'J/kg', digits: 0 },
  muCape: { label: 'MUCAPE', unit: 'J/kg', digits: 0 },
  bulkShear0to6kmMs: { label: '0–6 km shear', unit: 'm/s', digits: 0 },
  srh0to1km: { label: '0–1 km SRH', unit: 'm²/s²', digits: 0 },
  stp: { label: 'STP', unit: '', digits: 1 },
  scp: { label: 'SCP', unit: '', digits: 1 },
} as const satisfies Record<ThresholdParameterKey, { label: string; unit: string; digits: number }>;
type ThresholdParameter = ThresholdParameterKey;

/**
 * Invented default guidance for the demo office: a starting point that an admin tunes to the
 * office's climate. Not taken from any published scheme.
 */
export const defaultGuidanceThresholds: GuidanceThresholds = {
  thunder: { muCape: 100 },
  level1: { mlCape: 250, bulkShear0to6kmMs: 10 },
  level2: { mlCape: 1000, bulkShear0to6kmMs: 15 },
  level3: { mlCape: 1500, bulkShear0to6kmMs: 20, srh0to1km: 100 },
  level4: { mlCape: 2000, bulkShear0to6kmMs: 25, srh0to1km: 200, stp: 2 },
  level5: { mlCape: 3000, bulkShear0to6kmMs: 30, srh0to1km: 300, stp: 4 },
};

export type SupportResult = 'supported' | 'thin' | 'exceeds' | 'none';

export const supportResultLabels: Record<SupportResult, string> = {
  supported: 'supported',
  thin: 'thin support',
  exceeds: 'environment exceeds level',
  none: 'no soundings inside',
};

export type SupportCheck = SupportCheckResult;

const noIds = { backing: [], failing: [], lacking: [], hazards: [] };

/** Fewer soundings than this inside an area make the support thin, whatever their values. */
export const minimumSoundingsForSupport = 3;

function formatValue(parameter: ThresholdParameter, value: number): string {
  const { unit, digits } = thresholdParameters[parameter];
  const text = value.toLocaleString('en-US', { minimumFractionDigits: digits, maximumFractionDigits: digits });
  return unit ? `${text} ${unit}` : text;
}

function compare(evidence: AreaEvidence, thresholds: Partial<Record<ThresholdParameter, number>>) {
  const met: string[] = [];
  const missed: string[] = [];
  for (const [key, threshold] of Object.entries(thresholds) as [ThresholdParameter, number][]) {
    const median = evidence.stats[key]?.median;
    const name = thresholdParameters[key].label;
    if (median === undefined) missed.push(`no ${name} values inside`);
    else if (median >= threshold) met.push(`median ${name} ${formatValue(key, median)} meets the ${formatValue(key, threshold)}`);
    else missed.push(`median ${name} ${formatValue(key, median)}, below the ${formatValue(key, threshold)}`);
  }
  return { met, missed };
}

/**
 * Compares an area's evidence with the office guidance for its level. Advisory: the result and
 * its reasons in words; it never blocks saving or publishing.
 */
export function checkSupport(evidence: AreaEvidence, levelKey: string, ladder: RiskLadder, guidance: GuidanceThresholds): SupportCheck {
  const index = ladder.findIndex((l) => l.key === levelKey);
  const level = ladder[index];
  const levelName = level?.label ?? levelKey;
  if (evidence.count === 0) return { ...noIds, result: 'none', reasons: ['No soundings valid in the outlook period lie inside this area.'] };
  const thresholds = guidance[levelKey] ?? {};
  const { met, missed } = compare(evidence, thresholds);
  if (missed.length > 0) return { ...noIds, result: 'thin', reasons: missed.map((m) => `${m} expected for ${levelName}`) };
  if (evidence.count < minimumSoundingsForSupport) {
    return { ...noIds, result: 'thin', reasons: [`only ${evidence.count} sounding${evidence.count === 1 ? '' : 's'} inside; ${minimumSoundingsForSupport} or more make the evidence firmer`] };
  }
  const next = ladder[index + 1];
  const nextThresholds = next ? guidance[next.key] : undefined;
  if (next && nextThresholds && Object.keys(nextThresholds).length > 0) {
    const above = compare(evidence, nextThresholds);
    if (above.missed.length === 0) return { ...noIds, result: 'exceeds', reasons: above.met.map((m) => `${m} expected for ${next.label}`) };
  }
  if (met.length === 0) return { ...noIds, result: 'supported', reasons: [`${evidence.count} soundings inside; no guidance thresholds are set for ${levelName}`] };
  return { ...noIds, result: 'supported', reasons: met.map((m) => `${m} expected for ${levelName}`) };
}
