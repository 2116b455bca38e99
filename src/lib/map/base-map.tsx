import type { Feature, MultiLineString } from 'geojson';
import { useEffect, useState } from 'react';
import { GeoJSON, useMap, useMapEvents } from 'react-leaflet';
import { DETAIL_MIN_ZOOM, loadOfflineBoundaries, type OfflineBoundaries } from './offline-boundaries';

export { useOfflineBoundaries } from './use-offline-boundaries';

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

/** The detail level of the boundaries once the map is zoomed in past DETAIL_MIN_ZOOM (loaded then, not before). */
function useDetailWhenZoomedIn(): OfflineBoundaries | null {
  const map = useMap();
  const [zoomedIn, setZoomedIn] = useState(() => map.getZoom() >= DETAIL_MIN_ZOOM);
  useMapEvents({ zoomend: () => setZoomedIn(map.getZoom() >= DETAIL_MIN_ZOOM) });
  const [detail, setDetail] = useState<OfflineBoundaries | null>(null);
  useEffect(() => {
    if (!zoomedIn || detail) return;
    let live = true;
    // Without the detail level the overview stays drawn: a failed load only costs sharpness.
    loadOfflineBoundaries('detail').then(
      (loaded) => {
        if (live) setDetail(loaded);
      },
      () => undefined,
    );
    return () => {
      live = false;
    };
  }, [zoomedIn, detail]);
  return zoomedIn ? detail : null;
}

/**
 * County, state and national lines of the offline base map (counties optional): the overview
 * level given, replaced by the detail level while the map is zoomed in.
 */
export function BoundaryLines({ boundaries: overview, counties = true }: { boundaries: OfflineBoundaries; counties?: boolean }) {
  const detail = useDetailWhenZoomedIn();
  const boundaries = detail ?? overview;
  // react-leaflet's GeoJSON reads `data` once: a new key redraws the lines at the new level.
  const level = detail ? 'detail' : 'overview';
  return (
    <>
      {counties ? <Boundary key={`counties-${level}`} feature={boundaries.counties} style={boundaryStyles.counties} /> : null}
      <Boundary key={`states-${level}`} feature={boundaries.states} style={boundaryStyles.states} />
      <Boundary key={`nation-${level}`} feature={boundaries.nation} style={boundaryStyles.nation} />
    </>
  );
}
