import { eq } from 'drizzle-orm';
import { defaultRiskLadder } from '../../shared/contracts/office';
import { defaultSupportGuidance } from '../../shared/evidence/guidance';
import type { Role } from '../../shared/contracts/common';
import type { Auth } from '../auth/auth';
import type { Config } from '../config';
import type { Database } from '../db/client';
import { offices, outlooks, subscriptions, users } from '../db/schema';
import type { HazardKind } from '../../shared/contracts/outlooks';
import { addAreaOfInterest, getMySubscription, saveMySubscription } from './subscriptions.service';
import { demoDay2Areas, demoDay2Discussion, demoEarlyDiscussion, demoOutlookAreas, demoOutlookDiscussion, demoOutlookHeadline } from '../seed/demo-outlook';
import type { AppError } from '../../shared/errors';
import type { Result } from '../../shared/result';
import { amendIssuance } from './issuances.service';
import { createOutlook, getOutlook, saveOutlook } from './outlooks.service';
import { transitionOutlook } from './workflow.service';
import { processDistributionJobs } from './distribution.service';
import { demoRegion, generateDemoSoundings } from '../seed/demo-soundings';
import { seedSoundings } from './soundings.service';
import { ingestReports } from './verification.service';
import { generateDemoReports } from '../seed/demo-reports';
import { createUser } from './users.service';

export const demoPassword = 'stormdraft-demo';

export const demoAccounts: { email: string; name: string; role: Role }[] = [
  { email: 'admin@demo.stormdraft.test', name: 'Avery Admin', role: 'admin' },
  { email: 'lead@demo.stormdraft.test', name: 'Lena Lead', role: 'lead' },
  { email: 'forecaster@demo.stormdraft.test', name: 'Felix Forecaster', role: 'forecaster' },
  { email: 'subscriber@demo.stormdraft.test', name: 'Sam Subscriber', role: 'subscriber' },
  { email: 'fairgrounds@demo.stormdraft.test', name: 'Fran Fairgrounds', role: 'subscriber' },
  { email: 'utility@demo.stormdraft.test', name: 'Uma Utility', role: 'subscriber' },
];

/** Invented emergency-manager subscriptions over real counties (FIPS codes from us-atlas). */
const demoSubscriptions: { email: string; threshold: string; hazards: HazardKind[]; counties: string[] }[] = [
  { email: 'subscriber@demo.stormdraft.test', threshold: 'level2', hazards: [], counties: ['29019', '29051'] },
  { email: 'fairgrounds@demo.stormdraft.test', threshold: 'level1', hazards: ['wind', 'hail'], counties: ['17167'] },
  { email: 'utility@demo.stormdraft.test', threshold: 'level3', hazards: ['tornado', 'wind'], counties: ['29027', '29077'] },
];

/** The invented demo office over the central United States' river valleys. */
export const demoOffice = {
  slug: 'meridian-valley',
  name: 'Meridian Valley Weather Office',
  region: { ...demoRegion },
  timeZone: 'America/Chicago',
};

/** Makes sure the office exists (every installation has one); creates it from the demo values. */
export async function ensureOffice(db: Database): Promise<void> {
  await db
    .insert(offices)
    .values({ ...demoOffice, riskLadder: defaultRiskLadder, supportGuidance: defaultSupportGuidance })
    .onConflictDoNothing({ target: offices.slug });
}

/**
 * Seeds the demo office and accounts. Idempotent: what exists is left alone, so a restart never
 * duplicates or resets data. Never called in production (config.seedDemo).
 */
export async function seedDemo(db: Database, auth: Auth, config: Config): Promise<void> {
  await ensureOffice(db);
  for (const account of demoAccounts) {
    const [existing] = await db.select({ id: users.id }).from(users).where(eq(users.email, account.email));
    if (existing) continue;
    const created = await createUser(db, auth, { ...account, password: demoPassword });
    if (!created.ok) throw new Error(`demo account ${account.email}: ${created.error.message}`);
  }
  await seedSubscriptions(db);
  // The demo day is the day of the first start, so the demo looks current; later starts keep it.
  const demoDay = new Date();
  await seedSoundings(db, generateDemoSoundings(demoDay));
  await seedDemoOutlooks(db, config, demoDay);
}

/** The demo subscribers' thresholds and county areas of interest (once). */
async function seedSubscriptions(db: Database): Promise<void> {
  const [existing] = await db.select({ id: subscriptions.id }).from(subscriptions).limit(1);
  if (existing) return;
  for (const demo of demoSubscriptions) {
    const [user] = await db.select().from(users).where(eq(users.email, demo.email));
    if (!user) continue;
    const actor = { userId: user.id, name: user.name, email: user.email, role: 'subscriber' as const };
    const current = must(await getMySubscription(db, actor), 'subscription');
    must(await saveMySubscription(db, actor, { version: current.version, alertThreshold: demo.threshold, hazards: demo.hazards, days: [1, 2, 3], emails: [demo.email], paused: false }), 'subscription');
    for (const fipsCode of demo.counties) must(await addAreaOfInterest(db, actor, { kind: 'county', fipsCode }), 'area of interest');
  }
}

