import { and, asc, eq, gte, isNull, lt, lte, or, type SQL } from 'drizzle-orm';
import { localDate } from '../../shared/time/valid-period';
import type { Region } from '../../shared/contracts/office';
import { issuanceSnapshotSchema } from '../../shared/contracts/issuances';
import type { IssuanceVerification, ReportIntakeResult, StormReportInput, StormReportView, VerificationResult, VerificationSummary, VerificationSummaryQuery } from '../../shared/contracts/verification';
import { isDuplicate, parseReportsCsv, parseReportsGeoJson, type ReportIssue } from '../../shared/reports/parse-reports';
import type { StormReport } from '../../shared/reports/storm-report';
import { scoreIssuance, verificationMethod } from '../../shared/verification/score-issuance';
import { appError, type AppError } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import type { Actor } from '../auth/require-role';
import type { Database, DatabaseOrTransaction } from '../db/client';
import { issuances, issuanceVerifications, stormReports } from '../db/schema';
import { findOffice } from './office.service';

type IssuanceRow = typeof issuances.$inferSelect;
type ReportRow = typeof stormReports.$inferSelect;

const HOUR_MS = 3_600_000;

function toView(row: ReportRow): StormReportView {
  return {
    id: row.id,
    time: row.time.toISOString(),
    latitude: row.latitude,
    longitude: row.longitude,
    hazard: row.hazard,
    hailCm: row.hailCm,
    gustKmh: row.gustKmh,
    gustMeasured: row.gustMeasured,
    efRating: row.efRating,
    source: row.source,
    remark: row.remark,
  };
}

function issuesToError(issues: ReportIssue[], fileName?: string): AppError {
  const where = (i: ReportIssue) => (i.line !== undefined ? `line ${i.line}` : i.feature !== undefined ? `feature ${i.feature}` : 'file');
  return appError('VALIDATION_FAILED', `${fileName ? `${fileName}: ` : ''}${issues.length} problem${issues.length === 1 ? '' : 's'} in the reports; nothing was stored. Fix them and send the file again.`, {
    issues: issues.slice(0, 200).map((i) => ({ path: [where(i), i.column].filter(Boolean).join(' · '), message: i.message })),
  });
}

/** Reads an uploaded report file by its content: GeoJSON when it starts with `{`, our CSV otherwise. */
export function parseReportFile(text: string, fileName: string): Result<{ reports: StormReport[]; merged: number }, AppError> {
  const trimmed = text.trimStart();
  if (trimmed.startsWith('{')) {
    let value: unknown;
    try {
      value = JSON.parse(trimmed);
    } catch (error) {
      return err(appError('VALIDATION_FAILED', `${fileName}: not valid JSON (${error instanceof Error ? error.message : 'parse error'}).`));
    }
    const parsed = parseReportsGeoJson(value);
    return parsed.ok ? ok(parsed.value) : err(issuesToError(parsed.error, fileName));
  }
  const parsed = parseReportsCsv(text);
  return parsed.ok ? ok(parsed.value) : err(issuesToError(parsed.error, fileName));
}

/** Checks reports that arrived as JSON (pipelines) with the same rules as a file. */
export function parseReportJson(reports: readonly StormReportInput[]): Result<{ reports: StormReport[]; merged: number }, AppError> {
  const parsed = parseReportsGeoJson({
    type: 'FeatureCollection',
    features: reports.map((r) => {
      const { latitude, longitude, ...properties } = r;
      return { type: 'Feature', geometry: { type: 'Point', coordinates: [longitude, latitude] }, properties };
    }),
  });
  return parsed.ok ? ok(parsed.value) : err(issuesToError(parsed.error.map((i) => ({ ...i, feature: undefined, line: undefined, column: i.feature !== undefined ? `reports.${i.feature}${i.column ? `.${i.column}` : ''}` : i.column }))));
}

/**
 * Stores reports, merging any that duplicate a stored one (same hazard, within the duplicate
 * distance and time), then scores again every issuance already verified whose window holds a
 * new report and whose late-report window is still open.
 */
