import { eq } from 'drizzle-orm';
import { defaultRiskLadder } from '../../shared/contracts/office';
import { defaultGuidanceThresholds } from '../../shared/evidence/support-check';
import type { Role } from '../../shared/contracts/common';
import type { Auth } from '../auth/auth';
import type { Database } from '../db/client';
import { offices, outlooks, users } from '../db/schema';
import { demoOutlookAreas, demoOutlookDiscussion, demoOutlookHeadline } from '../seed/demo-outlook';
import { createOutlook, saveOutlook } from './outlooks.service';
import { generateDemoSoundings } from '../seed/demo-soundings';
import { seedSoundings } from './soundings.service';
import { createUser } from './users.service';

export const demoPassword = 'stormdraft-demo';

export const demoAccounts: { email: string; name: string; role: Role }[] = [
  { email: 'admin@demo.stormdraft.test', name: 'Avery Admin', role: 'admin' },
  { email: 'lead@demo.stormdraft.test', name: 'Lena Lead', role: 'lead' },
  { email: 'forecaster@demo.stormdraft.test', name: 'Felix Forecaster', role: 'forecaster' },
  { email: 'subscriber@demo.stormdraft.test', name: 'Sam Subscriber', role: 'subscriber' },
];

/** The invented demo office over the central United States' river valleys. */
export const demoOffice = {
  slug: 'meridian-valley',
  name: 'Meridian Valley Weather Office',
  region: { west: -96.5, south: 35.5, east: -87.5, north: 41.5 },
  timeZone: 'America/Chicago',
};

/** Makes sure the office exists (every installation has one); creates it from the demo values. */
export async function ensureOffice(db: Database): Promise<void> {
  await db
    .insert(offices)
    .values({ ...demoOffice, riskLadder: defaultRiskLadder, guidanceThresholds: defaultGuidanceThresholds })
    .onConflictDoNothing({ target: offices.slug });
}

/**
 * Seeds the demo office and accounts. Idempotent: what exists is left alone, so a restart never
 * duplicates or resets data. Never called in production (config.seedDemo).
 */
export async function seedDemo(db: Database, auth: Auth): Promise<void> {
  await ensureOffice(db);
  for (const account of demoAccounts) {
    const [existing] = await db.select({ id: users.id }).from(users).where(eq(users.email, account.email));
    if (existing) continue;
    const created = await createUser(db, auth, { ...account, password: demoPassword });
    if (!created.ok) throw new Error(`demo account ${account.email}: ${created.error.message}`);
  }
  // The demo day is the day of the first start, so the demo looks current; later starts keep it.
  const demoDay = new Date();
  await seedSoundings(db, generateDemoSoundings(demoDay));
  await seedDemoOutlook(db, demoDay);
}

/** One draft Day 1 outlook over the demo region, written by the demo forecaster (once). */
async function seedDemoOutlook(db: Database, demoDay: Date): Promise<void> {
  const [existing] = await db.select({ id: outlooks.id }).from(outlooks).limit(1);
  if (existing) return;
  const [author] = await db.select().from(users).where(eq(users.email, 'forecaster@demo.stormdraft.test'));
  if (!author) return;
  const actor = { userId: author.id, name: author.name, email: author.email, role: 'forecaster' as const };
  const issued = new Date(Date.UTC(demoDay.getUTCFullYear(), demoDay.getUTCMonth(), demoDay.getUTCDate(), 12));
  const created = await createOutlook(db, actor, { day: 1, issuanceTime: issued.toISOString(), headline: demoOutlookHeadline });
  if (!created.ok) throw new Error(`demo outlook: ${created.error.message}`);
  const o = created.value;
  const saved = await saveOutlook(db, actor, o.id, { version: o.version, headline: o.headline, discussion: demoOutlookDiscussion, hazardNotes: {}, validFrom: o.validFrom, validUntil: o.validUntil, areas: demoOutlookAreas });
  if (!saved.ok) throw new Error(`demo outlook: ${saved.error.message}`);
}
