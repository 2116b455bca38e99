import type { Logger } from 'pino';
import type { Config } from './config';
import type { Database } from './db/client';
import type { Auth } from './auth/auth';
import type { Mailer } from './mail/send-mail';

/** What every route and service may use; built once at start-up (server/start.ts). */
export interface AppContext {
  config: Config;
  db: Database;
  auth: Auth;
  mailer: Mailer;
  logger: Logger;
  ping(): Promise<void>;
}
