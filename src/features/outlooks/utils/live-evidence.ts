import type { AreaReport, SoundingJudgement } from '../../../../shared/evidence/area-report';

/** Which answer the evidence panel shows for an area: the server's record or the live preview. */
export type EvidenceView<T> = { kind: 'record'; report: T } | { kind: 'preview'; report: AreaReport } | { kind: 'stale'; report: T } | { kind: 'none' };

export interface EvidenceViewFacts<T> {
  /** The server's report for this area, if it has one. */
  record: T | undefined;
  /** The browser's report for the area as it is now (undefined while the candidates load). */
  live: AreaReport | undefined;
  /** True while the document differs from the saved one, a vertex is moving, or the server's answer is being fetched. */
  pending: boolean;
}

/**
 * The server's report is the record: shown whenever it reflects the saved document. While the
 * document is ahead of it (a moving vertex, an unsaved change, a save in flight), the live
 * preview stands in; without one, the last record is shown as stale.
 */
export function evidenceView<T>({ record, live, pending }: EvidenceViewFacts<T>): EvidenceView<T> {
  if (!pending && record) return { kind: 'record', report: record };
  if (live) return { kind: 'preview', report: live };
  if (record) return { kind: 'stale', report: record };
  return { kind: 'none' };
}

/** Counts of the soundings inside an area by judgement, for the map legend. */
export function judgementCounts(judgements: ReadonlyMap<string, SoundingJudgement>): Record<SoundingJudgement, number> {
  const counts: Record<SoundingJudgement, number> = { backs: 0, fails: 0, lacks: 0, inside: 0 };
  for (const judgement of judgements.values()) counts[judgement]++;
  return counts;
}
