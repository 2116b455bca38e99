import './leaflet-setup';
import '@geoman-io/leaflet-geoman-free';
import '@geoman-io/leaflet-geoman-free/dist/leaflet-geoman.css';
import type { FeatureCollection, MultiPolygon, Point, Polygon } from 'geojson';
import L from 'leaflet';
import { useEffect, useLayoutEffect, useRef, type ReactNode, type RefObject } from 'react';
import { CircleMarker, MapContainer, Pane, Popup, TileLayer, Tooltip, useMap } from 'react-leaflet';
import { insetOutline, labelAnchor } from './inset-outline';
import { AREA_FILL_OPACITY, AREA_OUTLINE } from './area-outline';
import { BoundaryLines, FitBounds, useOfflineBoundaries } from './base-map';
import { FieldBandsLayer, type FieldBands } from './field-bands-layer';
import type { MapRegion, PointProperties } from './point-map';
import { escapeHtml } from '../../../shared/text/escape-html';
import { judgementSvg, type JudgementKind } from './judgement-symbol';

/** What the editor is doing: selecting, drawing a new area, editing vertices, moving or cutting a hole. */
export type EditorMode = 'select' | 'draw' | 'edit' | 'move' | 'cut';

export type AreaShape = Polygon | MultiPolygon;

/** How one risk area is drawn: colours from the ladder, its label and any significant-hazard badges. */
export interface EditorAreaProperties {
  id: string;
  fillColour: string;
  textColour: string;
  /** Always shown on the map (level number and word, never colour alone). */
  title: string;
  /** Short hazard badges such as "Sig. tornado"; a non-empty list draws the bold inner outline. */
  badges: string[];
}

/** A sounding inside the selected area with how its support check judged it (drawn as a shape around its dot). */
export interface JudgedPoint {
  id: string;
  longitude: number;
  latitude: number;
  kind: JudgementKind;
}

export interface MapLayersShown {
  counties: boolean;
  soundings: boolean;
  areas: boolean;
}

interface AreaEditorMapProps {
  label: string;
  region: MapRegion;
  /** Lowest level first; later areas draw on top. */
  areas: FeatureCollection<AreaShape, EditorAreaProperties>;
  selectedId: string | null;
  points: FeatureCollection<Point, PointProperties>;
  renderPopup?: (properties: PointProperties) => ReactNode;
  layers: MapLayersShown;
  mode: EditorMode;
  onSelect?: (id: string | null) => void;
  onCreate?: (geometry: AreaShape) => void;
  onChange?: (id: string, geometry: AreaShape) => void;
  /**
   * While a vertex or the whole area is being dragged: the outline at each animation frame (at
   * most one call per frame), then null when the drag ends (before `onChange`, if it changed).
   */
  onLiveChange?: (id: string, geometry: AreaShape | null) => void;
  /** Soundings of the selected area with their judgement; drawn under the sounding dots. */
  judged?: readonly JudgedPoint[];
  onModeChange?: (mode: EditorMode) => void;
  tileUrl?: string | undefined;
  tileAttribution?: string | undefined;
  className?: string;
  /** A model field drawn as filled bands under the drawing; `fieldKey` names run and figure. */
  field?: { bands: FieldBands; fieldKey: string } | null | undefined;
}

const PRECISION = 6;

function shapeOf(layer: L.Layer): AreaShape | null {
  if (!(layer instanceof L.Polygon)) return null;
  const json = layer.toGeoJSON(PRECISION);
  const geometry = json.geometry;
  return geometry.type === 'Polygon' || geometry.type === 'MultiPolygon' ? geometry : null;
}

const keyOf = (geometry: AreaShape) => JSON.stringify(geometry);

function labelHtml(properties: EditorAreaProperties): string {
  const badges = properties.badges.map((b) => `<span class="sd-area-badge">${escapeHtml(b)}</span>`).join('');
  return `<span class="sd-area-label" style="background:${properties.fillColour};color:${properties.textColour}">${escapeHtml(properties.title)}${badges}</span>`;
}

