import { issuanceSnapshotSchema } from '../../shared/contracts/issuances';
import { asc, eq } from 'drizzle-orm';
import { bboxPolygon, booleanIntersects } from '@turf/turf';
import type { Feature, Geometry, MultiPolygon } from 'geojson';
import { isInForce } from '../../shared/issuances/in-force';
import { withRfc7946Winding } from '../../shared/geometry/winding';
import { appError, type AppError } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import { ogcDefaultLimit, type Bbox, type OgcCollectionId, type OgcItemsQuery, type TimeInterval } from '../../shared/contracts/ogc';
import type { RiskArea } from '../../shared/contracts/outlooks';
import type { RiskLevel } from '../../shared/contracts/office';
import type { DatabaseOrTransaction } from '../db/client';
import { issuances } from '../db/schema';
import { capUrl } from './cap.service';
import { findOffice } from './office.service';
import { publicCaution } from '../../shared/workflow/caution';

/** Conformance classes claimed: Part 1 Core and GeoJSON (JSON only, no HTML, no OpenAPI class). */
export const ogcConformance = ['http://www.opengis.net/spec/ogcapi-features-1/1.0/conf/core', 'http://www.opengis.net/spec/ogcapi-features-1/1.0/conf/geojson'] as const;
export const crs84 = 'http://www.opengis.net/def/crs/OGC/1.3/CRS84';
const json = 'application/json';
const geojson = 'application/geo+json';
export const openApiMediaType = 'application/vnd.oai.openapi+json;version=3.0';

export interface OgcLink {
  href: string;
  rel: string;
  type: string;
  title?: string;
}

type IssuanceRow = typeof issuances.$inferSelect;
const base = (publicUrl: string) => `${publicUrl}/api/ogc`;

const collectionInfo: Record<OgcCollectionId, { title: string; description: string }> = {
  'risk-areas': {
    title: 'Current risk areas',
    description: 'Risk areas of the outlooks in force now (not superseded, withdrawn or expired), one feature per area, with its level, hazards and valid period.',
  },
  issuances: {
    title: 'Issuances',
    description: 'Every published issuance (current, superseded and withdrawn), one feature per issuance whose geometry gathers its risk areas; filter by valid period with datetime.',
  },
};

/** The landing page: links to the API definition, the conformance declaration and the collections. */
export function landingPage(publicUrl: string, officeName: string) {
  const root = base(publicUrl);
  return {
    title: `${officeName}: severe-thunderstorm outlooks (OGC API – Features)`,
    description: `Outlook risk areas and issuances as GeoJSON features. ${publicCaution}`,
    caution: publicCaution,
    links: [
      { href: root, rel: 'self', type: json, title: 'This document' },
      { href: `${root}/api`, rel: 'service-desc', type: openApiMediaType, title: 'The API definition (OpenAPI 3.0)' },
      { href: `${root}/conformance`, rel: 'conformance', type: json, title: 'Conformance classes implemented' },
      { href: `${root}/collections`, rel: 'data', type: json, title: 'The feature collections' },
    ] satisfies OgcLink[],
  };
}

export function conformance() {
  return { conformsTo: [...ogcConformance] };
}

function inForceRows(rows: IssuanceRow[], now: Date) {
  return rows.filter((row) => isInForce(row, now));
}

async function rowsFor(db: DatabaseOrTransaction, collectionId: OgcCollectionId): Promise<IssuanceRow[]> {
  const query = db.select().from(issuances);
  return collectionId === 'risk-areas' ? query.where(eq(issuances.state, 'published')).orderBy(asc(issuances.publishedAt)) : query.orderBy(asc(issuances.publishedAt));
}

function collectionDocument(publicUrl: string, id: OgcCollectionId, region: { west: number; south: number; east: number; north: number }, rows: IssuanceRow[]) {
  const root = base(publicUrl);
  const starts = rows.map((r) => r.validFrom.getTime());
  const ends = rows.map((r) => r.validUntil.getTime());
  return {
    id,
    title: collectionInfo[id].title,
    description: `${collectionInfo[id].description} ${publicCaution}`,
    itemType: 'feature',
    crs: [crs84],
    extent: {
      spatial: { bbox: [[region.west, region.south, region.east, region.north]], crs: crs84 },
      temporal: { interval: [[starts.length ? new Date(Math.min(...starts)).toISOString() : null, ends.length ? new Date(Math.max(...ends)).toISOString() : null]], trs: 'http://www.opengis.net/def/uom/ISO-8601/0/Gregorian' },
    },
    links: [
      { href: `${root}/collections/${id}`, rel: 'self', type: json, title: collectionInfo[id].title },
      { href: `${root}/collections/${id}/items`, rel: 'items', type: geojson, title: `${collectionInfo[id].title} as GeoJSON` },
    ] satisfies OgcLink[],
  };
}

