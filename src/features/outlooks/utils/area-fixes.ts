import type { Region } from '../../../../shared/contracts/office';
import { clipToRegion, unionOf, unkink, type AreaCheck } from '../../../../shared/geometry/area-checks';
import { newArea, removeArea, updateArea, type OutlookDocument } from './outlook-document';

export type AreaFix = NonNullable<AreaCheck['fix']>;

export const fixLabels: Record<AreaFix, string> = {
  unkink: 'Split at the crossing',
  'clip-to-region': 'Clip to the region',
  'expand-lower-level': 'Expand the lower level',
};

/**
 * Applies a geometry check's one-click fix to the document (a new document; the caller records
 * it as one undo step). Returns the document unchanged when the fix does not apply.
 * - unkink: split a self-crossing outline at its crossings (shared `unkink`).
 * - clip-to-region: keep the part inside the office region; an area wholly outside is removed.
 * - expand-lower-level: grow the level below to contain this area (union), merging that level's
 *   areas into the first of them, or adding a lower-level area when there is none.
 */
export function applyAreaFix(document: OutlookDocument, areaId: string, fix: AreaFix, ladderKeys: readonly string[], region: Region, makeId: () => string = () => crypto.randomUUID()): OutlookDocument {
  const area = document.areas.find((a) => a.id === areaId);
  if (!area) return document;
  switch (fix) {
    case 'unkink':
      return updateArea(document, areaId, { geometry: unkink(area.geometry) });
    case 'clip-to-region': {
      const clipped = clipToRegion(area.geometry, region);
      return clipped ? updateArea(document, areaId, { geometry: clipped }) : removeArea(document, areaId);
    }
    case 'expand-lower-level': {
      const index = ladderKeys.indexOf(area.levelKey);
      const lowerKey = index > 0 ? ladderKeys[index - 1] : undefined;
      if (lowerKey === undefined) return document;
      const lower = document.areas.filter((a) => a.levelKey === lowerKey);
      const first = lower[0];
      if (!first) {
        const added = newArea(area.geometry, lowerKey, makeId());
        const at = document.areas.findIndex((a) => a.id === areaId);
        const areas = [...document.areas];
        areas.splice(at, 0, added);
        return { ...document, areas };
      }
      const merged = unionOf([...lower.map((a) => a.geometry), area.geometry]);
      if (!merged) return document;
      const others = new Set(lower.slice(1).map((a) => a.id));
      return { ...document, areas: document.areas.filter((a) => !others.has(a.id)).map((a) => (a.id === first.id ? { ...a, geometry: merged } : a)) };
    }
  }
}
