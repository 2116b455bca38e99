import './leaflet-setup';
import type { FeatureCollection, Point } from 'geojson';
import type { ReactNode } from 'react';
import { CircleMarker, MapContainer, Pane, Popup, TileLayer, Tooltip } from 'react-leaflet';
import { BoundaryLines, FitBounds, useOfflineBoundaries } from './base-map';
import { FieldBandsLayer, type FieldBands } from './field-bands-layer';

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
  /** A model field drawn as filled bands under everything else; `fieldKey` names run and figure. */
  field?: { bands: FieldBands; fieldKey: string } | null | undefined;
}

const NO_VALUE_FILL = '#ffffff';

/**
 * A Leaflet map of coloured points over the offline US state and county boundaries. Callers pass
 * plain GeoJSON and a popup renderer; no Leaflet object leaves this module.
 */
export function PointMap({ label, region, points, renderPopup, tileUrl, tileAttribution, className, field }: PointMapProps) {
  const { boundaries, problem: boundaryProblem } = useOfflineBoundaries();

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
        <FitBounds bounds={region} />
        {tileUrl ? <TileLayer url={tileUrl} attribution={tileAttribution ?? ''} /> : null}
        {field ? <FieldBandsLayer field={field.bands} fieldKey={field.fieldKey} /> : null}
        {boundaries ? (
          <Pane name="boundaries" style={{ zIndex: 350 }}>
            <BoundaryLines boundaries={boundaries} />
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
