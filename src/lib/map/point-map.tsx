import './leaflet-setup';
import type { Feature, FeatureCollection, MultiLineString, Point } from 'geojson';
import { useEffect, useState, type ReactNode } from 'react';
import { CircleMarker, GeoJSON, MapContainer, Pane, Popup, TileLayer, Tooltip, useMap } from 'react-leaflet';
import { loadOfflineBoundaries, type OfflineBoundaries } from './offline-boundaries';

/** A rectangle in degrees (WGS 84), e.g. the office region. */
export interface MapRegion {
  west: number;
  south: number;
  east: number;
  north: number;
}

/** What each point carries: an id, its fill colour (null = no value), a short hover label. */
export interface PointProperties {
  id: string;
  colour: string | null;
  label: string;
  /** Drawn with a dashed ring, e.g. a modified what-if sounding. */
  dashed?: boolean;
}

interface PointMapProps {
  /** Accessible name of the map region. */
  label: string;
  region: MapRegion;
  points: FeatureCollection<Point, PointProperties>;
  /** Popup content for a clicked point (plain React; links work). */
  renderPopup: (properties: PointProperties) => ReactNode;
  /** Optional online base layer (`{z}/{x}/{y}` template); the offline boundaries always draw. */
  tileUrl?: string | undefined;
  tileAttribution?: string | undefined;
  className?: string;
}

const boundaryStyles = {
  counties: { color: '#c3cad4', weight: 0.6, opacity: 1, interactive: false },
  states: { color: '#7d8898', weight: 1.2, opacity: 1, interactive: false },
  nation: { color: '#515d6e', weight: 1.6, opacity: 1, interactive: false },
} as const;

const NO_VALUE_FILL = '#ffffff';

/** Fits the view to the region whenever the region changes. */
function FitRegion({ region }: { region: MapRegion }) {
  const map = useMap();
  useEffect(() => {
    map.fitBounds(
      [
        [region.south, region.west],
        [region.north, region.east],
      ],
      { padding: [12, 12] },
    );
  }, [map, region.west, region.south, region.east, region.north]);
  return null;
}

function BoundaryLayer({ feature, style }: { feature: Feature<MultiLineString>; style: (typeof boundaryStyles)[keyof typeof boundaryStyles] }) {
  return <GeoJSON data={feature} style={() => style} interactive={false} />;
}

/**
 * A Leaflet map of coloured points over the offline US state and county boundaries. Callers pass
 * plain GeoJSON and a popup renderer; no Leaflet object leaves this module.
 */
export function PointMap({ label, region, points, renderPopup, tileUrl, tileAttribution, className }: PointMapProps) {
  const [boundaries, setBoundaries] = useState<OfflineBoundaries | null>(null);
  const [boundaryProblem, setBoundaryProblem] = useState<string | null>(null);

  useEffect(() => {
    let live = true;
    loadOfflineBoundaries().then(
      (loaded) => {
        if (live) setBoundaries(loaded);
      },
      (error: unknown) => {
        if (live) setBoundaryProblem(error instanceof Error ? error.message : 'The base map could not be drawn.');
      },
    );
    return () => {
      live = false;
    };
  }, []);

  return (
    <div className={className} role="region" aria-label={label}>
      <MapContainer
        bounds={[
          [region.south, region.west],
          [region.north, region.east],
        ]}
        boundsOptions={{ padding: [12, 12] }}
        className="size-full rounded-lg bg-[#eef1f5]"
        zoomSnap={0.25}
        attributionControl={tileUrl !== undefined}
      >
        <FitRegion region={region} />
        {tileUrl ? <TileLayer url={tileUrl} attribution={tileAttribution ?? ''} /> : null}
        {boundaries ? (
          <Pane name="boundaries" style={{ zIndex: 350 }}>
            <BoundaryLayer feature={boundaries.counties} style={boundaryStyles.counties} />
            <BoundaryLayer feature={boundaries.states} style={boundaryStyles.states} />
            <BoundaryLayer feature={boundaries.nation} style={boundaryStyles.nation} />
          </Pane>
        ) : null}
        {points.features.map((point) => {
          const [longitude, latitude] = point.geometry.coordinates;
          if (longitude === undefined || latitude === undefined) return null;
          const properties = point.properties;
          return (
            <CircleMarker
              key={properties.id}
              center={[latitude, longitude]}
              radius={7}
              pathOptions={{
                color: '#172030',
                weight: properties.dashed ? 2 : 1,
                dashArray: properties.dashed ? '3 2' : undefined,
                fillColor: properties.colour ?? NO_VALUE_FILL,
                fillOpacity: 0.95,
              }}
            >
              <Tooltip direction="top" offset={[0, -6]}>
                {properties.label}
              </Tooltip>
              <Popup>{renderPopup(properties)}</Popup>
            </CircleMarker>
          );
        })}
      </MapContainer>
      {boundaryProblem ? <p className="mt-1 text-[13px] text-danger">{boundaryProblem}</p> : null}
    </div>
  );
}
