import type { Region } from '../../shared/contracts/office';
import type { Outlook } from '../../shared/contracts/outlooks';
import { areaEvidence, soundingsInPeriod, type AreaEvidence, type EvidenceSounding } from '../../shared/evidence/evidence';
import { checkSupport, type SupportCheck } from '../../shared/evidence/support-check';
import type { SupportGuidance } from '../../shared/contracts/office';
import { checkAreas, type AreaCheck } from '../../shared/geometry/area-checks';

export interface AreaEvidenceReport {
  areaId: string;
  levelKey: string;
  evidence: AreaEvidence;
  support: SupportCheck;
  checks: AreaCheck[];
}

export interface EvidenceReportInput {
  outlook: Pick<Outlook, 'areas' | 'validFrom' | 'validUntil'>;
  candidates: EvidenceSounding[];
  ladder: { key: string; label: string; colour: string; meaning: string }[];
  guidance: SupportGuidance;
  region: Region;
  source?: 'observed' | 'model' | undefined;
}

/**
 * The evidence panel and support check of every area of an outlook, from the soundings valid in
 * its period (modified what-if soundings are left out: they are not observations or forecasts),
 * with the geometry checks of the areas. Pure: runs in the geometry worker pool.
 */
export function buildEvidenceReport({ outlook, candidates, ladder, guidance, region, source }: EvidenceReportInput): AreaEvidenceReport[] {
  const pool = soundingsInPeriod(
    candidates.filter((s) => !s.modified),
    outlook.validFrom,
    outlook.validUntil,
    source,
  );
  const checks = checkAreas(
    outlook.areas,
    ladder.map((l) => l.key),
    region,
  );
  return outlook.areas.map((area) => {
    const evidence = areaEvidence(area.id, area.geometry, pool);
    const inside = new Set(evidence.soundingIds);
    const support = checkSupport({ inside: pool.filter((s) => inside.has(s.id)), levelKey: area.levelKey, hazards: area.hazards, ladder, guidance });
    return { areaId: area.id, levelKey: area.levelKey, evidence, support, checks: checks[area.id] ?? [] };
  });
}
