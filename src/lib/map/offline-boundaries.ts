import type { Feature, MultiLineString } from 'geojson';
import { mesh } from 'topojson-client';
import type { GeometryCollection, Topology } from 'topojson-specification';
import countiesTopologyUrl from 'us-atlas/counties-10m.json?url';

/**
 * The offline base map: state and county boundaries from us-atlas (Census cartographic boundary
 * files, 1:10,000,000), bundled with the app as a static asset so the map needs no tile server.
 * One file holds counties, states and the nation outline.
 */
export interface OfflineBoundaries {
  nation: Feature<MultiLineString>;
  states: Feature<MultiLineString>;
  counties: Feature<MultiLineString>;
}

type UsAtlasTopology = Topology<{ counties: GeometryCollection; states: GeometryCollection; nation: GeometryCollection }>;

function isGeometryCollection(value: unknown): value is GeometryCollection {
  return typeof value === 'object' && value !== null && 'type' in value && value.type === 'GeometryCollection' && 'geometries' in value && Array.isArray(value.geometries);
}

/** Checks the shape we rely on before handing the file to topojson-client. */
function isUsAtlasTopology(value: unknown): value is UsAtlasTopology {
  if (typeof value !== 'object' || value === null) return false;
  if (!('type' in value) || value.type !== 'Topology' || !('arcs' in value) || !Array.isArray(value.arcs)) return false;
  if (!('objects' in value) || typeof value.objects !== 'object' || value.objects === null) return false;
  const objects = value.objects;
  return (
    'counties' in objects && isGeometryCollection(objects.counties) && 'states' in objects && isGeometryCollection(objects.states) && 'nation' in objects && isGeometryCollection(objects.nation)
  );
}

const asFeature = (geometry: MultiLineString): Feature<MultiLineString> => ({ type: 'Feature', properties: {}, geometry });

let cached: Promise<OfflineBoundaries> | null = null;

/** Loads and meshes the boundaries once per page load; later calls share the result. */
export function loadOfflineBoundaries(): Promise<OfflineBoundaries> {
  cached ??= (async () => {
    const response = await fetch(countiesTopologyUrl);
    if (!response.ok) throw new Error(`The base map file could not be loaded (HTTP ${response.status}).`);
    const topology: unknown = await response.json();
    if (!isUsAtlasTopology(topology)) throw new Error('The base map file is not the expected us-atlas topology.');
    return {
      nation: asFeature(mesh(topology, topology.objects.nation)),
      // Shared borders only: each line once, no coastline duplicates of the nation outline.
      states: asFeature(mesh(topology, topology.objects.states, (a, b) => a !== b)),
      counties: asFeature(mesh(topology, topology.objects.counties, (a, b) => a !== b && a.id?.toString().slice(0, 2) === b.id?.toString().slice(0, 2))),
    };
  })();
  cached.catch(() => {
    cached = null;
  });
  return cached;
}
