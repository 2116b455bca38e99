import type { GeometryCollection, MultiLineString, Topology } from 'topojson-specification';
import { meshArcs, quantize } from 'topojson-client';
import { presimplify, quantile, simplify } from 'topojson-simplify';

/**
 * The offline base map's boundaries, prepared once (at build time, by `npm run -s boundaries`)
 * from us-atlas' counties-10m topology: each level keeps the nation outline, the state borders
 * and the county borders as three meshes (every shared border once), simplified by triangle
 * area (Visvalingam, through topojson-simplify) and quantised, so the browser only turns arcs
 * into lines. The overview level serves the public pages and zoomed-out maps; the detail level
 * loads only when a map is zoomed in.
 */
export interface BoundaryLevel {
  name: 'overview' | 'detail';
  /** Share of the source's points kept (by their simplification weight). */
  keepShare: number;
  /** Quantisation: grid cells across the topology's box. */
  quantization: number;
  /** The Leaflet zoom from which this level is drawn. */
  minZoom: number;
}

export const BOUNDARY_LEVELS: readonly BoundaryLevel[] = [
  { name: 'overview', keepShare: 0.1, quantization: 1e4, minZoom: 0 },
  { name: 'detail', keepShare: 0.5, quantization: 3e4, minZoom: 7 },
];

export type BoundaryTopology = Topology<{ nation: MultiLineString; states: MultiLineString; counties: MultiLineString }>;

type UsAtlasTopology = Topology<{ counties: GeometryCollection; states: GeometryCollection; nation: GeometryCollection }>;

/** Builds one level from the us-atlas counties topology (already quantised by us-atlas). */
export function boundaryLevel(source: UsAtlasTopology, level: BoundaryLevel): BoundaryTopology {
  const weighted = presimplify(source);
  const simplified = simplify(weighted, quantile(weighted, level.keepShare)) as UsAtlasTopology;
  // Drop the weights presimplify added as third coordinates: the browser needs x and y only.
  const arcs = simplified.arcs.map((arc) => arc.map((point) => [point[0] ?? 0, point[1] ?? 0] as [number, number]));
  const flat: UsAtlasTopology = { ...simplified, arcs };
  const stateOf = (id: string | number | undefined) => id?.toString().slice(0, 2);
  const topology: BoundaryTopology = {
    type: 'Topology',
    ...(flat.bbox ? { bbox: flat.bbox } : {}),
    ...(flat.transform ? { transform: flat.transform } : {}),
    arcs,
    objects: {
      nation: meshArcs(flat, flat.objects.nation),
      // Shared borders only: each line once, no coastline duplicates of the nation outline.
      states: meshArcs(flat, flat.objects.states, (a, b) => a !== b),
      counties: meshArcs(flat, flat.objects.counties, (a, b) => a !== b && stateOf(a.id) === stateOf(b.id)),
    },
  };
  return quantize(topology, level.quantization) as BoundaryTopology;
}