interface Registered {
  polygon: L.Polygon;
  /** The white casing under the polygon's dark line (see area-outline.ts); follows every edit. */
  casing: L.Polygon;
  geometryKey: string;
  inset: L.GeoJSON | null;
  label: L.Marker | null;
  decorationKey: string;
}

interface LatestProps {
  mode: EditorMode;
  onSelect: AreaEditorMapProps['onSelect'];
  onCreate: AreaEditorMapProps['onCreate'];
  onChange: AreaEditorMapProps['onChange'];
  onLiveChange: AreaEditorMapProps['onLiveChange'];
  onModeChange: AreaEditorMapProps['onModeChange'];
}

interface AppliedMode {
  mode: EditorMode;
  polygon: L.Polygon | null;
}

/** Turns geoman modes on and off for the selected area; a no-op when nothing changed. */
function applyMode(map: L.Map, registry: Map<string, Registered>, applied: AppliedMode, mode: EditorMode, selectedId: string | null) {
  const target = selectedId === null ? null : (registry.get(selectedId)?.polygon ?? null);
  if (applied.mode === mode && applied.polygon === target && (mode !== 'draw' || map.pm.globalDrawModeEnabled())) return;
  map.pm.disableDraw();
  map.pm.disableGlobalCutMode();
  for (const entry of registry.values()) {
    if (entry.polygon.pm.enabled()) entry.polygon.pm.disable();
    if (entry.polygon.pm.layerDragEnabled()) entry.polygon.pm.disableLayerDrag();
  }
  switch (mode) {
    case 'select':
      break;
    case 'draw':
      map.pm.enableDraw('Polygon', { allowSelfIntersection: true, templineStyle: { color: '#3a50ad' }, hintlineStyle: { color: '#3a50ad', dashArray: '5 5' } });
      break;
    case 'edit':
      target?.pm.enable({ allowSelfIntersection: true, draggable: false });
      break;
    case 'move':
      target?.pm.enableLayerDrag();
      break;
    case 'cut':
      if (target) {
        // geoman reads `layersToCut` at run time; its type declarations omit it.
        const cutOptions: L.PM.CutModeOptions & { layersToCut: L.Layer[] } = { layersToCut: [target], allowSelfIntersection: false };
        map.pm.enableGlobalCutMode(cutOptions);
      }
      break;
  }
  applied.mode = mode;
  applied.polygon = target;
}

/**
 * The risk-area layers and geoman editing, driven imperatively from props: each area keeps its
 * Leaflet polygon while its geometry is unchanged, so vertex editing survives re-renders; a
 * changed geometry (undo, a fix, an import) replaces the polygon.
 */
