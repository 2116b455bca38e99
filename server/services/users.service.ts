import { desc, eq } from 'drizzle-orm';
import { roleSchema } from '../../shared/contracts/common';
import { defaultUnits, type CreateUserInput, type Me, type Preferences, type UpdateUserInput, type UserSummary } from '../../shared/contracts/users';
import { appError, type AppError } from '../../shared/errors';
import { err, ok, type Result } from '../../shared/result';
import type { Actor } from '../auth/require-role';
import type { Auth } from '../auth/auth';
import { passwordProblem } from '../auth/password-rule';
import type { Database } from '../db/client';
import { sessions, userPreferences, users } from '../db/schema';

type UserRow = typeof users.$inferSelect;

function toSummary(row: UserRow): UserSummary {
  return {
    id: row.id,
    name: row.name,
    email: row.email,
    role: roleSchema.catch('subscriber').parse(row.role),
    disabled: row.banned === true,
    createdAt: row.createdAt.toISOString(),
  };
}

export async function listUsers(db: Database): Promise<Result<{ users: UserSummary[] }, AppError>> {
  const rows = await db.select().from(users).orderBy(desc(users.createdAt));
  return ok({ users: rows.map(toSummary) });
}

/** Creates an account with a role (staff accounts are only made this way, by an admin). */
export async function createUser(db: Database, auth: Auth, input: CreateUserInput): Promise<Result<UserSummary, AppError>> {
  const [existing] = await db.select({ id: users.id }).from(users).where(eq(users.email, input.email));
  if (existing) {
    return err(appError('ALREADY_EXISTS', `An account with ${input.email} already exists.`, { issues: [{ path: 'email', message: 'This e-mail address is already in use.' }] }));
  }
  const weak = passwordProblem(input.password, [input.email, input.name]);
  if (weak) return err(appError('VALIDATION_FAILED', `Check the body. password: ${weak}`, { issues: [{ path: 'password', message: weak }] }));
  const created = await auth.api.createUser({ body: { name: input.name, email: input.email, password: input.password, role: input.role } });
  const [row] = await db.update(users).set({ emailVerified: true }).where(eq(users.id, created.user.id)).returning();
  if (!row) throw new Error(`user ${created.user.id} vanished right after creation`);
  return ok(toSummary(row));
}

/**
 * Changes a user's role or disables (enables) the account. Disabling ends their sessions.
 * An admin cannot demote or disable themselves, so an office is never left without an admin.
 */
export async function updateUser(db: Database, actor: Actor, userId: string, input: UpdateUserInput): Promise<Result<UserSummary, AppError>> {
  const [target] = await db.select().from(users).where(eq(users.id, userId));
  if (!target) return err(appError('NOT_FOUND', 'There is no user with that id.'));
  if (target.id === actor.userId && (input.disabled === true || (input.role && input.role !== 'admin'))) {
    return err(appError('FORBIDDEN', 'You cannot remove your own admin role or disable your own account. Ask another admin.'));
  }
  return db.transaction(async (tx) => {
    const [row] = await tx
      .update(users)
      .set({
        ...(input.role ? { role: input.role } : {}),
        ...(input.disabled !== undefined ? { banned: input.disabled, banReason: input.disabled ? 'Disabled by an admin' : null } : {}),
        updatedAt: new Date(),
      })
      .where(eq(users.id, userId))
      .returning();
    if (!row) throw new Error(`user ${userId} vanished during update`);
    if (input.disabled) await tx.delete(sessions).where(eq(sessions.userId, userId));
    return ok(toSummary(row));
  });
}

export async function getMe(db: Database, actor: Actor): Promise<Result<Me, AppError>> {
  const [prefs] = await db.select().from(userPreferences).where(eq(userPreferences.userId, actor.userId));
  return ok({
    user: { id: actor.userId, name: actor.name, email: actor.email, role: actor.role },
    preferences: { units: prefs?.units ?? defaultUnits },
  });
}

export async function savePreferences(db: Database, actor: Actor, input: Preferences): Promise<Result<Preferences, AppError>> {
  await db
    .insert(userPreferences)
    .values({ userId: actor.userId, units: input.units })
    .onConflictDoUpdate({ target: userPreferences.userId, set: { units: input.units, updatedAt: new Date() } });
  return ok(input);
}
