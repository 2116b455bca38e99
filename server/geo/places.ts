import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { feature } from 'topojson-client';
import type { GeometryCollection, Topology } from 'topojson-specification';
import type { MultiPolygon, Polygon } from 'geojson';
import type { AreaGeometry } from '../../shared/contracts/outlooks';

const require = createRequire(import.meta.url);

export interface Place {
  fipsCode: string;
  kind: 'county' | 'state';
  name: string;
  /** For counties, the state's name. */
  stateName: string;
  geometry: AreaGeometry;
}

let places: Map<string, Place> | undefined;

function toAreaGeometry(g: Polygon | MultiPolygon): AreaGeometry {
  const ring = (r: number[][]) => r.map((p) => [p[0] ?? 0, p[1] ?? 0] as [number, number]);
  return g.type === 'Polygon' ? { type: 'Polygon', coordinates: g.coordinates.map(ring) } : { type: 'MultiPolygon', coordinates: g.coordinates.map((rings) => rings.map(ring)) };
}

/** US counties and states (FIPS codes, names, outlines) from us-atlas, read once, offline. */
export function allPlaces(): Map<string, Place> {
  if (places) return places;
  // eslint-disable-next-line @typescript-eslint/no-unsafe-type-assertion -- the file ships in the pinned us-atlas package with these two objects.
  const topology = JSON.parse(readFileSync(require.resolve('us-atlas/counties-10m.json'), 'utf8')) as Topology<{ states: GeometryCollection<{ name: string }>; counties: GeometryCollection<{ name: string }> }>;
  places = new Map();
  const states = feature(topology, topology.objects.states);
  const stateNames = new Map<string, string>();
  for (const f of states.features) {
    const id = String(f.id);
    stateNames.set(id, f.properties.name);
    if (f.geometry.type === 'Polygon' || f.geometry.type === 'MultiPolygon') {
      places.set(id, { fipsCode: id, kind: 'state', name: f.properties.name, stateName: f.properties.name, geometry: toAreaGeometry(f.geometry) });
    }
  }
  for (const f of feature(topology, topology.objects.counties).features) {
    const id = String(f.id);
    if (f.geometry.type === 'Polygon' || f.geometry.type === 'MultiPolygon') {
      places.set(id, { fipsCode: id, kind: 'county', name: f.properties.name, stateName: stateNames.get(id.slice(0, 2)) ?? '', geometry: toAreaGeometry(f.geometry) });
    }
  }
  return places;
}

/** Counties and states whose name starts with (or contains) the query, best matches first. */
export function searchPlaces(query: string, kind?: 'county' | 'state', limit = 20): Omit<Place, 'geometry'>[] {
  const q = query.toLowerCase();
  const found: { place: Place; score: number }[] = [];
  for (const place of allPlaces().values()) {
    if (kind && place.kind !== kind) continue;
    const name = place.name.toLowerCase();
    const score = name.startsWith(q) ? 0 : name.includes(q) ? 1 : -1;
    if (score >= 0) found.push({ place, score });
  }
  return found
    .sort((a, b) => a.score - b.score || a.place.name.localeCompare(b.place.name))
    .slice(0, limit)
    .map(({ place: { geometry: _geometry, ...rest } }) => rest);
}