function AreaLayers({ areas, selectedId, visible, mode, latest }: { areas: AreaEditorMapProps['areas']; selectedId: string | null; visible: boolean; mode: EditorMode; latest: RefObject<LatestProps> }) {
  const map = useMap();
  const registry = useRef(new Map<string, Registered>());
  const applied = useRef<AppliedMode>({ mode: 'select', polygon: null });

  // Map-level events: drawing a new area, cutting a hole, clicking empty map.
  useEffect(() => {
    map.pm.setGlobalOptions({ allowSelfIntersection: true, snappable: true, snapDistance: 12 });
    const onCreate = (event: { layer: L.Layer }) => {
      const geometry = shapeOf(event.layer);
      map.removeLayer(event.layer);
      if (geometry) latest.current.onCreate?.(geometry);
      latest.current.onModeChange?.('select');
    };
    const onCut = (event: { layer: L.Layer; originalLayer: L.Layer }) => {
      let id: string | null = null;
      for (const [areaId, entry] of registry.current) if (entry.polygon === event.originalLayer) id = areaId;
      const geometry = shapeOf(event.layer);
      map.removeLayer(event.layer);
      if (id !== null) {
        const entry = registry.current.get(id);
        if (entry) {
          entry.casing.remove();
          entry.inset?.remove();
          entry.label?.remove();
        }
        registry.current.delete(id);
        if (geometry) latest.current.onChange?.(id, geometry);
      }
      latest.current.onModeChange?.('select');
    };
    const onMapClick = () => {
      if (latest.current.mode === 'select') latest.current.onSelect?.(null);
    };
    // geoman's vertex handles are keyboard buttons without a name: name them as they appear.
    const onLayerAdd = (event: L.LayerEvent) => {
      if (!(event.layer instanceof L.Marker)) return;
      const element = event.layer.getElement();
      if (!element?.classList.contains('marker-icon')) return;
      element.setAttribute('aria-label', element.classList.contains('marker-icon-middle') ? 'Midpoint: drag to add a vertex' : 'Vertex: drag to move it');
    };
    map.on('pm:create', onCreate);
    map.on('pm:cut', onCut);
    map.on('click', onMapClick);
    map.on('layeradd', onLayerAdd);
    return () => {
      map.off('layeradd', onLayerAdd);
      map.off('pm:create', onCreate);
      map.off('pm:cut', onCut);
      map.off('click', onMapClick);
    };
  }, [map, latest]);

  // Keep the polygons in step with the areas.
  useEffect(() => {
    const seen = new Set<string>();
    for (const feature of areas.features) {
      const properties = feature.properties;
      const id = properties.id;
      seen.add(id);
      const geometryKey = keyOf(feature.geometry);
      let entry = registry.current.get(id);
      if (entry && entry.geometryKey !== geometryKey) {
        entry.polygon.remove();
        entry.casing.remove();
        entry.inset?.remove();
        entry.label?.remove();
        registry.current.delete(id);
        entry = undefined;
      }
      if (!entry) {
        const created = L.GeoJSON.geometryToLayer({ type: 'Feature', properties: {}, geometry: feature.geometry });
        if (!(created instanceof L.Polygon)) continue;
        const polygon = created;
        polygon.on('click', (event: L.LeafletMouseEvent) => {
          const mode = latest.current.mode;
          if (mode === 'draw' || mode === 'cut') return;
          L.DomEvent.stopPropagation(event);
          latest.current.onSelect?.(id);
        });
        const onEdited = () => {
          const geometry = shapeOf(polygon);
          const current = registry.current.get(id);
          if (!geometry || !current || current.polygon !== polygon) return;
          const key = keyOf(geometry);
          if (key === current.geometryKey) return;
          current.geometryKey = key;
          current.decorationKey = '';
          latest.current.onChange?.(id, geometry);
        };
        // Live outline while dragging, throttled to animation frames.
        let frame = 0;
        const onMoving = () => {
          if (frame !== 0) return;
          frame = window.requestAnimationFrame(() => {
            frame = 0;
            const current = registry.current.get(id);
            if (!current || current.polygon !== polygon) return;
            const geometry = shapeOf(polygon);
            if (geometry) latest.current.onLiveChange?.(id, geometry);
          });
        };
        const onMoved = () => {
          if (frame !== 0) window.cancelAnimationFrame(frame);
          frame = 0;
          latest.current.onLiveChange?.(id, null);
        };
        polygon.on('pm:markerdrag pm:drag', onMoving);
        polygon.on('pm:markerdragend pm:dragend', onMoved);
        polygon.on('pm:edit', onEdited);
        polygon.on('pm:dragend', onEdited);
        const casing = L.polygon(polygon.getLatLngs(), { interactive: false, pmIgnore: true, fill: false, color: AREA_OUTLINE.casing.colour, weight: AREA_OUTLINE.casing.weight, opacity: 1 } as L.PolylineOptions);
        const follow = () => casing.setLatLngs(polygon.getLatLngs());
        polygon.on('pm:markerdrag pm:drag pm:vertexadded pm:vertexremoved pm:edit pm:dragend pm:cut', follow);
        entry = { polygon, casing, geometryKey, inset: null, label: null, decorationKey: '' };
        registry.current.set(id, entry);
      }
      const selected = id === selectedId;
      entry.polygon.setStyle({
        color: selected ? AREA_OUTLINE.selectedLine.colour : AREA_OUTLINE.line.colour,
        weight: selected ? AREA_OUTLINE.selectedLine.weight : AREA_OUTLINE.line.weight,
        dashArray: selected ? AREA_OUTLINE.selectedLine.dashArray : undefined,
        fillColor: properties.fillColour,
        fillOpacity: AREA_FILL_OPACITY.editor,
        opacity: 1,
      });
      const decorationKey = `${geometryKey}|${properties.title}|${properties.badges.join(',')}|${properties.fillColour}|${properties.textColour}`;
      if (entry.decorationKey !== decorationKey) {
        entry.inset?.remove();
        entry.label?.remove();
        entry.inset =
          properties.badges.length > 0
            ? L.geoJSON(insetOutline(feature.geometry), { interactive: false, pmIgnore: true, style: { color: '#101624', weight: 3.5, fill: false, opacity: 0.95 } } as L.GeoJSONOptions)
            : null;
        const anchor = labelAnchor(feature.geometry);
        entry.label = anchor
          ? L.marker([anchor[1], anchor[0]], {
              interactive: false,
              keyboard: false,
              pmIgnore: true,
              icon: L.divIcon({ className: 'sd-area-label-anchor', html: labelHtml(properties), iconSize: [0, 0] }),
            } as L.MarkerOptions)
          : null;
        entry.decorationKey = decorationKey;
      }
    }
    for (const [id, entry] of registry.current) {
      if (!seen.has(id)) {
        entry.polygon.remove();
        entry.casing.remove();
        entry.inset?.remove();
        entry.label?.remove();
        registry.current.delete(id);
      }
    }
    // Draw in the given order (lowest level first) so higher levels sit on top and take clicks.
    for (const feature of areas.features) {
      const entry = registry.current.get(feature.properties.id);
      if (!entry) continue;
      if (visible) {
        if (!map.hasLayer(entry.casing)) entry.casing.addTo(map);
        if (!map.hasLayer(entry.polygon)) entry.polygon.addTo(map);
        entry.casing.bringToFront();
        entry.polygon.bringToFront();
        if (entry.inset && !map.hasLayer(entry.inset)) entry.inset.addTo(map);
        if (entry.label && !map.hasLayer(entry.label)) entry.label.addTo(map);
      } else {
        entry.polygon.remove();
        entry.casing.remove();
        entry.inset?.remove();
        entry.label?.remove();
      }
    }
    for (const feature of areas.features) registry.current.get(feature.properties.id)?.inset?.bringToFront();
    applyMode(map, registry.current, applied.current, mode, selectedId);
  }, [map, areas, selectedId, visible, mode, latest]);

  // Apply the editing mode to the selected area (only when the mode or the polygon changed).
  useEffect(() => {
    applyMode(map, registry.current, applied.current, mode, selectedId);
  }, [map, mode, selectedId]);

  useEffect(() => {
    const entries = registry.current;
    return () => {
      for (const entry of entries.values()) {
        entry.polygon.remove();
        entry.casing.remove();
        entry.inset?.remove();
        entry.label?.remove();
      }
      entries.clear();
    };
  }, []);

  return null;
}

