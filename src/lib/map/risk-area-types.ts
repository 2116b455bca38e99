import type { AreaGeometry } from '../../../shared/contracts/risk-areas';

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

/** Shapes of the point symbols the read-only map can draw (storm reports use one per hazard). */
export type MarkerShape = 'triangle-down' | 'circle' | 'square' | 'diamond';

/** One point symbol on the read-only map: plain data, no Leaflet objects. */
export interface MapMarker {
  id: string;
  latitude: number;
  longitude: number;
  shape: MarkerShape;
  /** Filled dark for the significant form; white with a dark outline otherwise. */
  filled: boolean;
  title: string;
}
