import './leaflet-setup';
import type { FeatureCollection } from 'geojson';
import L from 'leaflet';
import { GeoJSON, MapContainer, Marker, Pane, Tooltip } from 'react-leaflet';
import { textColourOn } from '../../../shared/contracts/office';
import { AREA_FILL_OPACITY, AREA_OUTLINE } from './area-outline';
import { BoundaryLines, FitBounds, useOfflineBoundaries } from './base-map';
import { labelAnchor } from './inset-outline';
import { markerSvg } from './marker-symbol';
import type { MapArea, MapBounds, MapMarker } from './risk-area-types';

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);
}

/** The area's level in words, always on the map just inside its north edge (never colour alone). */
function AreaLabel({ area }: { area: MapArea }) {
  const anchor = labelAnchor(area.geometry);
  if (!anchor) return null;
  const html = `<span class="sd-area-label" style="background:${area.colour};color:${textColourOn(area.colour)}">${escapeHtml(area.title)}</span>`;
  return <Marker position={[anchor[1], anchor[0]]} interactive={false} keyboard={false} icon={L.divIcon({ className: 'sd-area-label-anchor', html, iconSize: [0, 0] })} />;
}

const asFeature = (area: MapArea): FeatureCollection => ({ type: 'FeatureCollection', features: [{ type: 'Feature', id: area.id, properties: {}, geometry: area.geometry }] });

/**
 * A read-only map of risk areas over the offline state and county boundaries. Areas draw in the
 * order given (lowest level first), each with its two-colour outline (area-outline.ts) and its
 * label; significant hazards get a bold dark inner outline.
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
        {areas.flatMap((area) => [
          <GeoJSON
            key={`casing:${area.id}:${JSON.stringify(area.geometry).length}`}
            data={asFeature(area)}
            interactive={false}
            style={() => ({ color: AREA_OUTLINE.casing.colour, weight: AREA_OUTLINE.casing.weight, opacity: 1, fill: false })}
          />,
          <GeoJSON
            key={`${area.id}:${area.colour}:${JSON.stringify(area.geometry).length}`}
            data={asFeature(area)}
            style={() => ({ color: AREA_OUTLINE.line.colour, weight: AREA_OUTLINE.line.weight, opacity: 1, fillColor: area.colour, fillOpacity: AREA_FILL_OPACITY.readOnly })}
          >
            <Tooltip sticky>
              <strong>{area.title}</strong>
              {area.detail ? <span className="block">{area.detail}</span> : null}
            </Tooltip>
          </GeoJSON>,
        ])}
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
        {areas.map((area) => (
          <AreaLabel key={`label:${area.id}`} area={area} />
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
