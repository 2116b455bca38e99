import { and, desc, eq, sql } from 'drizzle-orm';
import type { IssuanceSnapshotInput } from '../../shared/contracts/issuances';
import type { SupportGuidance } from '../../shared/contracts/office';
import type { TransitionInput, TransitionResult, WorkflowAction } from '../../shared/contracts/workflow';
import { checkTransition, transitions } from '../../shared/workflow/transitions';
import { appError, type AppError } from '../../shared/errors';
import { isInForce } from '../../shared/issuances/in-force';
import { err, ok, type Result } from '../../shared/result';
import type { Actor } from '../auth/require-role';
import type { Database, Transaction } from '../db/client';
import { auditEvents, issuanceCounters, issuances, outlooks, users } from '../db/schema';
import type { Config } from '../config';
import { enqueueDistribution, notifyDistributionQueued } from './distribution.service';
import { findOffice, officeGuidance } from './office.service';
import { evidenceSoundings, getOutlook, reviewEditorIds } from './outlooks.service';
import { gridEvidenceOf } from './grid-evidence.service';
import { runGeometryTask } from '../workers/geometry-pool';
import { queueWebhookEvents } from './webhooks.service';

export interface PublishHooks {
  /** Test hook: runs inside the publish transaction right after the issuance row is written. */
  afterIssuanceWritten?: () => void | Promise<void>;
}

/**
 * Moves an outlook through the workflow. Role, state and the four-eyes rule are checked by the
 * shared transition rules (shared/workflow/transitions.ts, the same function that draws the
 * client's buttons), then the version; the change and its audit event are written in one transaction. Publishing also
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
): Promise<Result<TransitionResult, AppError>> {
  const rule = transitions[action];
  const office = await findOffice(db);
  if (!office) throw new Error('no office');
  // The frozen evidence is computed before the transaction, in the worker pool, from the version
  // being published; the transaction refuses the publish if that version is no longer current.
  const evidence = action === 'publish' ? await publishedEvidence(db, office, outlookId) : undefined;
  if (evidence && !evidence.ok) return evidence;
  const result = await db.transaction(async (tx): Promise<Result<TransitionResult, AppError>> => {
    const [current] = await tx.select().from(outlooks).where(eq(outlooks.id, outlookId));
    if (!current) return err(appError('NOT_FOUND', 'There is no outlook with that id.'));
    const verdict = checkTransition(action, {
      state: current.state,
      role: actor.role,
      userId: actor.userId,
      reviewEditorIds: action === 'approve' ? await reviewEditorIds(tx, outlookId) : [],
      allowSelfApproval: office.allowSelfApproval,
    });
    if (!verdict.allowed) return err(appError(verdict.reason === 'state' ? 'CONFLICT' : 'FORBIDDEN', verdict.message));
    if (rule.commentRequired && !input.comment) {
      return err(appError('VALIDATION_FAILED', 'Say what needs changing: a comment is required to return an outlook.', { issues: [{ path: 'comment', message: 'A comment is required.' }] }));
    }
    if (current.version !== input.version || (evidence?.ok && evidence.value.version !== current.version)) {
      return err(appError('CONFLICT', 'The outlook changed since you opened it. Reload and look again before you act.', { details: { currentVersion: current.version } }));
    }
    const details: Record<string, unknown> = {};
    if (verdict.fourEyesRelaxed) details.fourEyesRelaxed = true;
    if (action === 'publish' && current.amendsIssuanceId) {
      const replaced = await lockReplacedIssuance(tx, current.amendsIssuanceId, new Date());
      if (!replaced.ok) return replaced;
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
      const issued = await writeIssuance(tx, config, office, outlookId, actor, hooks, evidence?.ok ? evidence.value : { evidence: [], guidance: officeGuidance(office) });
      issuanceNumber = issued.number;
      issuanceId = issued.id;
      details.issuanceNumber = issued.number;
    }
    await tx.insert(auditEvents).values({ officeId: office.id, outlookId, issuanceId, actorId: actor.userId, action, fromState: current.state, toState: rule.to, comment: input.comment ?? null, details });
    return ok({ outlookId, state: rule.to, version: updated.version, ...(issuanceNumber ? { issuanceNumber } : {}) });
  });
  // After commit: the distribution worker matches subscribers, draws the maps and queues mail.
  if (result.ok && action === 'publish') notifyDistributionQueued();
  return result;
}

type FrozenEvidence = IssuanceSnapshotInput['evidence'];

/** The evidence frozen into an issuance: per area, sounding count, medians and support (worker pool). */
async function publishedEvidence(db: Database, office: OfficeRow, outlookId: string): Promise<Result<{ version: number; evidence: FrozenEvidence; guidance: SupportGuidance }, AppError>> {
  const outlook = await getOutlook(db, outlookId);
  if (!outlook.ok) return outlook;
  const o = outlook.value;
  const guidance = officeGuidance(office);
  const candidates = await evidenceSoundings(db, new Date(o.validFrom), new Date(o.validUntil));
  // The grid soundings of the runs feeding the outlook count as they do in the evidence panel.
  const grid = await gridEvidenceOf(db, o);
  const report = await runGeometryTask({ kind: 'grid-evidence-report', input: { outlook: o, candidates, ladder: office.riskLadder, guidance, region: office.region, runs: grid.packed } });
  if (!report.ok) return report;
  return ok({
    version: o.version,
    guidance,
    evidence: report.value.areas.map((r) => ({
      areaId: r.areaId,
      levelKey: r.levelKey,
      count: r.evidence.count,
      medians: Object.fromEntries(Object.entries(r.evidence.stats).map(([k, v]) => [k, v?.median ?? null])),
      support: r.support,
    })),
  });
}

