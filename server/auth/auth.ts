import { betterAuth } from 'better-auth';
import { drizzleAdapter } from 'better-auth/adapters/drizzle';
import { admin } from 'better-auth/plugins';
import type { Config } from '../config';
import type { Database } from '../db/client';
import * as schema from '../db/schema';
import { authAccessControl, authRoles } from './roles';

export interface AuthHooks {
  /** Called when someone asks for a password reset; sends the mail (through a service). */
  sendResetPassword(input: { name: string; email: string; url: string }): Promise<void>;
  /** Called when a self-registered account must confirm its address; sends the mail. */
  sendVerificationEmail(input: { name: string; email: string; url: string }): Promise<void>;
}

/**
 * The better-auth instance: e-mail + password, sessions in the database, roles from the admin
 * plugin. Self-registration always creates a `subscriber` (the role field does not accept input)
 * whose address is confirmed by e-mail before the first sign-in.
 */
export function createAuth(config: Config, db: Database, hooks: AuthHooks) {
  const trustedOrigins = [config.publicUrl];
  if (config.env !== 'production') trustedOrigins.push('http://localhost:5173', `http://localhost:${config.port}`, `http://127.0.0.1:${config.port}`);
  return betterAuth({
    appName: 'Stormdraft',
    baseURL: config.publicUrl,
    basePath: '/api/auth',
    secret: config.authSecret,
    trustedOrigins,
    database: drizzleAdapter(db, { provider: 'pg', schema, usePlural: true }),
    emailAndPassword: {
      enabled: true,
      minPasswordLength: 10,
      maxPasswordLength: 128,
      resetPasswordTokenExpiresIn: 60 * 60,
      revokeSessionsOnPasswordReset: true,
      // Self-registered subscribers confirm their address before the first sign-in; accounts made
      // by an admin (and the demo accounts) are created already verified.
      requireEmailVerification: true,
      sendResetPassword: async ({ user, url }) => {
        await hooks.sendResetPassword({ name: user.name, email: user.email, url });
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
    plugins: [admin({ defaultRole: 'subscriber', adminRoles: ['admin'], ac: authAccessControl, roles: authRoles })],
  });
}

export type Auth = ReturnType<typeof createAuth>;
