import { and, desc, eq, max } from 'drizzle-orm';
import type { Role } from '../../shared/contracts/common';
import type { OutlookState } from '../../shared/contracts/outlooks';
import type { TransitionInput, WorkflowAction } from '../../shared/contracts/workflow';
import { defaultGuidanceThresholds, type GuidanceThresholds } from '../../shared/evidence/support-check';
import { appError, type AppError } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import type { Actor } from '../auth/require-role';
import type { Database, Transaction } from '../db/client';
import { auditEvents, issuances, outlooks, users } from '../db/schema';
import type { Config } from '../config';
import { queueIssuanceNotices } from './distribution.service';
import { findOffice } from './office.service';
import { buildEvidenceReport, evidenceSoundings, getOutlook } from './outlooks.service';

interface TransitionRule {
  from: readonly OutlookState[];
  to: OutlookState;
  roles: readonly Role[];
  commentRequired?: boolean;
}

/**
 * The one table of workflow transitions. Each names the states it leaves from, the state it
 * reaches and the roles allowed; rules beyond that (four-eyes, comments) are checked below.
 */
export const transitions: Record<WorkflowAction, TransitionRule> = {
  submit: { from: ['draft', 'returned'], to: 'in_review', roles: ['forecaster', 'lead'] },
  return: { from: ['in_review', 'approved'], to: 'returned', roles: ['lead'], commentRequired: true },
  approve: { from: ['in_review'], to: 'approved', roles: ['lead'] },
  publish: { from: ['approved'], to: 'published', roles: ['lead'] },
};

export interface PublishHooks {
  /** Test hook: runs inside the publish transaction right after the issuance row is written. */
  afterIssuanceWritten?: () => void | Promise<void>;
}

const stateWords: Record<OutlookState, string> = { draft: 'a draft', in_review: 'in review', returned: 'returned', approved: 'approved', published: 'published' };

/**
 * Moves an outlook through the workflow. Role, state, version and the four-eyes rule are
 * checked; the change and its audit event are written in one transaction. Publishing also
 * writes the immutable issuance in that same transaction (and supersedes the issuance an
 * amendment replaces).
 */
export async function transitionOutlook(
  db: Database,
  config: Config,
  actor: Actor,
  outlookId: string,
  action: WorkflowAction,
  input: TransitionInput,
  hooks: PublishHooks = {},
): Promise<Result<{ outlookId: string; state: OutlookState; version: number; issuanceNumber?: string }, AppError>> {
  const rule = transitions[action];
  if (!rule.roles.includes(actor.role)) {
    return err(appError('FORBIDDEN', `Your role (${actor.role}) cannot ${action} an outlook; ${rule.roles.join(' or ')} can.`));
  }
  if (rule.commentRequired && !input.comment) {
    return err(appError('VALIDATION_FAILED', 'Say what needs changing: a comment is required to return an outlook.', { issues: [{ path: 'comment', message: 'A comment is required.' }] }));
  }
  const office = await findOffice(db);
  if (!office) throw new Error('no office');
  return db.transaction(async (tx) => {
    const [current] = await tx.select().from(outlooks).where(eq(outlooks.id, outlookId));
    if (!current) return err(appError('NOT_FOUND', 'There is no outlook with that id.'));
    if (!rule.from.includes(current.state)) {
      return err(appError('CONFLICT', `This outlook is ${stateWords[current.state]}; it cannot be ${action === 'return' ? 'returned' : `${action}${action.endsWith('e') ? 'd' : 'ed'}`} now.`));
    }
    if (current.version !== input.version) {
      return err(appError('CONFLICT', 'The outlook changed since you opened it. Reload and look again before you act.', { details: { currentVersion: current.version } }));
    }
    const details: Record<string, unknown> = {};
    if (action === 'approve' && current.lastEditedBy === actor.userId) {
      if (!office.allowSelfApproval) {
        return err(appError('FORBIDDEN', 'You edited this draft last, so another lead must approve it (four-eyes rule).'));
      }
      details.fourEyesRelaxed = true;
    }
    const [updated] = await tx
      .update(outlooks)
      .set({ state: rule.to, version: current.version + 1, updatedAt: new Date() })
      .where(and(eq(outlooks.id, outlookId), eq(outlooks.version, input.version)))
      .returning();
    if (!updated) return err(appError('CONFLICT', 'The outlook changed while you acted. Reload and try again.'));
    let issuanceNumber: string | undefined;
    let issuanceId: string | undefined;
    if (action === 'publish') {
      const issued = await writeIssuance(tx, config, office, outlookId, actor, hooks);
      issuanceNumber = issued.number;
      issuanceId = issued.id;
      details.issuanceNumber = issued.number;
    }
    await tx.insert(auditEvents).values({ officeId: office.id, outlookId, issuanceId, actorId: actor.userId, action, fromState: current.state, toState: rule.to, comment: input.comment ?? null, details });
    return ok({ outlookId, state: rule.to, version: updated.version, ...(issuanceNumber ? { issuanceNumber } : {}) });
  });
}