/** A demo account as the actor services expect. */
async function demoActor(db: Database, role: 'forecaster' | 'lead') {
  const [row] = await db.select().from(users).where(eq(users.email, `${role}@demo.stormdraft.test`));
  if (!row) throw new Error(`demo ${role} account missing`);
  return { userId: row.id, name: row.name, email: row.email, role };
}

function must<T>(result: Result<T, AppError>, what: string): T {
  if (!result.ok) throw new Error(`demo ${what}: ${result.error.message}`);
  return result.value;
}

/** A past demo day: a published Day 1 issuance and the storm reports that fell that day. */
async function seedPastIssuance(db: Database, config: Config, forecaster: DemoActor, lead: DemoActor, pastDay: Date): Promise<void> {
  const at = (hourUtc: number) => new Date(Date.UTC(pastDay.getUTCFullYear(), pastDay.getUTCMonth(), pastDay.getUTCDate(), hourUtc)).toISOString();
  const past = must(await createOutlook(db, forecaster, { day: 1, issuanceTime: at(13), headline: 'Scattered severe storms in the warm sector; large hail and damaging wind' }), 'past outlook');
  const saved = must(
    await saveOutlook(db, forecaster, past.id, { version: past.version, headline: past.headline, discussion: demoOutlookDiscussion, hazardNotes: {}, validFrom: past.validFrom, validUntil: past.validUntil, areas: demoOutlookAreas }),
    'past outlook',
  );
  let version = must(await transitionOutlook(db, config, forecaster, past.id, 'submit', { version: saved.version }), 'past submit').version;
  version = must(await transitionOutlook(db, config, lead, past.id, 'approve', { version }), 'past approve').version;
  must(await transitionOutlook(db, config, lead, past.id, 'publish', { version }), 'past publish');
  must(await ingestReports(db, null, { reports: generateDemoReports(pastDay), merged: 0 }, 'demo', 'demo-reports'), 'storm reports');
}

type DemoActor = Awaited<ReturnType<typeof demoActor>>;

/**
 * The demo workflow, once: an early Day 1 outlook issued at 12 UTC and published
 * (forecaster writes, lead approves and publishes), the current Day 1 draft that amends it
 * (fuller areas, to author in the workspace), and a Day 2 draft waiting in review.
 */
async function seedDemoOutlooks(db: Database, config: Config, demoDay: Date): Promise<void> {
  const [existing] = await db.select({ id: outlooks.id }).from(outlooks).limit(1);
  if (existing) return;
  const forecaster = await demoActor(db, 'forecaster');
  const lead = await demoActor(db, 'lead');
  const at = (hourUtc: number) => new Date(Date.UTC(demoDay.getUTCFullYear(), demoDay.getUTCMonth(), demoDay.getUTCDate(), hourUtc)).toISOString();
  const [thunder, level1, level2] = demoOutlookAreas;

  // 0. Day 1 issuances three and two days back, whose periods have ended: scored against invented
  // reports, so the Verification page has a trend to draw.
  for (const daysBack of [3, 2]) await seedPastIssuance(db, config, forecaster, lead, new Date(demoDay.getTime() - daysBack * 86_400_000));

  // 1. The early Day 1 issuance.
  const early = must(await createOutlook(db, forecaster, { day: 1, issuanceTime: at(12), headline: 'Isolated severe storms possible this afternoon' }), 'early outlook');
  const earlySaved = must(
    await saveOutlook(db, forecaster, early.id, { version: early.version, headline: early.headline, discussion: demoEarlyDiscussion, hazardNotes: {}, validFrom: early.validFrom, validUntil: early.validUntil, areas: [thunder, level1, level2].filter((a) => a !== undefined) }),
    'early outlook',
  );
  let version = must(await transitionOutlook(db, config, forecaster, early.id, 'submit', { version: earlySaved.version }), 'submit').version;
  version = must(await transitionOutlook(db, config, lead, early.id, 'approve', { version }), 'approve').version;
  const published = must(await transitionOutlook(db, config, lead, early.id, 'publish', { version }), 'publish');
  // Queue the demo subscriber's alert now, as the distribution worker would.
  await processDistributionJobs(db, config);

  // 2. The current Day 1 draft: an amendment of that issuance.
  const amendment = must(await amendIssuance(db, forecaster, published.issuanceNumber ?? ''), 'amendment');
  const draft = must(await getOutlook(db, amendment.outlookId), 'amendment');
  must(
    await saveOutlook(db, forecaster, draft.id, { version: draft.version, headline: demoOutlookHeadline, discussion: demoOutlookDiscussion, hazardNotes: {}, validFrom: at(15), validUntil: draft.validUntil, areas: demoOutlookAreas }),
    'draft',
  );

  // 3. A Day 2 draft in review.
  const day2 = must(await createOutlook(db, forecaster, { day: 2, issuanceTime: at(15), headline: 'Storms return to the eastern valleys' }), 'day 2 outlook');
  const day2Saved = must(
    await saveOutlook(db, forecaster, day2.id, { version: day2.version, headline: day2.headline, discussion: demoDay2Discussion, hazardNotes: {}, validFrom: day2.validFrom, validUntil: day2.validUntil, areas: demoDay2Areas }),
    'day 2 outlook',
  );
  must(await transitionOutlook(db, config, forecaster, day2.id, 'submit', { version: day2Saved.version }), 'day 2 submit');
}
