import type { GuidanceRuleSet, SupportGuidance, SupportGuidanceInput } from '../../../../shared/contracts/office';
import { hazardKinds, type HazardKind } from '../../../../shared/contracts/risk-areas';
import type { Units } from '../../../../shared/contracts/users';
import { guidanceFigures } from '../../../../shared/evidence/guidance';
import type { KeyFigureKey } from '../../../../shared/sounding/key-figures';
import {
  CELSIUS_ZERO_K,
  heightUnitLabel,
  kelvinToFahrenheit,
  metresPerSecondToKnots,
  metresPerSecondToMph,
  metresToFeet,
  METRES_PER_FOOT,
  METRES_PER_SECOND_PER_KNOT,
  METRES_PER_SECOND_PER_MPH,
  speedUnitLabel,
  temperatureUnitLabel,
} from '../../../utils/units';

/**
 * The guidance as the editor holds it. Values are typed in the person's display units; the SI
 * value read from the server is kept until the text is edited, so saving without a change
 * never shifts a value by a rounding step (e.g. 20 m/s shown as 38.9 kt).
 */
export interface RuleDraft {
  /** Stable React key. */
  key: string;
  figure: KeyFigureKey;
  bound: 'min' | 'max';
  text: string;
  /** The stored SI value while `text` is unchanged; null once edited. */
  storedSi: number | null;
}

export interface RuleSetDraft {
  rules: RuleDraft[];
  /** Percent; '' = the default (at least half). */
  shareText: string;
  countText: string;
}

export type HazardForm = 'ordinary' | 'significant';
export type HazardSetKey = `${HazardKind}.${HazardForm}`;

export interface GuidanceDraft {
  levels: Record<string, RuleSetDraft>;
  hazards: Partial<Record<HazardSetKey, RuleSetDraft>>;
}

export const hazardSetKeys: HazardSetKey[] = hazardKinds.flatMap((hazard) => [`${hazard}.ordinary` as const, `${hazard}.significant` as const]);

/** The unit a figure is typed in, given the person's display units. */
export function displayUnit(figure: KeyFigureKey, units: Units): string {
  const { quantity, unit } = guidanceFigures[figure];
  switch (quantity) {
    case 'height':
      return heightUnitLabel[units.height];
    case 'speed':
      return speedUnitLabel[units.speed];
    case 'temperature':
      return temperatureUnitLabel[units.temperature];
    case 'plain':
      return unit;
  }
}

/** SI value → display value (temperatures are in °C in the figures, not K). */
export function toDisplay(figure: KeyFigureKey, si: number, units: Units): number {
  switch (guidanceFigures[figure].quantity) {
    case 'height':
      return units.height === 'm' ? si : metresToFeet(si);
    case 'speed':
      return units.speed === 'ms' ? si : units.speed === 'kt' ? metresPerSecondToKnots(si) : metresPerSecondToMph(si);
    case 'temperature':
      return units.temperature === 'C' ? si : kelvinToFahrenheit(si + CELSIUS_ZERO_K);
    case 'plain':
      return si;
  }
}

/** Display value → SI value. */
export function fromDisplay(figure: KeyFigureKey, display: number, units: Units): number {
  switch (guidanceFigures[figure].quantity) {
    case 'height':
      return units.height === 'm' ? display : display * METRES_PER_FOOT;
    case 'speed':
      return units.speed === 'ms' ? display : units.speed === 'kt' ? display * METRES_PER_SECOND_PER_KNOT : display * METRES_PER_SECOND_PER_MPH;
    case 'temperature':
      return units.temperature === 'C' ? display : (display - 32) / 1.8;
    case 'plain':
      return display;
  }
}

/** A display value as editable text: at most two decimals, no trailing zeros. */
function displayText(value: number): string {
  return String(Math.round(value * 100) / 100);
}

let nextKey = 0;
const newKey = () => `rule-${++nextKey}`;

function setToDraft(set: GuidanceRuleSet | undefined, units: Units): RuleSetDraft {
  return {
    rules: (set?.rules ?? []).map((rule) => ({ key: newKey(), figure: rule.figure, bound: rule.bound, text: displayText(toDisplay(rule.figure, rule.value, units)), storedSi: rule.value })),
    shareText: set?.minimumSharePercent == null ? '' : String(set.minimumSharePercent),
    countText: String(set?.minimumCount ?? 3),
  };
}

export function guidanceToDraft(guidance: SupportGuidance, units: Units): GuidanceDraft {
  const hazards: GuidanceDraft['hazards'] = {};
  for (const hazard of hazardKinds) {
    hazards[`${hazard}.ordinary`] = setToDraft(guidance.hazards[hazard]?.ordinary, units);
    hazards[`${hazard}.significant`] = setToDraft(guidance.hazards[hazard]?.significant, units);
  }
  return { levels: Object.fromEntries(Object.entries(guidance.levels).map(([key, set]) => [key, setToDraft(set, units)])), hazards };
}

export function emptyRuleSetDraft(): RuleSetDraft {
  return { rules: [], shareText: '', countText: '3' };
}

export function newRuleDraft(figure: KeyFigureKey): RuleDraft {
  return { key: newKey(), figure, bound: 'min', text: '', storedSi: null };
}

/** Typed text → number; '' and non-numbers become NaN so the shared schema names the field. */
function number(text: string): number {
  const trimmed = text.trim().replace('\u2212', '-');
  return trimmed === '' ? Number.NaN : Number(trimmed);
}

function draftToSet(draft: RuleSetDraft, units: Units): NonNullable<SupportGuidanceInput['levels']>[string] {
  return {
    rules: draft.rules.map((rule) => ({ figure: rule.figure, bound: rule.bound, value: rule.storedSi ?? fromDisplay(rule.figure, number(rule.text), units) })),
    minimumSharePercent: draft.shareText.trim() === '' ? null : number(draft.shareText),
    minimumCount: number(draft.countText),
  };
}

/**
 * Editor state → the guidance payload (SI) for the levels still on the ladder; hazard forms
 * with no rules are left out. Not validated here: the shared schema does that.
 */
export function draftToGuidance(draft: GuidanceDraft, levelKeys: readonly string[], units: Units): SupportGuidanceInput {
  const levels: SupportGuidanceInput['levels'] = {};
  for (const key of levelKeys) levels[key] = draftToSet(draft.levels[key] ?? emptyRuleSetDraft(), units);
  const hazards: NonNullable<SupportGuidanceInput['hazards']> = {};
  for (const setKey of hazardSetKeys) {
    const set = draft.hazards[setKey];
    if (!set || set.rules.length === 0) continue;
    const [hazard, form] = setKey.split('.') as [HazardKind, HazardForm];
    hazards[hazard] = { ...hazards[hazard], [form]: draftToSet(set, units) };
  }
  return { levels, hazards };
}

/** The error path of a rule set in the office settings payload. */
export function setPath(kind: 'level' | 'hazard', key: string): string {
  return kind === 'level' ? `guidance.levels.${key}` : `guidance.hazards.${key}`;
}
