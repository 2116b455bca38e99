import { createHash } from 'node:crypto';
import type { AreaGeometry, HazardKind, RiskArea } from '../../shared/contracts/outlooks';
import { decideNotice, matchAreas, type NoticeKind } from '../../shared/distribution/match';
import { unionOf } from '../../shared/geometry/area-checks';

export interface SubscriberToMatch {
  subscriptionId: string;
  geometries: AreaGeometry[];
  hazards: HazardKind[];
  alertThreshold: string;
  /** The level they were alerted at for the issuance this one supersedes (null: not alerted). */
  earlierLevelKey: string | null;
}

export interface MatchSubscribersInput {
  riskAreas: Pick<RiskArea, 'levelKey' | 'hazards' | 'geometry'>[];
  ladderKeys: string[];
  subscribers: SubscriberToMatch[];
}

export interface SubscriberNotice {
  subscriptionId: string;
  kind: NoticeKind;
  highestLevelKey: string | null;
  hazards: HazardKind[];
  /** Names the subscriber's set of areas; equal sets share one alert map. */
  imageVariant: string;
}

export interface MatchSubscribersOutput {
  notices: SubscriberNotice[];
  /** The outline drawn on each alert map, once per variant. */
  highlights: Record<string, AreaGeometry | null>;
}

/** A stable name for a set of areas (order does not matter). */
export function areaSetVariant(geometries: readonly AreaGeometry[]): string {
  const parts = geometries.map((g) => JSON.stringify(g)).sort();
  return `areas:${createHash('sha256').update(parts.join('\n')).digest('base64url').slice(0, 32)}`;
}

/**
 * Decides, for a page of subscribers, who hears about an issuance and what (alert, lowered,
 * cleared), and which alert map each needs. Pure: runs in the geometry worker pool.
 */
export function matchSubscribers(input: MatchSubscribersInput): MatchSubscribersOutput {
  const notices: SubscriberNotice[] = [];
  const highlights: Record<string, AreaGeometry | null> = {};
  for (const sub of input.subscribers) {
    if (sub.geometries.length === 0) continue;
    const match = matchAreas(sub.geometries, input.riskAreas, input.ladderKeys, sub.hazards);
    const kind = decideNotice(input.ladderKeys, sub.alertThreshold, match.highestLevelKey, sub.earlierLevelKey);
    if (!kind) continue;
    const imageVariant = areaSetVariant(sub.geometries);
    if (!(imageVariant in highlights)) highlights[imageVariant] = unionOf(sub.geometries);
    notices.push({ subscriptionId: sub.subscriptionId, kind, highestLevelKey: match.highestLevelKey, hazards: match.hazards, imageVariant });
  }
  return { notices, highlights };
}