type OfficeRow = NonNullable<Awaited<ReturnType<typeof findOffice>>>;

/** Writes the issuance: next number of the office's year, frozen snapshot with evidence and support. */
async function writeIssuance(tx: Transaction, config: Config, office: OfficeRow, outlookId: string, actor: Actor, hooks: PublishHooks) {
  const outlook = await getOutlook(tx, outlookId);
  if (!outlook.ok) throw new Error('outlook vanished while publishing');
  const o = outlook.value;
  const now = new Date();
  const year = now.getUTCFullYear();
  const [last] = await tx
    .select({ value: max(issuances.sequence) })
    .from(issuances)
    .where(and(eq(issuances.officeId, office.id), eq(issuances.year, year)));
  const sequence = (last?.value ?? 0) + 1;
  const number = `${year}-${String(sequence).padStart(4, '0')}`;
  const [approval] = await tx
    .select({ actorId: auditEvents.actorId, name: users.name })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorId))
    .where(and(eq(auditEvents.outlookId, outlookId), eq(auditEvents.action, 'approve')))
    .orderBy(desc(auditEvents.createdAt))
    .limit(1);
  const [author] = o.createdBy ? await tx.select({ name: users.name }).from(users).where(eq(users.id, o.createdBy)) : [];
  const guidance = (Object.keys(office.guidanceThresholds).length ? office.guidanceThresholds : defaultGuidanceThresholds) as GuidanceThresholds;
  const candidates = await evidenceSoundings(tx, new Date(o.validFrom), new Date(o.validUntil));
  const evidence = buildEvidenceReport(o, candidates, office.riskLadder, guidance, office.region).map((r) => ({
    areaId: r.areaId,
    levelKey: r.levelKey,
    count: r.evidence.count,
    medians: Object.fromEntries(Object.entries(r.evidence.stats).map(([k, v]) => [k, v?.median ?? null])),
    support: r.support,
  }));
  const snapshot = {
    number,
    office: { name: office.name, timeZone: office.timeZone, region: office.region },
    riskLadder: office.riskLadder,
    day: o.day,
    validFrom: o.validFrom,
    validUntil: o.validUntil,
    headline: o.headline,
    discussion: o.discussion,
    hazardNotes: o.hazardNotes,
    areas: o.areas,
    evidence,
    authorName: author?.name ?? null,
    approverName: approval?.name ?? null,
    publisherName: actor.name,
    publishedAt: now.toISOString(),
  };
  const [row] = await tx
    .insert(issuances)
    .values({
      officeId: office.id,
      outlookId,
      number,
      year,
      sequence,
      day: o.day,
      validFrom: new Date(o.validFrom),
      validUntil: new Date(o.validUntil),
      snapshot,
      supersedesId: o.amendsIssuanceId,
      authorId: o.createdBy,
      approverId: approval?.actorId ?? null,
      publishedAt: now,
    })
    .returning({ id: issuances.id });
  if (!row) throw new Error('issuance insert returned no row');
  await hooks.afterIssuanceWritten?.();
  if (o.amendsIssuanceId) {
    await tx.update(issuances).set({ state: 'superseded', supersededById: row.id }).where(and(eq(issuances.id, o.amendsIssuanceId), eq(issuances.state, 'published')));
    await tx.insert(auditEvents).values({ officeId: office.id, issuanceId: o.amendsIssuanceId, actorId: actor.userId, action: 'supersede', fromState: 'published', toState: 'superseded', details: { supersededBy: number } });
  }
  // Mail is queued in this same transaction (durable outbox); the worker sends after commit.
  await queueIssuanceNotices(tx, config, office, { id: row.id, number, day: o.day, validFrom: o.validFrom, validUntil: o.validUntil, supersedesId: o.amendsIssuanceId, headline: o.headline, discussion: o.discussion, areas: o.areas });
  return { id: row.id, number };
}
