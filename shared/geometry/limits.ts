/**
 * Size limits for drawn and imported areas. The server refuses larger input with a 400 that
 * names the field and the limit; the client shows the same numbers while drawing. They keep
 * every geometry check, evidence request and alert match bounded in time.
 */
export const MAX_VERTICES_PER_AREA = 10_000;
/** All risk areas of one outlook save together. */
export const MAX_VERTICES_PER_OUTLOOK = 50_000;
/** One area of interest a subscriber draws (counties and states come from our own data). */
export const MAX_VERTICES_PER_AREA_OF_INTEREST = 5_000;
/** All drawn areas of interest of one subscription together. */
export const MAX_VERTICES_PER_SUBSCRIPTION = 20_000;

/** Number of positions in a Polygon or MultiPolygon, every ring counted (closing positions included). */
export function countVertices(geometry: { type: 'Polygon'; coordinates: readonly (readonly unknown[])[] } | { type: 'MultiPolygon'; coordinates: readonly (readonly (readonly unknown[])[])[] }): number {
  let count = 0;
  if (geometry.type === 'Polygon') {
    for (const ring of geometry.coordinates) count += ring.length;
  } else {
    for (const polygon of geometry.coordinates) for (const ring of polygon) count += ring.length;
  }
  return count;
}

/** The user-facing sentence for an area over its vertex limit. */
export function tooManyVerticesMessage(what: string, count: number, limit: number): string {
  return `${what} has ${count.toLocaleString('en-US')} points; the limit is ${limit.toLocaleString('en-US')}. Simplify the outline and try again.`;
}
