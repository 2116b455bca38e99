/**
 * Scheduled pulls: a source's address template is expanded with the latest cycle that should be
 * published by now and each forecast hour; each address not fetched before is downloaded (size
 * and time limited, no redirects) and taken in like a file dropped in the intake folder.
 */
import { lookup } from 'node:dns/promises';
import { mkdir, open, rename, unlink } from 'node:fs/promises';
import path from 'node:path';
import { and, eq } from 'drizzle-orm';
import { intakeFiles, intakeSources } from '../../db/schema';
import type { IngestContext } from './ingesters';
import { megabytes } from './megabytes';
import { processIntakeFile, type ProcessOptions } from './process-file';

type SourceRow = typeof intakeSources.$inferSelect;

/** The placeholders an address template may hold. */
export const TEMPLATE_PLACEHOLDERS = ['yyyy', 'mm', 'dd', 'hh', 'fff', 'ff', 'fh'] as const;

const pad = (value: number, width: number) => String(value).padStart(width, '0');

/**
 * The address for one cycle and forecast hour: {yyyy} {mm} {dd} {hh} of the cycle (UTC), and the
 * forecast hour as {fff} (3 digits), {ff} (2 digits) or {fh} (as is).
 * @example expandTemplate('https://x.test/{yyyy}{mm}{dd}/{hh}/f{fff}.grib2', new Date('2027-04-18T12:00Z'), 6)
 *   // → 'https://x.test/20270418/12/f006.grib2'
 */
export function expandTemplate(template: string, cycle: Date, forecastHour: number): string {
  const values: Record<(typeof TEMPLATE_PLACEHOLDERS)[number], string> = {
    yyyy: pad(cycle.getUTCFullYear(), 4),
    mm: pad(cycle.getUTCMonth() + 1, 2),
    dd: pad(cycle.getUTCDate(), 2),
    hh: pad(cycle.getUTCHours(), 2),
    fff: pad(forecastHour, 3),
    ff: pad(forecastHour, 2),
    fh: String(forecastHour),
  };
  return template.replace(/\{(yyyy|mm|dd|hh|fff|ff|fh)\}/g, (_all, key: keyof typeof values) => values[key]);
}

/**
 * The latest cycle whose files should be there by `now`: the most recent cycle hour at least
 * `delayMinutes` before now (looking back at most two days); null when the list is empty.
 */
export function latestCycle(now: Date, cycleHours: number[], delayMinutes: number): Date | null {
  const ready = new Date(now.getTime() - delayMinutes * 60_000);
  const hour = new Date(Date.UTC(ready.getUTCFullYear(), ready.getUTCMonth(), ready.getUTCDate(), ready.getUTCHours()));
  for (let back = 0; back <= 48; back++) {
    const candidate = new Date(hour.getTime() - back * 3_600_000);
    if (cycleHours.includes(candidate.getUTCHours())) return candidate;
  }
  return null;
}

function isInternalHost(host: string): boolean {
  const bare = host.replace(/^\[|\]$/g, '').toLowerCase();
  if (bare === 'localhost' || bare.endsWith('.localhost') || bare === '::' || bare === '::1' || /^(fc|fd|fe80|::ffff:)/.test(bare)) return true;
  const parts = bare.split('.').map(Number);
  if (parts.length !== 4 || parts.some((p) => !Number.isInteger(p))) return false;
  const [a = 0, b = 0] = parts;
  return a === 0 || a === 10 || a === 127 || (a === 169 && b === 254) || (a === 172 && b >= 16 && b <= 31) || (a === 192 && b === 168) || (a === 100 && b >= 64 && b <= 127);
}

/**
 * Which pull addresses are accepted: https:// to public hosts; plain http:// only to 127.0.0.1
 * and only outside production (the local test server). No user name or password in the address:
 * credentials go in the source's Authorization value, which stays on the server. Only the known
 * placeholders. Returns a message for the person, or null.
 */
export function pullUrlProblem(template: string, env: 'development' | 'production' | 'test'): string | null {
  const unknown = [...template.matchAll(/\{([^}]*)\}/g)].map((m) => m[1] ?? '').filter((name) => !(TEMPLATE_PLACEHOLDERS as readonly string[]).includes(name));
  if (unknown.length) return `Unknown placeholder {${unknown[0]}}; use {yyyy} {mm} {dd} {hh} for the cycle and {fff} {ff} {fh} for the forecast hour.`;
  let url: URL;
  try {
    url = new URL(expandTemplate(template, new Date(Date.UTC(2027, 0, 1)), 0));
  } catch {
    return 'Enter a full address, e.g. https://data.example.org/model/{yyyy}{mm}{dd}/{hh}/f{fff}.grib2.';
  }
  if (url.username || url.password) return 'Leave the user name and password out of the address; put them in the authorization field, which stays on the server.';
  if (url.protocol === 'http:') {
    if (env !== 'production' && url.hostname === '127.0.0.1') return null;
    return env === 'production' ? 'The address must use https://.' : 'The address must use https:// (plain http:// is allowed only to 127.0.0.1 outside production).';
  }
  if (url.protocol !== 'https:') return 'The address must use https://.';
  if (env === 'production' && isInternalHost(url.hostname)) return 'The address must be a public host, not a local or private network one.';
  return null;
}

/** Resolves a host name to its addresses (injected in tests). */
export type HostLookup = (host: string) => Promise<string[]>;

const systemLookup: HostLookup = async (host) => (await lookup(host, { all: true })).map((entry) => entry.address);

/**
 * In production, a pull host must not resolve to a local or private address (a public name
 * pointing inside the network). Returns a message, or null when every address is public.
 */
