import type { Server } from 'node:http';
import type { Express } from 'express';
import type { Logger } from 'pino';
import { createApp, type ClientMode } from './app';
import { createAuth } from './auth/auth';
import type { Config } from './config';
import type { AppContext } from './context';
import { openDatabase } from './db/client';
import { createLogger } from './middleware/request-logger';
import { startMailCatcher, type MailCatcher } from './mail/mail-catcher';
import { createMailer } from './mail/send-mail';
import { sendPasswordResetMail, sendVerificationMail, storeCaughtMail } from './services/mail.service';
import { ensureOffice, seedDemo } from './services/seed.service';
import { startOutboxWorker } from './services/outbox.service';
import { startDistributionWorker } from './services/distribution.service';
import { startWebhookWorker } from './services/webhooks.service';
import { startVerificationWorker, verifyDueIssuances } from './services/verification.service';
import { closeGeometryPool } from './workers/geometry-pool';
import { eccodesStatus } from './ingest/eccodes';
import { startIntake } from './ingest/intake/intake-runtime';
import { runRetentionIdle } from './services/model-runs.service';

export interface StartOptions {
  clientMode: ClientMode;
  /** Tests start from a dumped, already-migrated PGlite data directory. */
  loadDataDir?: Blob;
  logger?: Logger;
}

export interface Stormdraft {
  app: Express;
  ctx: AppContext;
  catcher: MailCatcher | undefined;
  dump?: () => Promise<Blob>;
  /** Stops the mail catcher and closes the database (graceful shutdown). */
  close(): Promise<void>;
}

/**
 * Opens the database (migrations applied), starts the local mail catcher when no SMTP_URL is
 * set, seeds the office (and the demo data outside production) and builds the app.
 */
export async function startStormdraft(config: Config, options: StartOptions): Promise<Stormdraft> {
  const logger = options.logger ?? createLogger(config.logLevel);
  const database = await openDatabase({ databaseUrl: config.databaseUrl, dataDir: config.dataDir, loadDataDir: options.loadDataDir });
  const db = database.db;
  const catcher = config.smtpUrl ? undefined : await startMailCatcher((message) => storeCaughtMail(db, message));
  const mailer = createMailer(config.smtpUrl ?? catcher?.url ?? 'smtp://127.0.0.1:25', config.mailFrom);
  const auth = createAuth(config, db, {
    sendResetPassword: (input) => sendPasswordResetMail(db, mailer, input),
    sendVerificationEmail: (input) => sendVerificationMail(db, mailer, input),
  }, logger);
  const ctx: AppContext = { config, db, auth, mailer, logger, ping: database.ping };
  if (config.seedDemo) await seedDemo(db, auth, config);
  else await ensureOffice(db);
  // No start-up re-queue of "sending" rows: another instance may still be sending them; an
  // expired claim is re-claimed by the outbox worker instead.
  const stopWorker = config.outboxIntervalMs > 0 ? startOutboxWorker(db, mailer, config.outboxIntervalMs, (error) => logger.error({ err: error }, 'outbox worker')) : async () => {};
  // Publishing leaves a distribution job; this worker turns it into mail (tests drive it themselves).
  const stopDistribution = config.outboxIntervalMs > 0 ? startDistributionWorker(db, config, config.outboxIntervalMs, (error) => logger.error({ err: error }, 'distribution worker')) : async () => {};
  const stopWebhooks = config.outboxIntervalMs > 0 ? startWebhookWorker(db, config.outboxIntervalMs, (error) => logger.error({ err: error }, 'webhook worker')) : async () => {};
  // Issuances whose period ended while the app was down are scored now; then every few minutes.
  await verifyDueIssuances(db);
  const stopVerification = config.outboxIntervalMs > 0 ? startVerificationWorker(db, 5 * 60_000, (error) => logger.error({ err: error }, 'verification worker')) : async () => {};
  const app = await createApp(ctx, options.clientMode);
  // GRIB2/BUFR intake needs ecCodes; the app runs without it and says what is disabled.
  void eccodesStatus().then((status) => (status.available ? logger.info(status.message) : logger.warn(status.message)));
  // The intake folder and scheduled pulls (GRIB2, BUFR, CSV taken in on their own).
  const intake = config.intakeDir ? await startIntake(ctx, config.intakeDir) : undefined;
  return {
    app,
    ctx,
    catcher,
    dump: database.dump,
    async close() {
      await intake?.stop();
      await stopDistribution();
      await stopWorker();
      await closeGeometryPool();
      await stopWebhooks();
      await stopVerification();
      mailer.close();
      await catcher?.close();
      await runRetentionIdle();
      await database.close();
    },
  };
}

/** Listens on `port`; resolves with the HTTP server. */
export function listen(app: Express, port: number): Promise<Server> {
  return new Promise((resolve, reject) => {
    const server = app.listen(port, (error?: Error) => (error ? reject(error) : resolve(server)));
  });
}
