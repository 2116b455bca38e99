import type { GuidanceRule, GuidanceRuleSet, RiskLadder, SupportGuidance } from '../contracts/office';
import type { HazardKind, RiskArea, RuleJudgement, SupportCheckResult } from '../contracts/risk-areas';
import { gatherFigures, type EvidenceSounding, type FigureColumns } from './evidence';
import { DEFAULT_MINIMUM_SHARE_PERCENT, describeMiss, describeRule, hazardFormLabel } from './guidance';

export type SupportResult = 'supported' | 'thin' | 'exceeds' | 'none';

export const supportResultLabels: Record<SupportResult, string> = {
  supported: 'supported',
  thin: 'thin support',
  exceeds: 'environment exceeds level',
  none: 'no soundings inside',
};

export type SupportCheck = SupportCheckResult;
export type HazardFlag = Pick<RiskArea['hazards'][number], 'hazard' | 'significant'>;

/** When no rules are set for a level or hazard form, this many soundings inside make it supported. */
const MINIMUM_COUNT_WITHOUT_RULES = 3;

/** How the soundings inside stood against one rule set. */
interface Tally {
  backing: string[];
  failing: string[];
  lacking: string[];
  /** Per rule: how many failing soundings miss it. */
  missCount: number[];
  /** Per rule: how many lacking soundings have no value for it. */
  lackCount: number[];
}


/**
 * Judges each sounding against every rule at once. A sounding that misses any rule it has a
 * value for fails; one that misses none but lacks a value some rule uses is counted apart as
 * lacking; the others back the rules. Loops rule by rule (one figure per inner loop keeps the
 * property read monomorphic), marking each sounding in a byte array: fast enough to re-run on
 * every vertex move over thousands of soundings.
 */
function tally(inside: readonly EvidenceSounding[], rules: readonly GuidanceRule[], columns: FigureColumns): Tally {
  const count = inside.length;
  const ruleCount = rules.length;
  const missCount = new Array<number>(ruleCount).fill(0);
  const lackCount = new Array<number>(ruleCount).fill(0);
  // 0: backs so far, 1: lacks a value, 2: misses a rule (missing wins over lacking).
  const state = new Uint8Array(count);
  const { values } = columns;
  for (let r = 0; r < ruleCount; r++) {
    const rule = rules[r] as GuidanceRule; // r < ruleCount
    const start = columns.column[rule.figure];
    const limit = rule.value;
    const isMinimum = rule.bound === 'min';
    let misses = 0;
    for (let i = 0; i < count; i++) {
      const value = values[start + i] ?? NaN;
      if (value !== value) {
        // NaN: the sounding has no value for this figure
        if (state[i] === 0) state[i] = 1;
      } else if (isMinimum ? value < limit : value > limit) {
        state[i] = 2;
        misses++;
      }
    }
    missCount[r] = misses;
  }
  const backing: string[] = [];
  const failing: string[] = [];
  const lacking: string[] = [];
  for (let i = 0; i < count; i++) {
    const sounding = inside[i] as EvidenceSounding; // i < count
    if (state[i] === 2) failing.push(sounding.id);
    else if (state[i] === 1) {
      lacking.push(sounding.id);
      for (let r = 0; r < ruleCount; r++) {
        const start = columns.column[(rules[r] as GuidanceRule).figure]; // r < ruleCount
        if (Number.isNaN(values[start + i] ?? NaN)) lackCount[r] = (lackCount[r] ?? 0) + 1;
      }
    } else backing.push(sounding.id);
  }
  return { backing, failing, lacking, missCount, lackCount };
}

type Verdict = { result: 'supported' | 'thin'; why: 'count' | 'share' | 'met'; judged: number; needPercent: number; needCount: number };

/** Supported when enough soundings have the values used and a large enough share of them back the rules. */
function verdict(t: Tally, set: GuidanceRuleSet): Verdict {
  const judged = t.backing.length + t.failing.length;
  const needPercent = set.minimumSharePercent ?? DEFAULT_MINIMUM_SHARE_PERCENT;
  const needCount = set.minimumCount;
  if (judged < needCount) return { result: 'thin', why: 'count', judged, needPercent, needCount };
  if (t.backing.length * 100 < needPercent * judged) return { result: 'thin', why: 'share', judged, needPercent, needCount };
  return { result: 'supported', why: 'met', judged, needPercent, needCount };
}

const plural = (count: number, one: string, many: string) => `${count} ${count === 1 ? one : many}`;

/** "2 fall short (MLCIN stronger than −100 J/kg: 2; MLCAPE below 1,500 J/kg: 1)". */
function countedRules(rules: readonly GuidanceRule[], counts: readonly number[], describe: (rule: GuidanceRule) => string): string {
  return rules
    .map((rule, index) => ({ text: describe(rule), count: counts[index] ?? 0 }))
    .filter((entry) => entry.count > 0)
    .sort((a, b) => b.count - a.count)
    .map((entry) => `${entry.text}: ${entry.count}`)
    .join('; ');
}

