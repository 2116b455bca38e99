import type { Region, RiskLadder, SupportGuidance } from '../../shared/contracts/office';
import type { Outlook } from '../../shared/contracts/outlooks';
import { areaReport, evidencePool, type AreaReport, type EvidencePool } from '../../shared/evidence/area-report';
import type { EvidenceSounding } from '../../shared/evidence/evidence';
import { checkAreas, type AreaCheck } from '../../shared/geometry/area-checks';

export interface AreaEvidenceReport extends AreaReport {
  checks: AreaCheck[];
}

export interface EvidenceReportInput {
  outlook: Pick<Outlook, 'areas' | 'validFrom' | 'validUntil'>;
  candidates: EvidenceSounding[];
  ladder: RiskLadder;
  guidance: SupportGuidance;
  region: Region;
  source?: 'observed' | 'model' | undefined;
  /** Pools already made for this period (e.g. a model run's grid soundings), read beside the candidates. */
  pools?: readonly EvidencePool[];
}

/**
 * The evidence panel and support check of every area of an outlook, from the soundings valid in
 * its period (shared/evidence/area-report.ts, the same code the workspace's live preview runs),
 * with the geometry checks of the areas. Pure: runs in the geometry worker pool.
 */
export function buildEvidenceReport({ outlook, candidates, ladder, guidance, region, source, pools = [] }: EvidenceReportInput): AreaEvidenceReport[] {
  const pool = [evidencePool(candidates, { validFrom: outlook.validFrom, validUntil: outlook.validUntil, source }), ...pools];
  const checks = checkAreas(
    outlook.areas,
    ladder.map((l) => l.key),
    region,
  );
  return outlook.areas.map((area) => ({ ...areaReport(area, pool, ladder, guidance), checks: checks[area.id] ?? [] }));
}
