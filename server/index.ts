import { createApp } from './app';
import { loadConfig } from './config';
import { createDatabase } from './lib/database';
import { createLogger } from './lib/logger';

const config = loadConfig();
const logger = createLogger(config.logLevel);
const db = createDatabase(config.databaseUrl);
const app = createApp({ db, config, logger });

const server = app.listen(config.port, config.host, () => {
  logger.info(`Headroom is listening on http://${config.host}:${config.port}`);
});
server.on('error', (err) => {
  logger.fatal({ err }, `cannot listen on ${config.host}:${config.port}`);
  process.exit(1);
});

let stopping = false;
async function stop(signal: string) {
  if (stopping) return;
  stopping = true;
  logger.info(`${signal}: closing`);
  server.close();
  server.closeAllConnections();
  await db.close().catch(() => undefined);
  process.exit(0);
}
process.on('SIGINT', () => void stop('SIGINT'));
process.on('SIGTERM', () => void stop('SIGTERM'));
