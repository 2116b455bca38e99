import { asc, desc, eq } from 'drizzle-orm';
import type { AuditTrail, CommentInput, CommentList, ReviewComment } from '../../shared/contracts/workflow';
import { appError, type AppError } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import type { Actor } from '../auth/require-role';
import type { Database } from '../db/client';
import { auditEvents, outlookComments, outlooks, riskAreas, users } from '../db/schema';
import { findOffice } from './office.service';


export async function listComments(db: Database, outlookId: string): Promise<Result<CommentList, AppError>> {
  const [exists] = await db.select({ id: outlooks.id }).from(outlooks).where(eq(outlooks.id, outlookId));
  if (!exists) return err(appError('NOT_FOUND', 'There is no outlook with that id.'));
  const rows = await db
    .select({ comment: outlookComments, authorName: users.name })
    .from(outlookComments)
    .leftJoin(users, eq(users.id, outlookComments.authorId))
    .where(eq(outlookComments.outlookId, outlookId))
    .orderBy(asc(outlookComments.createdAt));
  return ok({
    comments: rows.map((r) => ({ id: r.comment.id, body: r.comment.body, riskAreaId: r.comment.riskAreaId, revisionNumber: r.comment.revisionNumber, authorName: r.authorName, createdAt: r.comment.createdAt.toISOString() })),
  });
}

/** Adds a review comment, general or pinned to one of the outlook's areas, against the current version. */
export async function addComment(db: Database, actor: Actor, outlookId: string, input: CommentInput): Promise<Result<ReviewComment, AppError>> {
  const [outlook] = await db.select().from(outlooks).where(eq(outlooks.id, outlookId));
  if (!outlook) return err(appError('NOT_FOUND', 'There is no outlook with that id.'));
  if (input.riskAreaId) {
    const [area] = await db.select({ outlookId: riskAreas.outlookId }).from(riskAreas).where(eq(riskAreas.id, input.riskAreaId));
    if (!area || area.outlookId !== outlookId) {
      return err(appError('VALIDATION_FAILED', 'That area is not part of this outlook.', { issues: [{ path: 'riskAreaId', message: 'Pick an area of this outlook.' }] }));
    }
  }
  const [row] = await db.insert(outlookComments).values({ outlookId, riskAreaId: input.riskAreaId ?? null, revisionNumber: outlook.version, authorId: actor.userId, body: input.body }).returning();
  if (!row) throw new Error('comment insert returned no row');
  const office = await findOffice(db);
  if (office) await db.insert(auditEvents).values({ officeId: office.id, outlookId, actorId: actor.userId, action: 'comment', details: { commentId: row.id } });
  return ok({ id: row.id, body: row.body, riskAreaId: row.riskAreaId, revisionNumber: row.revisionNumber, authorName: actor.name, createdAt: row.createdAt.toISOString() });
}


/** The append-only audit trail of one outlook, newest first. */
export async function listAudit(db: Database, outlookId: string): Promise<Result<AuditTrail, AppError>> {
  const [exists] = await db.select({ id: outlooks.id }).from(outlooks).where(eq(outlooks.id, outlookId));
  if (!exists) return err(appError('NOT_FOUND', 'There is no outlook with that id.'));
  const rows = await db
    .select({ event: auditEvents, actorName: users.name })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorId))
    .where(eq(auditEvents.outlookId, outlookId))
    .orderBy(desc(auditEvents.createdAt));
  return ok({
    events: rows.map((r) => ({ id: r.event.id, action: r.event.action, fromState: r.event.fromState, toState: r.event.toState, comment: r.event.comment, details: r.event.details, actorName: r.actorName, createdAt: r.event.createdAt.toISOString() })),
  });
}