/**
 * Publishing an amendment replaces the issuance it amends, so that issuance must still be in
 * force when the amendment is published. Its row is locked for the rest of the publish
 * transaction, so a concurrent withdrawal or a second amendment waits and then sees it
 * superseded (issue 11).
 */
async function lockReplacedIssuance(tx: Transaction, issuanceId: string, now: Date): Promise<Result<void, AppError>> {
  const [replaced] = await tx
    .select({ number: issuances.number, state: issuances.state, validFrom: issuances.validFrom, validUntil: issuances.validUntil })
    .from(issuances)
    .where(eq(issuances.id, issuanceId))
    .for('update');
  if (!replaced) throw new Error('the amended issuance vanished');
  if (isInForce(replaced, now)) return ok(undefined);
  const why = replaced.state === 'published' ? 'its valid period has ended' : `it was ${replaced.state}`;
  return err(
    appError('CONFLICT', `This amendment replaces issuance ${replaced.number}, which is no longer in force (${why}). Only an issuance in force can be amended: start a new outlook instead.`, {
      details: { rule: 'AMENDED_ISSUANCE_NOT_IN_FORCE', issuanceNumber: replaced.number, issuanceState: replaced.state },
    }),
  );
}

/**
 * Takes the next issuance sequence of the office's year in one atomic statement: the upsert
 * creates the year's counter (continuing after any issuance already numbered that year) or
 * increments it, and holds the counter row's lock until the publish transaction ends. A
 * concurrent publish waits for that lock instead of computing the same `max + 1` (issue 11).
 */
export async function nextIssuanceSequence(tx: Transaction, officeId: string, year: number): Promise<number> {
  const [row] = await tx
    .insert(issuanceCounters)
    .values({
      officeId,
      year,
      lastSequence: sql`(select coalesce(max(${issuances.sequence}), 0) + 1 from ${issuances} where ${issuances.officeId} = ${officeId} and ${issuances.year} = ${year})`,
    })
    .onConflictDoUpdate({ target: [issuanceCounters.officeId, issuanceCounters.year], set: { lastSequence: sql`${issuanceCounters.lastSequence} + 1` } })
    .returning({ value: issuanceCounters.lastSequence });
  if (!row) throw new Error('issuance counter upsert returned no row');
  return row.value;
}

type OfficeRow = NonNullable<Awaited<ReturnType<typeof findOffice>>>;

/**
 * Writes the issuance: next number of the office's year, frozen snapshot with evidence and
 * support, and the guidance (`checked.guidance`) the support was checked against (issue 14).
 */
async function writeIssuance(tx: Transaction, config: Config, office: OfficeRow, outlookId: string, actor: Actor, hooks: PublishHooks, checked: { evidence: FrozenEvidence; guidance: SupportGuidance }) {
  const outlook = await getOutlook(tx, outlookId);
  if (!outlook.ok) throw new Error('outlook vanished while publishing');
  const o = outlook.value;
  const now = new Date();
  const year = now.getUTCFullYear();
  const sequence = await nextIssuanceSequence(tx, office.id, year);
  const number = `${year}-${String(sequence).padStart(4, '0')}`;
  const [approval] = await tx
    .select({ actorId: auditEvents.actorId, name: users.name })
    .from(auditEvents)
    .leftJoin(users, eq(users.id, auditEvents.actorId))
    .where(and(eq(auditEvents.outlookId, outlookId), eq(auditEvents.action, 'approve')))
    .orderBy(desc(auditEvents.createdAt))
    .limit(1);
  const [author] = o.createdBy ? await tx.select({ name: users.name }).from(users).where(eq(users.id, o.createdBy)) : [];
  const snapshot: IssuanceSnapshotInput = {
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
    evidence: checked.evidence,
    guidance: checked.guidance,
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
  // One durable job row in this same transaction; matching, maps and mail follow after commit.
  await enqueueDistribution(tx, row.id);
  await queueWebhookEvents(tx, config, o.amendsIssuanceId ? 'issuance.amended' : 'issuance.published', row.id);
  return { id: row.id, number };
}
