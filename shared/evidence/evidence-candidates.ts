import type { EvidenceCandidate, EvidenceCandidates } from '../contracts/evidence-candidates';
import { emptyKeyFigures, keyFigureKeys, type KeyFigureKey } from '../sounding/key-figures';
import type { EvidenceSounding } from './evidence';

/**
 * Most soundings one outlook period may send to the browser for the live preview (about 150
 * bytes each, so ~1.5 MB). Above it the workspace shows only the server's evidence.
 */
export const MAX_LIVE_EVIDENCE_CANDIDATES = 10_000;

/** One evidence sounding in the compact form of the evidence-candidates payload (modified soundings are never sent). */
export function toEvidenceCandidate(sounding: EvidenceSounding): EvidenceCandidate {
  return {
    id: sounding.id,
    stationId: sounding.stationId,
    longitude: sounding.longitude,
    latitude: sounding.latitude,
    validTime: sounding.validTime,
    source: sounding.source,
    runId: sounding.runId ?? null,
    figures: keyFigureKeys.map((key) => sounding.figures[key]),
    flagCount: sounding.figures.flagCount,
  };
}

const isKeyFigureKey = (key: string): key is KeyFigureKey => (keyFigureKeys as readonly string[]).includes(key);

/** The evidence soundings of a payload, figures read back by name (a name this build does not know is skipped). */
export function evidenceSoundingsFromCandidates(payload: Pick<EvidenceCandidates, 'figureKeys' | 'soundings'>): EvidenceSounding[] {
  const keys = payload.figureKeys.map((key) => (isKeyFigureKey(key) ? key : null));
  return payload.soundings.map((candidate) => {
    const figures = emptyKeyFigures();
    keys.forEach((key, index) => {
      if (key !== null) figures[key] = candidate.figures[index] ?? null;
    });
    figures.flagCount = candidate.flagCount;
    return {
      id: candidate.id,
      stationId: candidate.stationId,
      latitude: candidate.latitude,
      longitude: candidate.longitude,
      validTime: candidate.validTime,
      source: candidate.source,
      modified: false,
      runId: candidate.runId,
      figures,
    };
  });
}