export async function ingestReports(db: Database, actor: Actor | null, input: { reports: StormReport[]; merged: number }, intake: 'upload' | 'api' | 'folder' | 'demo', fileName: string | null, now = new Date()): Promise<Result<ReportIntakeResult, AppError>> {
  const office = await findOffice(db);
  if (!office) return err(appError('NOT_FOUND', 'No office is set up yet.'));
  const times = input.reports.map((r) => Date.parse(r.time));
  const earliest = new Date(Math.min(...times) - 60 * 60_000);
  const latest = new Date(Math.max(...times) + 60 * 60_000);
  const stored = await db.select().from(stormReports).where(and(eq(stormReports.officeId, office.id), gte(stormReports.time, earliest), lte(stormReports.time, latest)));
  const known: StormReport[] = stored.map((row) => ({ ...toView(row) }));
  const fresh = input.reports.filter((report) => !known.some((k) => isDuplicate(k, report)));
  const merged = input.merged + (input.reports.length - fresh.length);
  if (fresh.length > 0) {
    for (let i = 0; i < fresh.length; i += 1000) {
      await db.insert(stormReports).values(
        fresh.slice(i, i + 1000).map((r) => ({
          officeId: office.id,
          time: new Date(r.time),
          latitude: r.latitude,
          longitude: r.longitude,
          hazard: r.hazard,
          hailCm: r.hailCm,
          gustKmh: r.gustKmh,
          gustMeasured: r.gustMeasured,
          efRating: r.efRating,
          source: r.source,
          remark: r.remark,
          intake,
          fileName,
          createdBy: actor?.userId ?? null,
        })),
      );
    }
  }
  const rescored: string[] = [];
  if (fresh.length > 0) {
    const lateOpen = new Date(now.getTime() - verificationMethod.lateReportWindowHours * HOUR_MS);
    const candidates = await db
      .select({ issuance: issuances, verification: issuanceVerifications })
      .from(issuanceVerifications)
      .innerJoin(issuances, eq(issuances.id, issuanceVerifications.issuanceId))
      .where(and(eq(issuanceVerifications.officeId, office.id), eq(issuanceVerifications.status, 'scored'), gte(issuances.validUntil, lateOpen)));
    for (const { issuance, verification } of candidates) {
      const from = verification.windowFrom.getTime();
      const until = verification.windowUntil.getTime();
      if (!fresh.some((r) => Date.parse(r.time) >= from && Date.parse(r.time) < until)) continue;
      await verifyIssuance(db, issuance, now);
      rescored.push(issuance.number);
    }
  }
  return ok({ stored: fresh.length, merged, rescored });
}

/** The part of the valid period an issuance was in force: until an amendment replaced it. Null when never in force. */
async function windowOf(db: DatabaseOrTransaction, row: IssuanceRow): Promise<{ from: Date; until: Date } | null> {
  let until = row.validUntil;
  if (row.state === 'superseded' && row.supersededById) {
    const [next] = await db.select({ publishedAt: issuances.publishedAt }).from(issuances).where(eq(issuances.id, row.supersededById));
    if (next && next.publishedAt < until) until = next.publishedAt;
  }
  const from = row.validFrom;
  return until > from ? { from, until } : null;
}

/** Reports inside the region's box (the scorer counts only these). */
function regionFilter(region: Region | undefined): SQL[] {
  if (!region) return [];
  return [gte(stormReports.latitude, region.south), lte(stormReports.latitude, region.north), gte(stormReports.longitude, region.west), lte(stormReports.longitude, region.east)];
}


