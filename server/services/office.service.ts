import { eq } from 'drizzle-orm';
import type { BaseMap, OfficeSettings, OfficeSettingsInput, SupportGuidance } from '../../shared/contracts/office';
import { supportGuidanceFromStored } from '../../shared/evidence/guidance';
import { appError, type AppError } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import type { DatabaseOrTransaction } from '../db/client';
import { offices } from '../db/schema';

type OfficeRow = typeof offices.$inferSelect;

function toSettings(row: OfficeRow, baseMap: BaseMap): OfficeSettings {
  return {
    id: row.id,
    name: row.name,
    region: row.region,
    timeZone: row.timeZone,
    riskLadder: row.riskLadder,
    guidance: officeGuidance(row),
    allowSelfApproval: row.allowSelfApproval,
    version: row.version,
    updatedAt: row.updatedAt.toISOString(),
    baseMap,
  };
}

/** The office's support-check guidance: the stored rules, or the older thresholds converted, or the invented defaults. */
export function officeGuidance(row: Pick<OfficeRow, 'supportGuidance' | 'guidanceThresholds'>): SupportGuidance {
  return supportGuidanceFromStored(row.supportGuidance, row.guidanceThresholds);
}

/** The office this installation serves (one office per installation for now: the first one). */
export async function findOffice(db: DatabaseOrTransaction): Promise<OfficeRow | undefined> {
  const [row] = await db.select().from(offices).orderBy(offices.createdAt).limit(1);
  return row;
}

export async function getOfficeSettings(db: DatabaseOrTransaction, baseMap: BaseMap): Promise<Result<OfficeSettings, AppError>> {
  const row = await findOffice(db);
  if (!row) return err(appError('NOT_FOUND', 'No office is set up yet. Start the app once to create it.'));
  return ok(toSettings(row, baseMap));
}

/**
 * Saves the office settings when `input.version` is still the stored version; otherwise a
 * CONFLICT that says someone else saved first (nothing is overwritten).
 */
export async function updateOfficeSettings(db: DatabaseOrTransaction, input: OfficeSettingsInput, baseMap: BaseMap): Promise<Result<OfficeSettings, AppError>> {
  const current = await findOffice(db);
  if (!current) return err(appError('NOT_FOUND', 'No office is set up yet.'));
  const { version, guidance, allowSelfApproval, ...fields } = input;
  const ladderKeys = new Set(fields.riskLadder.map((l) => l.key));
  const strayLevels = Object.keys(guidance?.levels ?? {}).filter((key) => !ladderKeys.has(key));
  if (strayLevels.length) {
    return err(
      appError('VALIDATION_FAILED', `Guidance is set for levels that are not on the ladder: ${strayLevels.join(', ')}.`, {
        issues: strayLevels.map((key) => ({ path: `guidance.levels.${key}`, message: 'This level is not on the risk ladder.' })),
      }),
    );
  }
  const [row] = await db
    .update(offices)
    .set({
      ...fields,
      ...(guidance ? { supportGuidance: guidance } : {}),
      ...(allowSelfApproval !== undefined ? { allowSelfApproval } : {}),
      version: version + 1,
      updatedAt: new Date(),
    })
    .where(eq(offices.version, version))
    .returning();
  if (!row) {
    return err(
      appError('CONFLICT', 'The office settings were changed by someone else since you opened them. Reload to see their changes, or keep yours.', {
        details: { currentVersion: current.version },
      }),
    );
  }
  return ok(toSettings(row, baseMap));
}
