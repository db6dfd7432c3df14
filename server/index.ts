import { createApp } from './app';
import { loadConfig } from './config';
import { createDatabase } from './lib/database';
import { createLogger } from './lib/logger';
import { startMailCatcher, type MailCatcher } from './lib/mail-catcher';
import { createMailer } from './lib/mailer';
import { createFileWorker } from './features/files';
import { createMailWorker } from './features/mail';
import { createDigestWorker } from './features/timeline';
import { createStorage, describeStorage } from './lib/stores';

const config = loadConfig();
const logger = createLogger(config.logLevel);
const db = createDatabase(config.databaseUrl, {
  // PostgreSQL restarting drops idle connections; the pool replaces them on the next request.
  onError: (err) => logger.warn({ err: err.message }, 'a database connection was dropped'),
});
// The local disk, or the object store with STORAGE=s3 (shared by every app process).
const storage = createStorage(config);
logger.info(describeStorage(config));
const app = createApp({ db, config, logger, storage });

// Mail: without SMTP settings a local catcher keeps every message under MAIL_DIR
// (listed at /dev/mail); the worker sends the outbox in this process either way.
let catcher: MailCatcher | null = null;
if (!config.mail.smtp) {
  try {
    catcher = await startMailCatcher({ port: config.mail.catcherPort, dir: config.mail.dir });
    logger.info(
      `mail catcher on 127.0.0.1:${catcher.port}, messages in ${catcher.dir}, listed at ${config.appUrl}/dev/mail`,
    );
  } catch (err) {
    logger.fatal(
      { err },
      `the mail catcher cannot listen on 127.0.0.1:${config.mail.catcherPort}: set MAIL_CATCHER_PORT to a free port, or SMTP_URL to send real mail`,
    );
    process.exit(1);
  }
}
const mailer = createMailer(config.mail);
const mailWorker = createMailWorker({
  knex: db.knex,
  mailer,
  logger,
  appUrl: config.appUrl,
  pollMs: config.mail.pollMs,
});
mailWorker.start();
// Files of deleted rows that could not be removed at once are retried here.
const fileWorker = createFileWorker({ knex: db.knex, storage, logger });
fileWorker.start();
// The weekly timeline digest: queued once per member and week, whichever process gets there first.
const digestWorker = createDigestWorker({ knex: db.knex, logger });
digestWorker.start();

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
  // Queued mail stays in PostgreSQL; a pass under way finishes first.
  await mailWorker.stop();
  await fileWorker.stop();
  await digestWorker.stop();
  storage.close?.();
  mailer.close();
  await catcher?.close();
  await db.close().catch(() => undefined);
  logger.flush();
  process.exit(0);
}
process.on('SIGINT', () => void stop('SIGINT'));
process.on('SIGTERM', () => void stop('SIGTERM'));