/** The first reason: how many back the rules, how many fall short and why, how many lack a value and which. */
function countsSentence(t: Tally, rules: readonly GuidanceRule[], total: number, name: string): string {
  const parts = [`${t.backing.length} of ${plural(total, 'sounding', 'soundings')} ${t.backing.length === 1 ? 'backs' : 'back'} ${name}`];
  if (t.failing.length > 0) parts.push(`${t.failing.length} ${t.failing.length === 1 ? 'falls' : 'fall'} short (${countedRules(rules, t.missCount, describeMiss)})`);
  if (t.lacking.length > 0) {
    const lackedRules = rules.filter((_, index) => (t.lackCount[index] ?? 0) > 0);
    const only = lackedRules.length === 1 ? lackedRules[0] : undefined;
    parts.push(only ? `${t.lacking.length} lack ${describeRule(only)}` : `${t.lacking.length} lack a value the rules use (${countedRules(rules, t.lackCount, describeRule)})`);
  }
  return parts.join('; ');
}

function conclusion(v: Verdict, t: Tally, name: string): string {
  const percent = v.judged === 0 ? 0 : Math.round((t.backing.length * 100) / v.judged);
  switch (v.why) {
    case 'count':
      return `only ${plural(v.judged, 'sounding has', 'soundings have')} every value ${name}'s rules use; ${v.needCount} needed: thin support`;
    case 'share':
      return `${percent}% of the ${plural(v.judged, 'sounding', 'soundings')} with values back ${name}; ${v.needPercent}% needed: thin support`;
    case 'met':
      return `${percent}% of the ${plural(v.judged, 'sounding', 'soundings')} with values back ${name} (${v.needPercent}% needed)`;
  }
}

interface Judged {
  judgement: RuleJudgement;
  verdict: Verdict | null;
}

/** One rule set's judgement of the soundings inside; `set` undefined: no rules are set for it. */
function judge(inside: readonly EvidenceSounding[], columns: FigureColumns, set: GuidanceRuleSet | undefined, name: string): Judged {
  if (inside.length === 0) {
    return { judgement: { result: 'none', reasons: ['No soundings valid in the outlook period lie inside this area.'], backing: [], failing: [], lacking: [] }, verdict: null };
  }
  if (!set || set.rules.length === 0) {
    const needCount = set?.minimumCount ?? MINIMUM_COUNT_WITHOUT_RULES;
    const enough = inside.length >= needCount;
    const reason = `No rules are set for ${name}: ${plural(inside.length, 'sounding', 'soundings')} inside${enough ? '' : `; ${needCount} needed: thin support`}`;
    return { judgement: { result: enough ? 'supported' : 'thin', reasons: [reason], backing: inside.map((s) => s.id), failing: [], lacking: [] }, verdict: null };
  }
  const t = tally(inside, set.rules, columns);
  const v = verdict(t, set);
  return {
    judgement: { result: v.result, reasons: [countsSentence(t, set.rules, inside.length, name), conclusion(v, t, name)], backing: t.backing, failing: t.failing, lacking: t.lacking },
    verdict: v,
  };
}

/** Whether a stronger rule set (the next level, the significant form) is supported too, with its reason. */
function exceeded(inside: readonly EvidenceSounding[], columns: FigureColumns, base: Judged, stronger: GuidanceRuleSet | undefined, strongerName: string, baseName: string): Judged {
  if (base.judgement.result !== 'supported' || !stronger || stronger.rules.length === 0) return base;
  const t = tally(inside, stronger.rules, columns);
  if (verdict(t, stronger).result !== 'supported') return base;
  const reason = `${t.backing.length} of ${plural(inside.length, 'sounding', 'soundings')} also ${t.backing.length === 1 ? 'backs' : 'back'} ${strongerName}: the environment exceeds ${baseName}`;
  return { ...base, judgement: { ...base.judgement, result: 'exceeds', reasons: [...base.judgement.reasons, reason] } };
}

/**
 * The support check of one area: each sounding inside is judged against every rule of the
 * area's level at once (it backs the level, falls short of a rule, or lacks a value a rule
 * uses); the area is supported when enough soundings have the values used and a large enough
 * share of them back the level, and the environment exceeds the level when the next level is
 * supported too. Each hazard flag is judged the same way against its hazard's rules (its
 * ordinary or significant form). Advisory: it never blocks saving or publishing. Pure and
 * allocation-light: runs on the server and in the browser while a vertex moves.
 */
export function checkSupport(input: { inside: EvidenceSounding[]; levelKey: string; hazards: HazardFlag[]; ladder: RiskLadder; guidance: SupportGuidance; columns?: FigureColumns }): SupportCheck {
  const { inside, levelKey, hazards, ladder, guidance } = input;
  const columns = input.columns ?? gatherFigures(inside);
  const index = ladder.findIndex((l) => l.key === levelKey);
  const levelName = ladder[index]?.label ?? levelKey;
  const next = index >= 0 ? ladder[index + 1] : undefined;
  let level = judge(inside, columns, guidance.levels[levelKey], levelName);
  if (next) level = exceeded(inside, columns, level, guidance.levels[next.key], next.label, levelName);
  return {
    ...level.judgement,
    hazards: hazards.map(({ hazard, significant }) => {
      const forms = guidance.hazards[hazard as HazardKind];
      const name = hazardFormLabel(hazard, significant);
      let judged = judge(inside, columns, significant ? forms?.significant : forms?.ordinary, name);
      if (!significant) judged = exceeded(inside, columns, judged, forms?.significant, hazardFormLabel(hazard, true), name);
      return { ...judged.judgement, hazard, significant };
    }),
  };
}
