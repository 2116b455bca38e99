import { betterAuth } from 'better-auth';
import { drizzleAdapter } from 'better-auth/adapters/drizzle';
import { admin } from 'better-auth/plugins';
import { APIError, createAuthMiddleware, isAPIError } from 'better-auth/api';
import type { Logger } from 'pino';
import { z } from 'zod';
import type { Config } from '../config';
import type { Database } from '../db/client';
import * as schema from '../db/schema';
import { passwordProblem, PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH } from './password-rule';
import { authAccessControl, authRoles } from './roles';
import { clearSignInFailures, recordFailedSignIn, secondsUntilSignInAllowed } from './sign-in-throttle';

export interface AuthHooks {
  /** Called when someone asks for a password reset; sends the mail (through a service). */
  sendResetPassword(input: { name: string; email: string; url: string }): Promise<void>;
  /** Called when a self-registered account must confirm its address; sends the mail. */
  sendVerificationEmail(input: { name: string; email: string; url: string }): Promise<void>;
}

/** better-auth endpoints that set a password; each must pass the product's password rule. */
const passwordSettingPaths = new Set(['/sign-up/email', '/reset-password', '/change-password', '/admin/create-user', '/admin/set-user-password', '/set-password']);

const passwordBodySchema = z.object({
  password: z.string().optional(),
  newPassword: z.string().optional(),
  email: z.string().optional(),
  name: z.string().optional(),
});
const signInBodySchema = z.object({ email: z.string() });

/** The origins the app's own pages are served from (PUBLIC_URL; plus local dev servers outside production). */
export function appOrigins(config: Config): string[] {
  const origins = [config.publicUrl];
  if (config.env !== 'production') origins.push('http://localhost:5173', `http://localhost:${config.port}`, `http://127.0.0.1:${config.port}`);
  return origins;
}

/**
 * The better-auth instance: e-mail + password, sessions in the database, roles from the admin
 * plugin. Self-registration always creates a `subscriber` (the role field does not accept input)
 * whose address is confirmed by e-mail before the first sign-in.
 */
export function createAuth(config: Config, db: Database, hooks: AuthHooks, logger?: Logger) {
  const trustedOrigins = appOrigins(config);
  return betterAuth({
    appName: 'Stormdraft',
    baseURL: config.publicUrl,
    basePath: '/api/auth',
    secret: config.authSecret,
    trustedOrigins,
    database: drizzleAdapter(db, { provider: 'pg', schema, usePlural: true }),
    emailAndPassword: {
      enabled: true,
      minPasswordLength: PASSWORD_MIN_LENGTH,
      maxPasswordLength: PASSWORD_MAX_LENGTH,
      resetPasswordTokenExpiresIn: 60 * 60,
      revokeSessionsOnPasswordReset: true,
      // Self-registered subscribers confirm their address before the first sign-in; accounts made
      // by an admin (and the demo accounts) are created already verified.
      requireEmailVerification: true,
      // The answer must not take longer when the address has an account: the mail is sent
      // after the response, and a failure to send is logged (without the link).
      sendResetPassword: async ({ user, url }) => {
        hooks.sendResetPassword({ name: user.name, email: user.email, url }).catch((error: unknown) => {
          logger?.error({ err: error instanceof Error ? { message: error.message } : String(error) }, 'password reset mail was not sent');
        });
      },
    },
    emailVerification: {
      sendOnSignUp: true,
      sendOnSignIn: true,
      autoSignInAfterVerification: true,
      expiresIn: 60 * 60 * 24,
      sendVerificationEmail: async ({ user, url }) => {
        await hooks.sendVerificationEmail({ name: user.name, email: user.email, url });
      },
    },
    session: { expiresIn: 60 * 60 * 24 * 7, updateAge: 60 * 60 * 24 },
    // Rate limiting is done by express-rate-limit in front of the auth routes (server/app.ts).
    rateLimit: { enabled: false },
    advanced: { useSecureCookies: config.env === 'production' },
    // better-auth's own messages go to the app's logger (which redacts credentials).
    logger: {
      disabled: logger === undefined,
      log: (level, message) => logger?.[level]({ source: 'better-auth' }, message),
    },
    hooks: {
      before: createAuthMiddleware(async (ctx) => {
        if (ctx.path === '/sign-in/email') {
          const body = signInBodySchema.safeParse(ctx.body);
          if (!body.success) return;
          const waitSeconds = await secondsUntilSignInAllowed(db, body.data.email);
          if (waitSeconds > 0) {
            throw new APIError(
              'TOO_MANY_REQUESTS',
              { code: 'ACCOUNT_LOCKED', message: `Too many failed sign-ins for this account. Wait ${waitSeconds} seconds, then try again, or reset your password.` },
              { 'Retry-After': String(waitSeconds) },
            );
          }
          return;
        }
        if (passwordSettingPaths.has(ctx.path)) {
          const body = passwordBodySchema.safeParse(ctx.body);
          if (!body.success) return;
          const password = body.data.newPassword ?? body.data.password;
          if (password === undefined) return;
          const problem = passwordProblem(password, [body.data.email ?? '', body.data.name ?? ''].filter((v) => v !== ''));
          if (problem) throw new APIError('BAD_REQUEST', { code: 'PASSWORD_TOO_WEAK', message: problem });
        }
      }),
      after: createAuthMiddleware(async (ctx) => {
        if (ctx.path !== '/sign-in/email') return;
        const body = signInBodySchema.safeParse(ctx.body);
        if (!body.success) return;
        const returned: unknown = ctx.context.returned;
        if (isAPIError(returned)) {
          if (returned.statusCode === 401) await recordFailedSignIn(db, body.data.email);
        } else {
          await clearSignInFailures(db, body.data.email);
        }
      }),
    },
    plugins: [admin({ defaultRole: 'subscriber', adminRoles: ['admin'], ac: authAccessControl, roles: authRoles })],
  });
}

export type Auth = ReturnType<typeof createAuth>;
