import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { geoMercator, geoPath } from 'd3-geo';
import { mesh } from 'topojson-client';
import type { GeometryCollection, Topology } from 'topojson-specification';
import type { Feature, Geometry, MultiLineString } from 'geojson';
import { Resvg } from '@resvg/resvg-js';
import { buffer } from '@turf/turf';
import type { Region, RiskLevel } from '../../shared/contracts/office';
import type { AreaGeometry, RiskArea } from '../../shared/contracts/outlooks';
import { withRfc7946Winding } from '../../shared/geometry/winding';
import { escapeHtml } from '../../shared/text/escape-html';

const require = createRequire(import.meta.url);
const fontFiles = ['PublicSans-Regular.ttf', 'PublicSans-SemiBold.ttf'].map((f) => require.resolve(`public-sans/binaries/webfonts/${f}`));

let stateLines: MultiLineString | undefined;
let countyLines: MultiLineString | undefined;
/** State and county boundaries from us-atlas (offline), read once. */
function boundaries(): { states: MultiLineString; counties: MultiLineString } {
  if (!stateLines || !countyLines) {
    // eslint-disable-next-line @typescript-eslint/no-unsafe-type-assertion -- the file ships in the pinned us-atlas package with these two objects.
    const topology = JSON.parse(readFileSync(require.resolve('us-atlas/counties-10m.json'), 'utf8')) as Topology<{ states: GeometryCollection; counties: GeometryCollection }>;
    stateLines = mesh(topology, topology.objects.states);
    countyLines = mesh(topology, topology.objects.counties, (a, b) => a !== b);
  }
  return { states: stateLines, counties: countyLines };
}

export interface MapImageInput {
  title: string;
  subtitle: string;
  region: Region;
  ladder: RiskLevel[];
  areas: Pick<RiskArea, 'levelKey' | 'geometry' | 'hazards'>[];
  caution: string;
  /** An outline drawn over the risk areas (e.g. a subscriber's area of interest). */
  highlight?: AreaGeometry;
  width?: number;
}

/**
 * d3-geo reads polygons on the sphere with exterior rings clockwise (the opposite of RFC 7946);
 * a counterclockwise ring would mean "everything but this area".
 */
function forD3(geometry: AreaGeometry): Geometry {
  const rfc = withRfc7946Winding(geometry);
  const flip = (rings: [number, number][][]) => rings.map((ring) => [...ring].reverse());
  return rfc.type === 'Polygon' ? { type: 'Polygon', coordinates: flip(rfc.coordinates) } : { type: 'MultiPolygon', coordinates: rfc.coordinates.map(flip) };
}

/** How far inside an area its significant-hazard outline runs. */
const insetKm = 6;


/**
 * The risk map as SVG: offline state and county lines, risk areas in ladder order with their
 * colours, significant hazards with a bold inner outline, a legend that always names the level,
 * the title and the caution. Rendered on the server (d3-geo, Mercator fitted to the region).
 */
export function renderMapSvg(input: MapImageInput): string {
  const width = input.width ?? 900;
  const mapHeight = Math.round(width * 0.62);
  const header = 64;
  const legendHeight = 28 * Math.ceil(input.ladder.length / 3) + 16;
  const footer = 56;
  const height = header + mapHeight + legendHeight + footer;
  const { west, south, east, north } = input.region;
  const frame: Feature = { type: 'Feature', properties: {}, geometry: forD3({ type: 'Polygon', coordinates: [[[west, south], [east, south], [east, north], [west, north], [west, south]]] }) };
  const projection = geoMercator().fitExtent([[12, header + 8], [width - 12, header + mapHeight - 8]], frame);
  const path = geoPath(projection);
  const { states, counties } = boundaries();
  const order = new Map(input.ladder.map((l, i) => [l.key, i]));
  const areas = [...input.areas].sort((a, b) => (order.get(a.levelKey) ?? 0) - (order.get(b.levelKey) ?? 0));
  const colour = (key: string) => input.ladder.find((l) => l.key === key)?.colour ?? '#999999';
  const areaPaths = areas
    .map((a) => {
      const d = path(forD3(a.geometry)) ?? '';
      const significant = a.hazards.some((h) => h.significant);
      // Significant hazards: a bold outline just inside the area (the area shrunk by a few km).
      const shrunk = significant ? buffer(a.geometry, -insetKm, { units: 'kilometers' }) : undefined;
      // eslint-disable-next-line @typescript-eslint/no-unsafe-type-assertion -- Turf's buffer of an area answers a Polygon or MultiPolygon of [longitude, latitude] positions.
      const inner = shrunk && shrunk.geometry ? `<path d="${path(forD3(shrunk.geometry as AreaGeometry)) ?? ''}" fill="none" stroke="#111827" stroke-width="3"/>` : '';
      return `<path d="${d}" fill="${colour(a.levelKey)}" fill-opacity="0.85" stroke="#1f2a44" stroke-width="1"/>${inner}`;
    })
    .join('');
  const legend = input.ladder
    .map((level, i) => {
      const x = 16 + (i % 3) * ((width - 32) / 3);
      const y = header + mapHeight + 12 + Math.floor(i / 3) * 28;
      return `<rect x="${x}" y="${y}" width="22" height="18" rx="3" fill="${level.colour}" stroke="#1f2a44" stroke-width="0.5"/><text x="${x + 30}" y="${y + 14}" font-size="14" fill="#1f2a44">${escapeHtml(level.label)}</text>`;
    })
    .join('');
  const highlight = input.highlight ? `<path d="${path(forD3(input.highlight)) ?? ''}" fill="none" stroke="#b45309" stroke-width="3" stroke-dasharray="8 4"/>` : '';
  const clipId = 'map-frame';
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" font-family="Public Sans">`,
    `<rect width="${width}" height="${height}" fill="#ffffff"/>`,
    `<text x="16" y="28" font-size="20" font-weight="600" fill="#1f2a44">${escapeHtml(input.title)}</text>`,
    `<text x="16" y="50" font-size="14" fill="#4b5563">${escapeHtml(input.subtitle)}</text>`,
    `<clipPath id="${clipId}"><rect x="12" y="${header}" width="${width - 24}" height="${mapHeight}"/></clipPath>`,
    `<g clip-path="url(#${clipId})"><rect x="12" y="${header}" width="${width - 24}" height="${mapHeight}" fill="#f5f7fa"/>`,
    areaPaths,
    `<path d="${path(counties) ?? ''}" fill="none" stroke="#9aa3b2" stroke-width="0.4" stroke-opacity="0.7"/>`,
    `<path d="${path(states) ?? ''}" fill="none" stroke="#4b5563" stroke-width="1.2"/>`,
    highlight,
    `</g>`,
    `<rect x="12" y="${header}" width="${width - 24}" height="${mapHeight}" fill="none" stroke="#d6dbe4"/>`,
    legend,
    `<text x="16" y="${height - 30}" font-size="12" fill="#3f2a05">${escapeHtml(input.caution)}</text>`,
    `<text x="16" y="${height - 12}" font-size="11" fill="#6b7280">Stormdraft · map data: US Census Bureau boundaries via us-atlas</text>`,
    `</svg>`,
  ].join('');
}

/** The same map as PNG (resvg with the bundled Public Sans, no system fonts needed). */
export function renderMapPng(input: MapImageInput): Buffer {
  const svg = renderMapSvg(input);
  const resvg = new Resvg(svg, { font: { fontFiles, loadSystemFonts: false, defaultFontFamily: 'Public Sans' }, fitTo: { mode: 'original' } });
  return resvg.render().asPng();
}