const judgementIcons = new Map<JudgementKind, L.DivIcon>();
function judgementIcon(kind: JudgementKind): L.DivIcon {
  let icon = judgementIcons.get(kind);
  if (!icon) {
    icon = L.divIcon({ className: `sd-judgement sd-judgement-${kind}`, html: judgementSvg(kind), iconSize: [22, 22], iconAnchor: [11, 11] });
    judgementIcons.set(kind, icon);
  }
  return icon;
}

/**
 * The judgement shapes around the selected area's soundings, kept imperatively: on each update
 * (every animation frame of a drag) only markers that appear, vanish or change judgement are touched.
 */
function JudgementLayer({ points }: { points: readonly JudgedPoint[] }) {
  const map = useMap();
  const markers = useRef(new Map<string, { marker: L.Marker; kind: JudgementKind }>());
  useEffect(() => {
    const seen = new Set<string>();
    for (const point of points) {
      seen.add(point.id);
      const entry = markers.current.get(point.id);
      if (entry) {
        if (entry.kind !== point.kind) {
          entry.marker.setIcon(judgementIcon(point.kind));
          entry.kind = point.kind;
        }
        continue;
      }
      const marker = L.marker([point.latitude, point.longitude], { icon: judgementIcon(point.kind), interactive: false, keyboard: false, pane: 'judgements', pmIgnore: true } as L.MarkerOptions).addTo(map);
      markers.current.set(point.id, { marker, kind: point.kind });
    }
    for (const [id, entry] of markers.current) {
      if (!seen.has(id)) {
        entry.marker.remove();
        markers.current.delete(id);
      }
    }
  }, [map, points]);
  useEffect(() => {
    const entries = markers.current;
    return () => {
      for (const entry of entries.values()) entry.marker.remove();
      entries.clear();
    };
  }, []);
  return null;
}