/** Scores one issuance (or records why it is not scored) and stores the result beside it. */
export async function verifyIssuance(db: Database, row: IssuanceRow, now = new Date()): Promise<void> {
  const window = await windowOf(db, row);
  const snapshot = issuanceSnapshotSchema.parse(row.snapshot);
  let status: 'scored' | 'not_scored' = 'scored';
  let reason: string | null = null;
  let result: VerificationResult | null = null;
  let reportsUsed = 0;
  if (row.state === 'withdrawn') {
    status = 'not_scored';
    reason = `Withdrawn${row.withdrawnAt ? ` on ${row.withdrawnAt.toISOString().slice(0, 10)}` : ''}${row.withdrawnReason ? `: ${row.withdrawnReason}` : ''}. Withdrawn issuances are listed but not scored.`;
  } else if (!window) {
    status = 'not_scored';
    reason = 'Replaced by an amendment before its valid period began, so it was never in force.';
  } else if (!snapshot.office?.region || !snapshot.riskLadder) {
    status = 'not_scored';
    reason = 'The issuance has no region or risk ladder recorded.';
  } else {
    const region = snapshot.office.region;
    const reports = await db
      .select()
      .from(stormReports)
      .where(and(eq(stormReports.officeId, row.officeId), gte(stormReports.time, window.from), lt(stormReports.time, window.until), ...regionFilter(region)));
    const verification = scoreIssuance({
      region,
      ladder: snapshot.riskLadder.map((level) => level.key),
      areas: (snapshot.areas ?? []).map((a) => ({ levelKey: a.levelKey, hazards: a.hazards ?? [], geometry: a.geometry })),
      reports: reports.map((r) => ({ time: r.time.toISOString(), lat: r.latitude, lon: r.longitude, hazard: r.hazard, hailDiameterCm: r.hailCm, gustKmh: r.gustKmh, efRating: r.efRating })),
      window: { from: window.from.toISOString(), until: window.until.toISOString() },
    });
    result = verification;
    reportsUsed = verification.reportsUsed;
  }
  const values = {
    issuanceId: row.id,
    officeId: row.officeId,
    status,
    reason,
    windowFrom: window?.from ?? row.validFrom,
    windowUntil: window?.until ?? row.validFrom,
    reportsUsed,
    result,
    computedAt: now,
  };
  const [existing] = await db.select({ runs: issuanceVerifications.runs }).from(issuanceVerifications).where(eq(issuanceVerifications.issuanceId, row.id));
  if (existing) await db.update(issuanceVerifications).set({ ...values, runs: existing.runs + 1 }).where(eq(issuanceVerifications.issuanceId, row.id));
  else await db.insert(issuanceVerifications).values(values).onConflictDoNothing();
}

/** Scores every issuance whose valid period has ended (or lists a withdrawn one) that has no verification yet. Returns their numbers. */
export async function verifyDueIssuances(db: Database, now = new Date()): Promise<string[]> {
  const due = await db
    .select({ issuance: issuances })
    .from(issuances)
    .leftJoin(issuanceVerifications, eq(issuanceVerifications.issuanceId, issuances.id))
    .where(and(or(lte(issuances.validUntil, now), eq(issuances.state, 'withdrawn')), isNull(issuanceVerifications.issuanceId)))
    .orderBy(asc(issuances.validUntil))
    .limit(200);
  for (const { issuance } of due) await verifyIssuance(db, issuance, now);
  return due.map((d) => d.issuance.number);
}

/** Runs `verifyDueIssuances` every `intervalMs`; returns a stop function. */
export function startVerificationWorker(db: Database, intervalMs: number, onError: (error: unknown) => void): () => Promise<void> {
  let running: Promise<unknown> = Promise.resolve();
  const timer = setInterval(() => {
    running = verifyDueIssuances(db).catch(onError);
  }, intervalMs);
  timer.unref();
  return async () => {
    clearInterval(timer);
    await running;
  };
}

/** The issuance page's verification: pending until the period ends, then the reports and scores. */
export async function getIssuanceVerification(db: Database, number: string, now = new Date()): Promise<Result<IssuanceVerification, AppError>> {
  const [row] = await db.select().from(issuances).where(eq(issuances.number, number));
  if (!row) return err(appError('NOT_FOUND', `There is no issuance ${number}.`));
  if (row.validUntil > now && row.state !== 'withdrawn') return ok({ issuanceNumber: number, status: 'pending', reason: 'Verification starts when the valid period ends.', computedAt: null, result: null, reports: [] });
  const [verification] = await db.select().from(issuanceVerifications).where(eq(issuanceVerifications.issuanceId, row.id));
  if (!verification) return ok({ issuanceNumber: number, status: 'pending', reason: 'Scoring is queued and runs within a few minutes.', computedAt: null, result: null, reports: [] });
  const reports =
    verification.status === 'scored'
      ? await db
          .select()
          .from(stormReports)
          .where(and(eq(stormReports.officeId, row.officeId), gte(stormReports.time, verification.windowFrom), lt(stormReports.time, verification.windowUntil), ...regionFilter(issuanceSnapshotSchema.parse(row.snapshot).office.region)))
          .orderBy(asc(stormReports.time))
          .limit(5000)
      : [];
  return ok({
    issuanceNumber: number,
    status: verification.status === 'scored' ? 'scored' : 'not_scored',
    reason: verification.reason,
    computedAt: verification.computedAt.toISOString(),
    result: verification.result ?? null,
    reports: reports.map(toView),
  });
}

