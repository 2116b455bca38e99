import type { FeatureCollection, MultiPolygon } from 'geojson';
import { GeoJSON, Pane } from 'react-leaflet';

/** One band of a model field: the area at or beyond its break, in its colour. */
export interface FieldBandProperties {
  band: number;
  colour: string;
}

export type FieldBands = FeatureCollection<MultiPolygon, FieldBandProperties>;

/**
 * A model field as filled contour bands under the offline boundaries, the risk areas and the
 * points. Bands are drawn lowest first, each over the one before, fully opaque inside a pane
 * that is itself translucent, so overlapping bands never mix their colours.
 */
export function FieldBandsLayer({ field, fieldKey }: { field: FieldBands; fieldKey: string }) {
  return (
    <Pane name="model-field" style={{ zIndex: 300, opacity: 0.62, pointerEvents: 'none' }}>
      {field.features.map((feature) => (
        <GeoJSON
          key={`${fieldKey}-${feature.properties.band}`}
          data={feature}
          interactive={false}
          style={{ stroke: false, fillColor: feature.properties.colour, fillOpacity: 1 }}
        />
      ))}
    </Pane>
  );
}