/**
 * The authoring map: offline boundaries, soundings as coloured points and the outlook's risk
 * areas, with geoman drawing and editing. Callers pass plain GeoJSON and callbacks; geometry
 * comes back as GeoJSON (RFC 7946 positions, 6 decimals). No Leaflet object leaves this module.
 */
export function AreaEditorMap(props: AreaEditorMapProps) {
  const { label, region, areas, selectedId, points, renderPopup, layers, mode, tileUrl, tileAttribution, className, field } = props;
  const { boundaries, problem: boundaryProblem } = useOfflineBoundaries();
  const latest = useRef<LatestProps>({ mode, onSelect: props.onSelect, onCreate: props.onCreate, onChange: props.onChange, onLiveChange: props.onLiveChange, onModeChange: props.onModeChange });
  useLayoutEffect(() => {
    latest.current = { mode, onSelect: props.onSelect, onCreate: props.onCreate, onChange: props.onChange, onLiveChange: props.onLiveChange, onModeChange: props.onModeChange };
  });
  const pointsInteractive = mode === 'select';

  return (
    <div className={className} role="region" aria-label={label} data-mode={mode}>
      <MapContainer
        bounds={[
          [region.south, region.west],
          [region.north, region.east],
        ]}
        boundsOptions={{ padding: [12, 12] }}
        className="size-full rounded-lg bg-[#eef1f5]"
        zoomSnap={0.25}
        doubleClickZoom={false}
        attributionControl={tileUrl !== undefined}
      >
        <FitBounds bounds={region} />
        {tileUrl ? <TileLayer url={tileUrl} attribution={tileAttribution ?? ''} /> : null}
        {field ? <FieldBandsLayer field={field.bands} fieldKey={field.fieldKey} /> : null}
        {boundaries ? (
          <Pane name="boundaries" style={{ zIndex: 350, pointerEvents: 'none' }}>
            <BoundaryLines boundaries={boundaries} counties={layers.counties} />
          </Pane>
        ) : null}
        <AreaLayers areas={areas} selectedId={selectedId} visible={layers.areas} mode={mode} latest={latest} />
        <Pane name="judgements" style={{ zIndex: 440, pointerEvents: 'none' }}>
          <JudgementLayer points={layers.soundings ? (props.judged ?? []) : []} />
        </Pane>
        {layers.soundings ? (
          <Pane name="soundings" style={{ zIndex: 450, pointerEvents: pointsInteractive ? undefined : 'none' }}>
            {points.features.map((point) => {
              const [longitude, latitude] = point.geometry.coordinates;
              if (longitude === undefined || latitude === undefined) return null;
              const properties = point.properties;
              return (
                <CircleMarker
                  key={`${properties.id}-${pointsInteractive ? 'i' : 'n'}`}
                  center={[latitude, longitude]}
                  radius={5}
                  interactive={pointsInteractive}
                  pmIgnore
                  pathOptions={{ color: '#172030', weight: 1, fillColor: properties.colour ?? '#ffffff', fillOpacity: 0.95 }}
                >
                  {pointsInteractive ? (
                    <>
                      <Tooltip direction="top" offset={[0, -5]}>
                        {properties.label}
                      </Tooltip>
                      {renderPopup ? <Popup>{renderPopup(properties)}</Popup> : null}
                    </>
                  ) : null}
                </CircleMarker>
              );
            })}
          </Pane>
        ) : null}
      </MapContainer>
      {boundaryProblem ? <p className="mt-1 text-[13px] text-danger">{boundaryProblem}</p> : null}
    </div>
  );
}
