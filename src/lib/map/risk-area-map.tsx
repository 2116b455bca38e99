import './leaflet-setup';
import type { FeatureCollection } from 'geojson';
import L from 'leaflet';
import { GeoJSON, MapContainer, Marker, Pane, Tooltip } from 'react-leaflet';
import { markerSvg } from './marker-symbol';
import { BoundaryLines, FitBounds, useOfflineBoundaries } from './base-map';
import type { MapArea, MapBounds, MapMarker } from './risk-area-types';


const asFeature = (area: MapArea): FeatureCollection => ({ type: 'FeatureCollection', features: [{ type: 'Feature', id: area.id, properties: {}, geometry: area.geometry }] });

/**
 * A read-only map of risk areas over the offline state and county boundaries. Areas draw in the
 * order given (lowest level first); significant hazards get a bold dark inner outline.
 */
export function RiskAreaMap({ label, bounds, areas, markers = [], className }: { label: string; bounds: MapBounds; areas: readonly MapArea[]; markers?: readonly MapMarker[]; className?: string }) {
  const { boundaries } = useOfflineBoundaries();

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
        <FitBounds bounds={bounds} padding={10} />
        {boundaries ? (
          <Pane name="boundaries" style={{ zIndex: 450, pointerEvents: 'none' }}>
            <BoundaryLines boundaries={boundaries} />
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
        {markers.map((marker) => (
          <Marker
            key={marker.id}
            position={[marker.latitude, marker.longitude]}
            icon={L.divIcon({ html: markerSvg(marker.shape, marker.filled), className: 'stormdraft-marker', iconSize: [16, 16], iconAnchor: [8, 8] })}
            title={marker.title}
            alt={marker.title}
          >
            <Tooltip>{marker.title}</Tooltip>
          </Marker>
        ))}
      </MapContainer>
    </div>
  );
}
