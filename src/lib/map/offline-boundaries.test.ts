import { readFileSync } from 'node:fs';
import { feature } from 'topojson-client';
import { describe, expect, it } from 'vitest';
import { boundariesOf, isBoundaryTopology } from './offline-boundaries';

describe('boundariesOf', () => {
  it('when decoding the shipped overview level, gives the same lines as topojson-client', () => {
    const topology: unknown = JSON.parse(readFileSync('public/boundaries/overview.json', 'utf8'));
    if (!isBoundaryTopology(topology)) throw new Error('public/boundaries/overview.json is not a boundary topology');
    const ours = boundariesOf(topology);
    for (const name of ['nation', 'states', 'counties'] as const) {
      const reference = feature(topology, topology.objects[name]).geometry;
      expect(ours[name].geometry.coordinates).toEqual(reference.coordinates);
    }
    // The lines lie over the United States (us-atlas covers 179°W–180°E, 14°S–72°N with territories).
    const [lon, lat] = ours.states.geometry.coordinates[0]?.[0] ?? [];
    expect(lon).toBeGreaterThanOrEqual(-180);
    expect(lat).toBeGreaterThan(-15);
  });
});
