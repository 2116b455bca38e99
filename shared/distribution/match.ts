import { bbox, booleanIntersects } from '@turf/turf';
import type { AreaGeometry, HazardKind, RiskArea } from '../contracts/outlooks';

export interface MatchResult {
  /** The highest ladder level of any risk area touching the subscriber's areas; null when none does. */
  highestLevelKey: string | null;
  /** Hazards of the touching areas at that highest level. */
  hazards: HazardKind[];
}

type Box = [number, number, number, number];
const boxesOverlap = (a: Box, b: Box) => a[0] <= b[2] && b[0] <= a[2] && a[1] <= b[3] && b[1] <= a[3];

/**
 * The highest level that reaches a subscriber's areas of interest (any overlap counts), found
 * with a bounding-box prefilter before Turf's exact intersection test. When the subscriber
 * follows only some hazards, only areas naming one of them count (thunder-only areas never do).
 */
export function matchAreas(areasOfInterest: readonly AreaGeometry[], riskAreas: readonly Pick<RiskArea, 'levelKey' | 'hazards' | 'geometry'>[], ladderKeys: readonly string[], followedHazards: readonly HazardKind[] = []): MatchResult {
  const interestBoxes = areasOfInterest.map((g) => bbox(g) as Box);
  let best = -1;
  const hazardsAtBest = new Set<HazardKind>();
  for (const area of riskAreas) {
    const rank = ladderKeys.indexOf(area.levelKey);
    if (rank < 0) continue;
    if (followedHazards.length && !area.hazards.some((h) => followedHazards.includes(h.hazard))) continue;
    const box = bbox(area.geometry) as Box;
    const touches = areasOfInterest.some((g, i) => {
      const b = interestBoxes[i];
      return b !== undefined && boxesOverlap(box, b) && booleanIntersects(g, area.geometry);
    });
    if (!touches) continue;
    if (rank > best) {
      best = rank;
      hazardsAtBest.clear();
    }
    if (rank === best) for (const h of area.hazards) hazardsAtBest.add(h.hazard);
  }
  return { highestLevelKey: best >= 0 ? (ladderKeys[best] ?? null) : null, hazards: [...hazardsAtBest] };
}

export type NoticeKind = 'alert' | 'lowered' | 'cleared';

/**
 * What to tell a subscriber about a new issuance, given the level it brings to their areas and
 * what they were told about the issuance it supersedes: an alert at or above their threshold, a
 * "lowered" or "no longer at risk" notice when an amendment takes an earlier alert back, or nothing.
 */
export function decideNotice(ladderKeys: readonly string[], threshold: string, newLevel: string | null, earlierAlertLevel: string | null): NoticeKind | null {
  const rank = (key: string | null) => (key === null ? -1 : ladderKeys.indexOf(key));
  const limit = rank(threshold);
  if (limit < 0) return null;
  if (rank(newLevel) >= limit) return rank(newLevel) === rank(earlierAlertLevel) ? null : 'alert';
  if (earlierAlertLevel === null) return null;
  return newLevel === null ? 'cleared' : 'lowered';
}
