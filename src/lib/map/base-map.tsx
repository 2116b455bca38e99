import type { Feature, MultiLineString } from 'geojson';
import { useEffect, useState } from 'react';
import { GeoJSON, useMap } from 'react-leaflet';
import { loadOfflineBoundaries, type OfflineBoundaries } from './offline-boundaries';

/** A box in degrees; the maps open on it. */
export interface BoundsBox {
  west: number;
  south: number;
  east: number;
  north: number;
}

const boundaryStyles = {
  counties: { color: '#c3cad4', weight: 0.6, opacity: 1 },
  states: { color: '#7d8898', weight: 1.2, opacity: 1 },
  nation: { color: '#515d6e', weight: 1.6, opacity: 1 },
} as const;

/** The offline us-atlas boundaries, loaded once per map; `problem` says why they could not be drawn. */
export function useOfflineBoundaries(): { boundaries: OfflineBoundaries | null; problem: string | null } {
  const [boundaries, setBoundaries] = useState<OfflineBoundaries | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  useEffect(() => {
    let live = true;
    loadOfflineBoundaries().then(
      (loaded) => {
        if (live) setBoundaries(loaded);
      },
      (error: unknown) => {
        if (live) setProblem(error instanceof Error ? error.message : 'The base map could not be drawn.');
      },
    );
    return () => {
      live = false;
    };
  }, []);
  return { boundaries, problem };
}

/** Fits the view to the box whenever the box changes. */
export function FitBounds({ bounds, padding = 12 }: { bounds: BoundsBox; padding?: number }) {
  const map = useMap();
  useEffect(() => {
    map.fitBounds(
      [
        [bounds.south, bounds.west],
        [bounds.north, bounds.east],
      ],
      { padding: [padding, padding] },
    );
  }, [map, bounds.west, bounds.south, bounds.east, bounds.north, padding]);
  return null;
}

function Boundary({ feature, style }: { feature: Feature<MultiLineString>; style: (typeof boundaryStyles)[keyof typeof boundaryStyles] }) {
  // pmIgnore keeps the drawing tools (geoman) from treating boundary lines as editable shapes.
  return <GeoJSON data={feature} style={() => style} interactive={false} pmIgnore />;
}

/** County, state and national lines of the offline base map (counties optional). */
export function BoundaryLines({ boundaries, counties = true }: { boundaries: OfflineBoundaries; counties?: boolean }) {
  return (
    <>
      {counties ? <Boundary feature={boundaries.counties} style={boundaryStyles.counties} /> : null}
      <Boundary feature={boundaries.states} style={boundaryStyles.states} />
      <Boundary feature={boundaries.nation} style={boundaryStyles.nation} />
    </>
  );
}
