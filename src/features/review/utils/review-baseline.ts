import type { Outlook } from '../../../../shared/contracts/outlooks';
import type { Issuance } from '../../../../shared/contracts/issuances';
import type { HazardKind } from '../../../../shared/contracts/outlooks';
import type { DiffArea } from './outlook-diff';

export type BaselineArea = DiffArea & { hazards: { hazard: HazardKind; significant: boolean }[] };

export interface Baseline {
  /** "issuance 2027-0142" or "revision 3" — used in sentences. */
  name: string;
  kind: 'issuance' | 'revision' | 'none';
  issuanceNumber?: string;
  areas: BaselineArea[];
}

interface RevisionLike {
  revisionNumber: number;
  snapshot: { areas: { id?: string | undefined; levelKey: string; geometry: DiffArea['geometry']; label?: string | undefined; hazards: BaselineArea['hazards'] }[] };
}

/**
 * What the draft is compared with: the current issuance for the same day when there is one,
 * otherwise the revision before the newest, otherwise nothing (a first draft).
 */
export function chooseBaseline(outlook: Pick<Outlook, 'day'>, current: readonly Pick<Issuance, 'day' | 'number' | 'snapshot'>[], previousRevision: RevisionLike | null): Baseline {
  const sameDay = current.find((i) => i.day === outlook.day);
  if (sameDay) {
    return { name: `issuance ${sameDay.number}`, kind: 'issuance', issuanceNumber: sameDay.number, areas: sameDay.snapshot.areas.map((a) => ({ id: a.id, levelKey: a.levelKey, geometry: a.geometry, label: a.label, hazards: a.hazards })) };
  }
  if (previousRevision) {
    return {
      name: `revision ${previousRevision.revisionNumber}`,
      kind: 'revision',
      areas: previousRevision.snapshot.areas.map((a, i) => ({ id: a.id ?? `revision-area-${i}`, levelKey: a.levelKey, geometry: a.geometry, label: a.label, hazards: a.hazards })),
    };
  }
  return { name: 'nothing', kind: 'none', areas: [] };
}
