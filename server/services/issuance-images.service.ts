import { and, eq, inArray } from 'drizzle-orm';
import type { AppError } from '../../shared/errors';
import { ok, type Result } from '../../shared/result';
import type { DatabaseOrTransaction } from '../db/client';
import { issuanceImages, type OutboxAttachment } from '../db/schema';
import type { MapImageInput } from '../exports/map-image';
import { runGeometryTask } from '../workers/geometry-pool';

export interface CachedImage {
  id: string;
  format: 'svg' | 'png';
  /** SVG text, or the PNG in base64. */
  content: string;
}

/**
 * An issuance's map image, rendered once and then read from the cache: issuances never change,
 * so a variant (the public map in a given state, or the map for one set of a subscriber's
 * areas) is drawn in the worker pool the first time it is asked for and stored. A worker that
 * dies while drawing is replaced and the drawing retried; if it keeps failing the caller gets
 * SERVICE_UNAVAILABLE and the server carries on.
 */
export async function cachedIssuanceImage(db: DatabaseOrTransaction, issuanceId: string, variant: string, format: 'svg' | 'png', input: () => MapImageInput): Promise<Result<CachedImage, AppError>> {
  const [cached] = await db
    .select({ id: issuanceImages.id, format: issuanceImages.format, content: issuanceImages.content })
    .from(issuanceImages)
    .where(and(eq(issuanceImages.issuanceId, issuanceId), eq(issuanceImages.variant, variant), eq(issuanceImages.format, format)));
  if (cached) return ok(cached);
  const rendered = await runGeometryTask({ kind: 'render-map', input: input(), format });
  if (!rendered.ok) return rendered;
  // Two requests may draw the same image at once; the first stored copy wins.
  await db.insert(issuanceImages).values({ issuanceId, variant, format, content: rendered.value }).onConflictDoNothing();
  const [stored] = await db
    .select({ id: issuanceImages.id, format: issuanceImages.format, content: issuanceImages.content })
    .from(issuanceImages)
    .where(and(eq(issuanceImages.issuanceId, issuanceId), eq(issuanceImages.variant, variant), eq(issuanceImages.format, format)));
  if (!stored) throw new Error('issuance image vanished after insert');
  return ok(stored);
}

/** The bytes of a cached image: PNGs are stored in base64, SVGs as text. */
export const imageBytes = (image: Pick<CachedImage, 'format' | 'content'>): Buffer => (image.format === 'png' ? Buffer.from(image.content, 'base64') : Buffer.from(image.content, 'utf8'));

/** A queued message's attachments as bytes; alert maps are read from the image cache by id. */
export async function outboxAttachmentContents(db: DatabaseOrTransaction, attachments: readonly OutboxAttachment[]): Promise<{ filename: string; cid: string; contentType: string; content: Buffer }[]> {
  const ids = attachments.flatMap((a) => (a.issuanceImageId ? [a.issuanceImageId] : []));
  const images = ids.length ? await db.select({ id: issuanceImages.id, format: issuanceImages.format, content: issuanceImages.content }).from(issuanceImages).where(inArray(issuanceImages.id, ids)) : [];
  const byId = new Map(images.map((image) => [image.id, image]));
  return attachments.map((a) => {
    const image = a.issuanceImageId ? byId.get(a.issuanceImageId) : undefined;
    return { filename: a.filename, cid: a.cid, contentType: a.contentType, content: image ? imageBytes(image) : Buffer.from(a.contentBase64, 'base64') };
  });
}