async function officeRegion(db: DatabaseOrTransaction) {
  const office = await findOffice(db);
  return { name: office?.name ?? 'Stormdraft', region: office?.region ?? { west: -180, south: -90, east: 180, north: 90 } };
}

export async function listCollections(db: DatabaseOrTransaction, publicUrl: string, now: Date) {
  const { region } = await officeRegion(db);
  const published = await rowsFor(db, 'risk-areas');
  const all = await rowsFor(db, 'issuances');
  return {
    links: [{ href: `${base(publicUrl)}/collections`, rel: 'self', type: json, title: 'The feature collections' }] satisfies OgcLink[],
    collections: [collectionDocument(publicUrl, 'risk-areas', region, inForceRows(published, now)), collectionDocument(publicUrl, 'issuances', region, all)],
  };
}

export async function getCollection(db: DatabaseOrTransaction, publicUrl: string, id: OgcCollectionId, now: Date) {
  const { region } = await officeRegion(db);
  const rows = await rowsFor(db, id);
  return collectionDocument(publicUrl, id, region, id === 'risk-areas' ? inForceRows(rows, now) : rows);
}

interface Snapshot {
  headline: string;
  ladder: RiskLevel[];
  areas: RiskArea[];
}
function snapshotOf(row: IssuanceRow): Snapshot {
  const s = issuanceSnapshotSchema.parse(row.snapshot);
  return { headline: s.headline, ladder: s.riskLadder, areas: s.areas.map((a, i) => ({ ...a, sortOrder: a.sortOrder ?? i })) };
}

const featureIdOf = (number: string, index: number) => `${number}-${index + 1}`;

function riskAreaFeatures(row: IssuanceRow, publicUrl: string): Feature[] {
  const s = snapshotOf(row);
  return s.areas.map((area, index) => {
    const level = s.ladder.find((l) => l.key === area.levelKey);
    return {
      type: 'Feature',
      id: featureIdOf(row.number, index),
      geometry: withRfc7946Winding(area.geometry),
      properties: {
        issuance: row.number,
        day: row.day,
        level: area.levelKey,
        levelLabel: level?.label ?? area.levelKey,
        levelRank: s.ladder.findIndex((l) => l.key === area.levelKey) + 1,
        colour: level?.colour ?? null,
        hazards: area.hazards.map((h) => h.hazard).join(','),
        significantHazards: area.hazards.filter((h) => h.significant).map((h) => h.hazard).join(','),
        label: area.label,
        headline: s.headline,
        validFrom: row.validFrom.toISOString(),
        validUntil: row.validUntil.toISOString(),
        capUrl: capUrl(publicUrl, row.number),
        caution: publicCaution,
      },
    };
  });
}

function issuanceFeature(row: IssuanceRow, publicUrl: string, now: Date, numbers: Map<string, string>): Feature<Geometry | null> {
  const s = snapshotOf(row);
  const polygons = s.areas.flatMap((area) => {
    const wound = withRfc7946Winding(area.geometry);
    return wound.type === 'Polygon' ? [wound.coordinates] : wound.coordinates;
  });
  const geometry: MultiPolygon | null = polygons.length ? { type: 'MultiPolygon', coordinates: polygons } : null;
  return {
    type: 'Feature',
    id: row.number,
    geometry,
    properties: {
      issuance: row.number,
      day: row.day,
      state: row.state,
      inForce: isInForce(row, now),
      headline: s.headline,
      highestLevel: [...s.ladder].reverse().find((l) => s.areas.some((a) => a.levelKey === l.key))?.key ?? null,
      validFrom: row.validFrom.toISOString(),
      validUntil: row.validUntil.toISOString(),
      publishedAt: row.publishedAt.toISOString(),
      supersedes: row.supersedesId ? (numbers.get(row.supersedesId) ?? null) : null,
      supersededBy: row.supersededById ? (numbers.get(row.supersededById) ?? null) : null,
      withdrawnReason: row.withdrawnReason,
      capUrl: capUrl(publicUrl, row.number),
      caution: publicCaution,
    },
  };
}

