import path from 'node:path';
import { z } from 'zod';

export const developmentAuthSecret = 'stormdraft-development-secret-change-me-0123456789';

/** Sender of every e-mail unless MAIL_FROM says otherwise. */
export const defaultMailFrom = 'Stormdraft <outlooks@stormdraft.test>';

const envSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  DATA_DIR: z.string().default('./data'),
  DATABASE_URL: z.string().optional(),
  SMTP_URL: z.string().optional(),
  BETTER_AUTH_SECRET: z.string().min(32, { message: 'BETTER_AUTH_SECRET must be at least 32 characters.' }).default(developmentAuthSecret),
  PUBLIC_URL: z.string().url({ message: 'PUBLIC_URL must be a URL such as https://outlooks.example.org' }).optional(),
  LOG_LEVEL: z.enum(['fatal', 'error', 'warn', 'info', 'debug', 'trace', 'silent']).default('info'),
  AUTH_RATE_LIMIT_PER_MINUTE: z.coerce.number().int().positive().default(60),
  MAIL_FROM: z.string().trim().min(3).max(200).regex(/@/, { message: 'MAIL_FROM must hold an e-mail address, e.g. "Meridian Valley Outlooks <outlooks@example.org>".' }).default(defaultMailFrom),
  TILE_URL: z
    .string()
    .trim()
    .regex(/^https?:\/\/[^\s]+\{z\}[^\s]*\{x\}[^\s]*\{y\}/, { message: 'TILE_URL must be an http(s) tile template with {z}, {x} and {y}, e.g. https://tiles.example.org/{z}/{x}/{y}.png' })
    .optional(),
  TILE_ATTRIBUTION: z.string().trim().max(300).optional(),
});

export interface Config {
  env: 'development' | 'production' | 'test';
  port: number;
  dataDir: string | undefined;
  databaseUrl: string | undefined;
  smtpUrl: string | undefined;
  authSecret: string;
  publicUrl: string;
  logLevel: z.infer<typeof envSchema>['LOG_LEVEL'];
  authRateLimitPerMinute: number;
  /** Serve the client through Vite's dev middleware instead of the built `dist/`. */
  viteDev: boolean;
  /** Seed the demo office and accounts (never in production). */
  seedDemo: boolean;
  /** How often the mail outbox worker looks for messages to send; 0 turns the worker off. */
  outboxIntervalMs: number;
  /** The From of every e-mail (MAIL_FROM). */
  mailFrom: string;
  /** Base-map tile template for every map, client and server (TILE_URL); none: offline outlines only. */
  tileUrl: string | undefined;
  tileAttribution: string | undefined;
}

/** The base map the client draws, from the configuration (sent with the office settings). */
export function baseMapOf(config: Pick<Config, 'tileUrl' | 'tileAttribution'>): { tileUrl: string | null; attribution: string | null } {
  return { tileUrl: config.tileUrl ?? null, attribution: config.tileUrl ? (config.tileAttribution ?? null) : null };
}

/** Reads and checks the environment; throws with a readable message when something is wrong. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env, argv: string[] = process.argv): Config {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join('.')}: ${i.message}`);
    throw new Error(`Configuration is not valid:\n${lines.join('\n')}`);
  }
  const e = parsed.data;
  if (e.NODE_ENV === 'production' && e.BETTER_AUTH_SECRET === developmentAuthSecret) {
    throw new Error('BETTER_AUTH_SECRET is the development default; set a secret of your own (32+ characters) in production.');
  }
  return {
    env: e.NODE_ENV,
    port: e.PORT,
    dataDir: path.resolve(e.DATA_DIR),
    databaseUrl: e.DATABASE_URL || undefined,
    smtpUrl: e.SMTP_URL || undefined,
    authSecret: e.BETTER_AUTH_SECRET,
    publicUrl: (e.PUBLIC_URL ?? `http://localhost:${e.PORT}`).replace(/\/$/, ''),
    logLevel: e.LOG_LEVEL,
    authRateLimitPerMinute: e.AUTH_RATE_LIMIT_PER_MINUTE,
    viteDev: argv.includes('--dev'),
    seedDemo: e.NODE_ENV !== 'production',
    outboxIntervalMs: 2000,
    mailFrom: e.MAIL_FROM,
    tileUrl: e.TILE_URL || undefined,
    tileAttribution: e.TILE_ATTRIBUTION || undefined,
  };
}
