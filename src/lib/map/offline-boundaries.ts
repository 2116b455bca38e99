import type { Feature, MultiLineString, Position } from 'geojson';
import type { MultiLineString as TopoMultiLineString, Topology } from 'topojson-specification';

/**
 * The offline base map: state and county boundaries from us-atlas (Census cartographic boundary
 * files, 1:10,000,000), prepared at build time as quantised, simplified TopoJSON levels
 * (see boundary-levels.ts) and served as static files, so the map needs no tile server.
 */
export interface OfflineBoundaries {
  nation: Feature<MultiLineString>;
  states: Feature<MultiLineString>;
  counties: Feature<MultiLineString>;
}

export type BoundaryLevelName = 'overview' | 'detail';

/** Where each level is served (public/boundaries/, written by `npm run -s boundaries`). */
export const boundaryLevelUrls: Record<BoundaryLevelName, string> = {
  overview: '/boundaries/overview.json',
  detail: '/boundaries/detail.json',
};

/** The zoom from which a map draws the detail level. */
export const DETAIL_MIN_ZOOM = 7;

type BoundaryTopology = Topology<{ nation: TopoMultiLineString; states: TopoMultiLineString; counties: TopoMultiLineString }>;

function isMultiLineString(value: unknown): value is TopoMultiLineString {
  return typeof value === 'object' && value !== null && 'type' in value && value.type === 'MultiLineString' && 'arcs' in value && Array.isArray(value.arcs);
}

/** Checks the shape we rely on before handing the file to topojson-client. */
export function isBoundaryTopology(value: unknown): value is BoundaryTopology {
  if (typeof value !== 'object' || value === null) return false;
  if (!('type' in value) || value.type !== 'Topology' || !('arcs' in value) || !Array.isArray(value.arcs)) return false;
  if (!('objects' in value) || typeof value.objects !== 'object' || value.objects === null) return false;
  const objects = value.objects;
  return 'nation' in objects && isMultiLineString(objects.nation) && 'states' in objects && isMultiLineString(objects.states) && 'counties' in objects && isMultiLineString(objects.counties);
}

/**
 * Decodes the quantised, delta-encoded arcs of a topology into longitude/latitude (TopoJSON
 * specification §2.1.2 and §2.2: positions are running sums, then scaled and translated).
 * A few lines here keep topojson-client out of the public pages' first load.
 */
function decodedArcs(topology: BoundaryTopology): Position[][] {
  const scale = topology.transform?.scale ?? [1, 1];
  const translate = topology.transform?.translate ?? [0, 0];
  return topology.arcs.map((arc) => {
    let x = 0;
    let y = 0;
    return arc.map(([dx = 0, dy = 0]) => {
      x = topology.transform ? x + dx : dx;
      y = topology.transform ? y + dy : dy;
      return [x * scale[0] + translate[0], y * scale[1] + translate[1]];
    });
  });
}

/** Turns a boundary level's arcs into the three line features (a negative index reverses the arc, §2.1.4). */
export function boundariesOf(topology: BoundaryTopology): OfflineBoundaries {
  const arcs = decodedArcs(topology);
  const arcAt = (index: number): Position[] => (index >= 0 ? (arcs[index] ?? []) : [...(arcs[~index] ?? [])].reverse());
  const lines = (object: TopoMultiLineString): Feature<MultiLineString> => ({
    type: 'Feature',
    properties: {},
    geometry: { type: 'MultiLineString', coordinates: object.arcs.map((line) => line.flatMap((index, i) => (i === 0 ? arcAt(index) : arcAt(index).slice(1)))) },
  });
  return { nation: lines(topology.objects.nation), states: lines(topology.objects.states), counties: lines(topology.objects.counties) };
}

const cached = new Map<BoundaryLevelName, Promise<OfflineBoundaries>>();

/** Loads a level once per page load; later calls share the result. */
export function loadOfflineBoundaries(level: BoundaryLevelName = 'overview'): Promise<OfflineBoundaries> {
  const existing = cached.get(level);
  if (existing) return existing;
  const loading = (async () => {
    const response = await fetch(boundaryLevelUrls[level]);
    if (!response.ok) throw new Error(`The base map file could not be loaded (HTTP ${response.status}).`);
    const topology: unknown = await response.json();
    if (!isBoundaryTopology(topology)) throw new Error('The base map file is not the expected boundary topology.');
    return boundariesOf(topology);
  })();
  cached.set(level, loading);
  loading.catch(() => cached.delete(level));
  return loading;
}