function overlapsTime(row: IssuanceRow, interval: TimeInterval): boolean {
  // Closed intervals: the valid period [validFrom, validUntil] meets the requested one.
  if (interval.end && row.validFrom.getTime() > interval.end.getTime()) return false;
  if (interval.start && row.validUntil.getTime() < interval.start.getTime()) return false;
  return true;
}

function intersectsBbox(feature: Feature<Geometry | null>, bbox: Bbox): boolean {
  const geometry = feature.geometry;
  if (!geometry) return false;
  const [minLon, minLat, maxLon, maxLat] = bbox;
  // A box whose west edge is east of its east edge crosses the antimeridian: test both halves.
  const boxes: Bbox[] = minLon <= maxLon ? [bbox] : [[minLon, minLat, 180, maxLat], [-180, minLat, maxLon, maxLat]];
  return boxes.some((box) => booleanIntersects(geometry, bboxPolygon(box)));
}

async function allFeatures(db: DatabaseOrTransaction, publicUrl: string, id: OgcCollectionId, now: Date, time?: TimeInterval): Promise<Feature<Geometry | null>[]> {
  const rows = await rowsFor(db, id);
  const timed = (id === 'risk-areas' ? inForceRows(rows, now) : rows).filter((row) => !time || overlapsTime(row, time));
  if (id === 'risk-areas') return timed.flatMap((row) => riskAreaFeatures(row, publicUrl));
  const numbers = new Map(rows.map((r) => [r.id, r.number]));
  return timed.map((row) => issuanceFeature(row, publicUrl, now, numbers));
}

function itemsHref(publicUrl: string, id: OgcCollectionId, query: OgcItemsQuery, rawQuery: Record<string, string>, offset: number): string {
  const params = new URLSearchParams();
  for (const key of ['bbox', 'datetime'] as const) if (rawQuery[key] !== undefined) params.set(key, rawQuery[key]);
  params.set('limit', String(query.limit ?? ogcDefaultLimit));
  if (offset > 0) params.set('offset', String(offset));
  return `${base(publicUrl)}/collections/${id}/items?${params.toString()}`;
}

/** The items of a collection as a GeoJSON FeatureCollection, filtered by bbox and datetime, one page at a time. */
export async function listItems(db: DatabaseOrTransaction, publicUrl: string, id: OgcCollectionId, query: OgcItemsQuery, rawQuery: Record<string, string>, now: Date) {
  const limit = query.limit ?? ogcDefaultLimit;
  const offset = query.offset ?? 0;
  const features = (await allFeatures(db, publicUrl, id, now, query.datetime)).filter((f) => !query.bbox || intersectsBbox(f, query.bbox));
  const page = features.slice(offset, offset + limit);
  const links: OgcLink[] = [
    { href: itemsHref(publicUrl, id, query, rawQuery, offset), rel: 'self', type: geojson, title: 'This page' },
    { href: `${base(publicUrl)}/collections/${id}`, rel: 'collection', type: json, title: collectionInfo[id].title },
  ];
  if (offset + page.length < features.length) links.push({ href: itemsHref(publicUrl, id, query, rawQuery, offset + page.length), rel: 'next', type: geojson, title: 'Next page' });
  return {
    type: 'FeatureCollection' as const,
    features: page,
    links,
    timeStamp: now.toISOString(),
    numberMatched: features.length,
    numberReturned: page.length,
    caution: publicCaution,
  };
}

/** One feature with its self and collection links; 404 when it is not (or no longer) in the collection. */
export async function getItem(db: DatabaseOrTransaction, publicUrl: string, id: OgcCollectionId, featureId: string, now: Date): Promise<Result<Feature<Geometry | null> & { links: OgcLink[] }, AppError>> {
  const feature = (await allFeatures(db, publicUrl, id, now)).find((f) => f.id === featureId);
  if (!feature) return err(appError('NOT_FOUND', id === 'risk-areas' ? `There is no current risk area ${featureId} (areas of expired, superseded or withdrawn issuances leave this collection).` : `There is no issuance ${featureId}.`));
  return ok({
    ...feature,
    links: [
      { href: `${base(publicUrl)}/collections/${id}/items/${encodeURIComponent(featureId)}`, rel: 'self', type: geojson, title: 'This feature' },
      { href: `${base(publicUrl)}/collections/${id}`, rel: 'collection', type: json, title: collectionInfo[id].title },
    ],
  });
}

export async function officeName(db: DatabaseOrTransaction): Promise<string> {
  return (await officeRegion(db)).name;
}
