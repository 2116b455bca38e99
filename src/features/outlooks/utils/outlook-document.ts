import type { AreaGeometry, HazardKind, Outlook, RiskAreaInput, SaveOutlookInput } from '../../../../shared/contracts/outlooks';
import { hazardKinds } from '../../../../shared/contracts/outlooks';

/** One risk area in the editor. Its id is a UUID kept stable across saves (sent to the server). */
export interface DraftArea {
  id: string;
  levelKey: string;
  hazards: { hazard: HazardKind; significant: boolean }[];
  geometry: AreaGeometry;
  label: string;
}

/** The editable outlook document: what autosave sends (with the version) and what undo steps through. */
export interface OutlookDocument {
  headline: string;
  discussion: string;
  hazardNotes: Partial<Record<HazardKind, string>>;
  validFrom: string;
  validUntil: string;
  areas: DraftArea[];
}

const isHazardKind = (value: string): value is HazardKind => (hazardKinds as readonly string[]).includes(value);

/** The document as loaded from (or returned by) the server, areas in their saved order. */
export function documentFromOutlook(outlook: Pick<Outlook, 'headline' | 'discussion' | 'hazardNotes' | 'validFrom' | 'validUntil' | 'areas'>): OutlookDocument {
  const hazardNotes: Partial<Record<HazardKind, string>> = {};
  for (const [key, value] of Object.entries(outlook.hazardNotes)) if (isHazardKind(key)) hazardNotes[key] = value;
  return {
    headline: outlook.headline,
    discussion: outlook.discussion,
    hazardNotes,
    validFrom: new Date(outlook.validFrom).toISOString(),
    validUntil: new Date(outlook.validUntil).toISOString(),
    areas: [...outlook.areas]
      .sort((a, b) => a.sortOrder - b.sortOrder)
      .map((area) => ({ id: area.id, levelKey: area.levelKey, hazards: area.hazards.map((h) => ({ hazard: h.hazard, significant: h.significant })), geometry: area.geometry, label: area.label })),
  };
}

/** The PUT body: the whole document with the version it was loaded at. */
export function saveInputFrom(document: OutlookDocument, version: number): SaveOutlookInput {
  const hazardNotes: Partial<Record<HazardKind, string>> = {};
  for (const kind of hazardKinds) {
    const note = document.hazardNotes[kind];
    if (note !== undefined && note.trim() !== '') hazardNotes[kind] = note;
  }
  return {
    version,
    headline: document.headline.trim(),
    discussion: document.discussion,
    hazardNotes,
    validFrom: document.validFrom,
    validUntil: document.validUntil,
    areas: document.areas.map((area): RiskAreaInput => ({ id: area.id, levelKey: area.levelKey, hazards: area.hazards, geometry: area.geometry, label: area.label.trim() })),
  };
}

/** Structural equality (documents are small; JSON order is stable because we build them). */
export function sameDocument(a: OutlookDocument, b: OutlookDocument): boolean {
  return a === b || JSON.stringify(a) === JSON.stringify(b);
}

/** A new area with a client-made UUID, so its id survives the save. */
export function newArea(geometry: AreaGeometry, levelKey: string, id: string = crypto.randomUUID()): DraftArea {
  return { id, levelKey, hazards: [], geometry, label: '' };
}

/** Replaces one area (by id) with a changed copy. */
export function updateArea(document: OutlookDocument, areaId: string, change: Partial<Omit<DraftArea, 'id'>>): OutlookDocument {
  return { ...document, areas: document.areas.map((area) => (area.id === areaId ? { ...area, ...change } : area)) };
}

export function removeArea(document: OutlookDocument, areaId: string): OutlookDocument {
  return { ...document, areas: document.areas.filter((area) => area.id !== areaId) };
}

/** Areas in drawing order: lowest ladder level first (unknown levels first of all), then as listed. */
export function areasInLadderOrder(areas: readonly DraftArea[], ladderKeys: readonly string[]): DraftArea[] {
  return areas
    .map((area, index) => ({ area, index, rank: ladderKeys.indexOf(area.levelKey) }))
    .sort((a, b) => a.rank - b.rank || a.index - b.index)
    .map((entry) => entry.area);
}

type Position = number[];
const pair = (p: Position): [number, number] => [p[0] ?? 0, p[1] ?? 0];

/** A map geometry (GeoJSON positions of any length) as an area geometry ([longitude, latitude] pairs). */
export function toAreaGeometry(shape: { type: 'Polygon'; coordinates: Position[][] } | { type: 'MultiPolygon'; coordinates: Position[][][] }): AreaGeometry {
  return shape.type === 'Polygon' ? { type: 'Polygon', coordinates: shape.coordinates.map((ring) => ring.map(pair)) } : { type: 'MultiPolygon', coordinates: shape.coordinates.map((polygon) => polygon.map((ring) => ring.map(pair))) };
}
