import { useMemo } from 'react';
import type { RiskLadder, SupportGuidance } from '../../../../shared/contracts/office';
import { areaReport, evidencePool, type AreaReport, type ReportArea } from '../../../../shared/evidence/area-report';
import { evidenceSoundingsFromCandidates } from '../../../../shared/evidence/evidence-candidates';
import { useEvidenceCandidates } from '../../../api/outlooks/get-evidence-candidates';
import type { EvidenceSource } from '../../../api/outlooks/outlooks-keys';
import type { AreaShape } from '../../../lib/map/area-editor-map';
import { toAreaGeometry } from '../utils/outlook-document';

/** A vertex being moved: the area and its outline at the latest animation frame. */
export interface LiveEdit {
  areaId: string;
  geometry: AreaShape;
}

interface LiveEvidenceInput {
  outlookId: string;
  /** The saved period (the candidates are loaded for it). */
  savedPeriod: { validFrom: string; validUntil: string };
  /** The document's period (the pool is filtered to it, as the server will after the save). */
  period: { validFrom: string; validUntil: string };
  source: EvidenceSource;
  ladder: RiskLadder;
  /** The office guidance in force, as the server resolves it (GET /api/office). */
  guidance: SupportGuidance;
  /** The area whose evidence is previewed (the selected one), as in the document. */
  area: ReportArea | null;
  /** The outline of the area while one of its vertices moves. */
  live: LiveEdit | null;
}

/**
 * The live preview's report for one area, from the soundings' stored figures, with the shared
 * code the server runs (shared/evidence/area-report.ts): recomputed on each animation frame of a
 * drag. Undefined while the candidates load, or when the period holds too many soundings to send.
 */
export function useLiveEvidence({ outlookId, savedPeriod, period, source, ladder, guidance, area, live }: LiveEvidenceInput) {
  const candidates = useEvidenceCandidates(outlookId, savedPeriod.validFrom, savedPeriod.validUntil);
  const soundings = useMemo(() => (candidates.data && !candidates.data.truncated ? evidenceSoundingsFromCandidates(candidates.data) : null), [candidates.data]);
  const pool = useMemo(
    () => (soundings ? evidencePool(soundings, { validFrom: period.validFrom, validUntil: period.validUntil, source: source === 'all' ? undefined : source }) : null),
    [soundings, period.validFrom, period.validUntil, source],
  );
  const report = useMemo((): AreaReport | undefined => {
    if (!pool || !area) return undefined;
    const shape = live && live.areaId === area.id ? { ...area, geometry: toAreaGeometry(live.geometry) } : area;
    return areaReport(shape, pool, ladder, guidance);
  }, [pool, area, live, ladder, guidance]);
  /** Where each candidate is and its station, for the map shapes and the panel's sounding links. */
  const positions = useMemo(() => new Map((soundings ?? []).map((s) => [s.id, { longitude: s.longitude, latitude: s.latitude, stationId: s.stationId }])), [soundings]);
  return { report, positions, ready: pool !== null, truncated: candidates.data?.truncated ?? false };
}