export async function privateAddressProblem(urlText: string, env: 'development' | 'production' | 'test', resolve: HostLookup = systemLookup): Promise<string | null> {
  if (env !== 'production') return null;
  const host = new URL(urlText).hostname;
  let addresses: string[];
  try {
    addresses = await resolve(host.replace(/^\[|\]$/g, ''));
  } catch {
    return `the host ${host} could not be found`;
  }
  return addresses.some(isInternalHost) ? `the host ${host} resolves to a local or private network address, which pulls may not reach` : null;
}

export interface PullLimits {
  /** Time limit of one download, ms. */
  timeoutMs: number;
  /** Largest download, bytes. */
  maxBytes: number;
}

export interface PullSummary {
  fetched: number;
  alreadyFetched: number;
  notYetAvailable: number;
  errors: string[];
}

/** Downloads `url` into `target`, refusing redirects and stopping past the size or time limit. */
async function download(url: string, authorization: string | null, target: string, limits: PullLimits): Promise<{ ok: true } | { ok: false; status?: number; reason: string }> {
  let response: Response;
  try {
    response = await fetch(url, { headers: authorization ? { authorization } : {}, redirect: 'error', signal: AbortSignal.timeout(limits.timeoutMs) });
  } catch (error) {
    const timedOut = error instanceof Error && (error.name === 'TimeoutError' || error.name === 'AbortError');
    return { ok: false, reason: timedOut ? `no answer within ${Math.round(limits.timeoutMs / 1000)} s` : 'the server could not be reached (or it answered with a redirect, which is not followed)' };
  }
  if (!response.ok || !response.body) {
    await response.body?.cancel();
    return { ok: false, status: response.status, reason: `the server answered ${response.status}` };
  }
  const declared = Number(response.headers.get('content-length') ?? '0');
  if (declared > limits.maxBytes) {
    await response.body.cancel();
    return { ok: false, reason: `the file is ${megabytes(declared)}, over the ${megabytes(limits.maxBytes)} limit` };
  }
  let received = 0;
  const reader = response.body.getReader();
  const out = await open(target, 'w');
  try {
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      received += value.length;
      if (received > limits.maxBytes) {
        await reader.cancel();
        throw new Error('too large');
      }
      await out.write(value);
    }
    await out.close();
    return { ok: true };
  } catch {
    await out.close().catch(() => undefined);
    await unlink(target).catch(() => undefined);
    return { ok: false, reason: received > limits.maxBytes ? `the file is over the ${megabytes(limits.maxBytes)} limit` : 'the download broke off' };
  }
}

/**
 * Pull one source now: every forecast hour of its latest due cycle not fetched before.
 * @param workFolder - where downloads are written before they are taken in (hidden from the watcher)
 */
export async function pullSource(
  ctx: IngestContext & { env: 'development' | 'production' | 'test' },
  source: SourceRow,
  now: Date,
  options: { workFolder: string; limits: PullLimits; process: ProcessOptions },
): Promise<PullSummary> {
  const summary: PullSummary = { fetched: 0, alreadyFetched: 0, notYetAvailable: 0, errors: [] };
  await ctx.db.update(intakeSources).set({ lastPolledAt: now }).where(eq(intakeSources.id, source.id));
  const problem = pullUrlProblem(source.urlTemplate, ctx.env);
  const cycle = latestCycle(now, source.cycleHours, source.delayMinutes);
  if (problem || !cycle) {
    const lastError = problem ?? 'No cycle hours are set.';
    await ctx.db.update(intakeSources).set({ lastError }).where(eq(intakeSources.id, source.id));
    return { ...summary, errors: [lastError] };
  }
  await mkdir(options.workFolder, { recursive: true });
  for (const forecastHour of source.forecastHours) {
    const url = expandTemplate(source.urlTemplate, cycle, forecastHour);
    const [seen] = await ctx.db.select({ id: intakeFiles.id }).from(intakeFiles).where(and(eq(intakeFiles.sourceId, source.id), eq(intakeFiles.url, url))).limit(1);
    if (seen) {
      summary.alreadyFetched++;
      continue;
    }
    const name = path.basename(new URL(url).pathname) || `${source.name}-f${forecastHour}`;
    const target = path.join(options.workFolder, `${Date.now()}-${name.replace(/[^\w.-]/g, '_')}`);
    const blocked = await privateAddressProblem(url, ctx.env);
    if (blocked) {
      summary.errors.push(`f${forecastHour}: ${blocked}`);
      continue;
    }
    const got = await download(url, source.authorization, target, options.limits);
    if (!got.ok) {
      if (got.status === 404) summary.notYetAvailable++;
      else summary.errors.push(`f${forecastHour}: ${got.reason}`);
      continue;
    }
    summary.fetched++;
    // The record keeps the address's file name, not the temporary one.
    const named = path.join(options.workFolder, name.replace(/[^\w.-]/g, '_'));
    await rename(target, named);
    await processIntakeFile(ctx, named, { origin: 'pull', sourceName: source.name, sourceId: source.id, url, model: source.model ?? undefined }, options.process);
    // Without done/failed folders the download is not kept.
    if (!options.process.folders) await unlink(named).catch(() => undefined);
  }
  await ctx.db
    .update(intakeSources)
    .set({ lastError: summary.errors.length ? summary.errors.join('; ') : null })
    .where(eq(intakeSources.id, source.id));
  ctx.logger.info({ source: source.name, fetched: summary.fetched, alreadyFetched: summary.alreadyFetched, notYetAvailable: summary.notYetAvailable, errors: summary.errors.length }, 'intake pull');
  return summary;
}
