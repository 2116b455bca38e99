import { loadConfig } from './config';
import { listen, startStormdraft } from './start';

const config = loadConfig();
const stormdraft = await startStormdraft(config, { clientMode: config.viteDev ? 'vite-dev' : 'dist' });
const server = await listen(stormdraft.app, config.port);
const { logger } = stormdraft.ctx;
logger.info(
  { port: config.port, database: config.databaseUrl ? 'postgres' : `pglite:${config.dataDir}`, mail: config.smtpUrl ? 'smtp relay' : `local catcher on ${stormdraft.catcher?.url}` },
  `Stormdraft is listening on ${config.publicUrl}`,
);

let stopping = false;
async function shutdown(signal: string) {
  if (stopping) return;
  stopping = true;
  logger.info({ signal }, 'shutting down');
  server.close();
  server.closeAllConnections();
  await stormdraft.close();
  process.exit(0);
}
process.on('SIGINT', () => void shutdown('SIGINT'));
process.on('SIGTERM', () => void shutdown('SIGTERM'));