/** Lists stored reports in a date range (UTC days, inclusive). */
export async function listReports(db: Database, query: { from?: string | undefined; to?: string | undefined }): Promise<Result<{ reports: StormReportView[] }, AppError>> {
  const conditions: SQL[] = [];
  if (query.from) conditions.push(gte(stormReports.time, new Date(`${query.from}T00:00:00Z`)));
  if (query.to) conditions.push(lte(stormReports.time, new Date(`${query.to}T23:59:59.999Z`)));
  const rows = await db.select().from(stormReports).where(and(...conditions)).orderBy(asc(stormReports.time)).limit(5000);
  return ok({ reports: rows.map(toView) });
}

/** Which shift of the office's day an issuance was published in (local time): summaries by shift, never by person. */
function shiftOf(publishedAt: Date, timeZone: string): string {
  const { hour } = localDate(publishedAt.getTime(), timeZone);
  if (hour < 6) return 'night';
  if (hour < 12) return 'morning';
  if (hour < 18) return 'afternoon';
  return 'evening';
}

/** The office's scores over time, filtered by day, level, hazard and date range. */
export async function verificationSummary(db: Database, query: VerificationSummaryQuery): Promise<Result<VerificationSummary, AppError>> {
  const office = await findOffice(db);
  if (!office) return err(appError('NOT_FOUND', 'No office is set up yet.'));
  const conditions: SQL[] = [eq(issuanceVerifications.officeId, office.id)];
  if (query.from) conditions.push(gte(issuances.validFrom, new Date(`${query.from}T00:00:00Z`)));
  if (query.to) conditions.push(lte(issuances.validFrom, new Date(`${query.to}T23:59:59.999Z`)));
  if (query.day) conditions.push(eq(issuances.day, Number(query.day)));
  const rows = await db
    .select({ issuance: issuances, verification: issuanceVerifications })
    .from(issuanceVerifications)
    .innerJoin(issuances, eq(issuances.id, issuanceVerifications.issuanceId))
    .where(and(...conditions))
    .orderBy(asc(issuances.validFrom))
    .limit(2000);
  const summary: VerificationSummary = { rows: [], notScored: [], ladder: office.riskLadder.map((l) => ({ key: l.key, label: l.label, colour: l.colour })) };
  for (const { issuance, verification } of rows) {
    if (verification.status !== 'scored' || !verification.result) {
      summary.notScored.push({ issuanceNumber: issuance.number, reason: verification.reason ?? 'Not scored.' });
      continue;
    }
    const result = verification.result;
    summary.rows.push({
      issuanceNumber: issuance.number,
      day: issuance.day,
      validFrom: issuance.validFrom.toISOString(),
      validUntil: issuance.validUntil.toISOString(),
      shift: shiftOf(issuance.publishedAt, office.timeZone),
      levels: result.levels.filter((l) => !query.level || l.levelKey === query.level),
      hazards: result.hazards.filter((h) => !query.hazard || h.hazard === query.hazard),
    });
  }
  return ok(summary);
}

const csvCell = (value: string | number | null) => (value === null ? '' : typeof value === 'number' ? String(Math.round(value * 10_000) / 10_000) : /[",\n]/.test(value) ? `"${value.replaceAll('"', '""')}"` : value);

/** The summary as CSV: one line per issuance and level or hazard. */
export function verificationSummaryCsv(summary: VerificationSummary): string {
  const lines = ['issuance,day,valid_from,valid_until,shift,kind,key,hits,false_alarms,misses,correct_negatives,pod,success_ratio,csi,bias'];
  for (const row of summary.rows) {
    const base = [row.issuanceNumber, row.day, row.validFrom, row.validUntil, row.shift];
    for (const l of row.levels) lines.push([...base, 'level', l.levelKey, l.table.hits, l.table.falseAlarms, l.table.misses, l.table.correctNegatives, l.scores.pod, l.scores.successRatio, l.scores.csi, l.scores.bias].map(csvCell).join(','));
    for (const h of row.hazards) lines.push([...base, 'hazard', `${h.hazard}${h.significant ? '-significant' : ''}`, h.table.hits, h.table.falseAlarms, h.table.misses, h.table.correctNegatives, h.scores.pod, h.scores.successRatio, h.scores.csi, h.scores.bias].map(csvCell).join(','));
  }
  return `${lines.join('\n')}\n`;
}

