import type { AreaGeometry } from '../../../shared/contracts/outlooks';

/** One risk area as the read-only map draws it: plain data, no Leaflet objects. */
export interface MapArea {
  id: string;
  geometry: AreaGeometry;
  colour: string;
  /** Level number and word, e.g. "Level 2 · Scattered" — shown on hover and in the legend. */
  title: string;
  /** Hazards in words; a significant hazard draws the bold inner outline. */
  detail: string;
  significant: boolean;
}

export interface MapBounds {
  west: number;
  south: number;
  east: number;
  north: number;
}
