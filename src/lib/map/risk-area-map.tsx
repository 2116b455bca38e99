import './leaflet-setup';
import type { Feature, FeatureCollection, MultiLineString } from 'geojson';
import { useEffect, useState } from 'react';
import { GeoJSON, MapContainer, Pane, Tooltip, useMap } from 'react-leaflet';
import { loadOfflineBoundaries, type OfflineBoundaries } from './offline-boundaries';
import type { MapArea, MapBounds } from './risk-area-types';


const boundaryStyle = {
  counties: { color: '#c3cad4', weight: 0.6, opacity: 1 },
  states: { color: '#7d8898', weight: 1.2, opacity: 1 },
  nation: { color: '#515d6e', weight: 1.6, opacity: 1 },
} as const;

function FitBounds({ bounds }: { bounds: MapBounds }) {
  const map = useMap();
  useEffect(() => {
    map.fitBounds(
      [
        [bounds.south, bounds.west],
        [bounds.north, bounds.east],
      ],
      { padding: [10, 10] },
    );
  }, [map, bounds.west, bounds.south, bounds.east, bounds.north]);
  return null;
}

function Boundary({ feature, style }: { feature: Feature<MultiLineString>; style: (typeof boundaryStyle)[keyof typeof boundaryStyle] }) {
  return <GeoJSON data={feature} style={() => style} interactive={false} />;
}

const asFeature = (area: MapArea): FeatureCollection => ({ type: 'FeatureCollection', features: [{ type: 'Feature', id: area.id, properties: {}, geometry: area.geometry }] });

/**
 * A read-only map of risk areas over the offline state and county boundaries. Areas draw in the
 * order given (lowest level first); significant hazards get a bold dark inner outline.
 */
export function RiskAreaMap({ label, bounds, areas, className }: { label: string; bounds: MapBounds; areas: readonly MapArea[]; className?: string }) {
  const [boundaries, setBoundaries] = useState<OfflineBoundaries | null>(null);
  useEffect(() => {
    let live = true;
    loadOfflineBoundaries().then(
      (loaded) => {
        if (live) setBoundaries(loaded);
      },
      () => undefined,
    );
    return () => {
      live = false;
    };
  }, []);

  return (
    <div className={className} role="region" aria-label={label}>
      <MapContainer
        bounds={[
          [bounds.south, bounds.west],
          [bounds.north, bounds.east],
        ]}
        className="size-full rounded-md bg-[#eef1f5]"
        zoomSnap={0.25}
        scrollWheelZoom={false}
        attributionControl={false}
      >
        <FitBounds bounds={bounds} />
        {boundaries ? (
          <Pane name="boundaries" style={{ zIndex: 450, pointerEvents: 'none' }}>
            <Boundary feature={boundaries.counties} style={boundaryStyle.counties} />
            <Boundary feature={boundaries.states} style={boundaryStyle.states} />
            <Boundary feature={boundaries.nation} style={boundaryStyle.nation} />
          </Pane>
        ) : null}
        {areas.map((area) => (
          <GeoJSON
            key={`${area.id}:${area.colour}:${JSON.stringify(area.geometry).length}`}
            data={asFeature(area)}
            style={() => ({ color: '#172030', weight: 1, opacity: 0.7, fillColor: area.colour, fillOpacity: 0.72 })}
          >
            <Tooltip sticky>
              <strong>{area.title}</strong>
              {area.detail ? <span className="block">{area.detail}</span> : null}
            </Tooltip>
          </GeoJSON>
        ))}
        {areas
          .filter((area) => area.significant)
          .map((area) => (
            <GeoJSON
              key={`sig:${area.id}`}
              data={asFeature(area)}
              interactive={false}
              style={() => ({ color: '#101624', weight: 3.5, opacity: 0.9, fill: false, dashArray: '1 0' })}
            />
          ))}
      </MapContainer>
    </div>
  );
}
