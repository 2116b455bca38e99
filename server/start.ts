import type { Server } from 'node:http';
import type { Express } from 'express';
import { pino, type Logger } from 'pino';
import { createApp, type ClientMode } from './app';
import { createAuth } from './auth/auth';
import type { Config } from './config';
import type { AppContext } from './context';
import { openDatabase } from './db/client';
import { startMailCatcher, type MailCatcher } from './mail/mail-catcher';
import { createMailer } from './mail/send-mail';
import { sendPasswordResetMail, sendVerificationMail, storeCaughtMail } from './services/mail.service';
import { ensureOffice, seedDemo } from './services/seed.service';
import { recoverOutbox, startOutboxWorker } from './services/outbox.service';
import { startVerificationWorker, verifyDueIssuances } from './services/verification.service';

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
  const logger = options.logger ?? pino({ level: config.logLevel });
  const database = await openDatabase({ databaseUrl: config.databaseUrl, dataDir: config.dataDir, loadDataDir: options.loadDataDir });
  const db = database.db;
  const catcher = config.smtpUrl ? undefined : await startMailCatcher((message) => storeCaughtMail(db, message));
  const mailer = createMailer(config.smtpUrl ?? catcher?.url ?? 'smtp://127.0.0.1:25', 'Stormdraft <outlooks@stormdraft.test>');
  const auth = createAuth(config, db, {
    sendResetPassword: (input) => sendPasswordResetMail(db, mailer, input),
    sendVerificationEmail: (input) => sendVerificationMail(db, mailer, input),
  });
  const ctx: AppContext = { config, db, auth, mailer, logger, ping: database.ping };
  if (config.seedDemo) await seedDemo(db, auth, config);
  else await ensureOffice(db);
  await recoverOutbox(db);
  const stopWorker = config.outboxIntervalMs > 0 ? startOutboxWorker(db, mailer, config.outboxIntervalMs, (error) => logger.error({ err: error }, 'outbox worker')) : async () => {};
  // Issuances whose period ended while the app was down are scored now; then every few minutes.
  await verifyDueIssuances(db);
  const stopVerification = config.outboxIntervalMs > 0 ? startVerificationWorker(db, 5 * 60_000, (error) => logger.error({ err: error }, 'verification worker')) : async () => {};
  const app = await createApp(ctx, options.clientMode);
  return {
    app,
    ctx,
    catcher,
    dump: database.dump,
    async close() {
      await stopWorker();
      await stopVerification();
      mailer.close();
      await catcher?.close();
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
