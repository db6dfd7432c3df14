import express from 'express';
import compression from 'compression';
import fs from 'node:fs';
import path from 'node:path';
import type { AppConfig } from './config';
import { createSessions } from './lib/auth';
import type { Database } from './lib/database';
import { createLogger, type Logger } from './lib/logger';
import type { Storage } from './lib/storage';
import { createStorage } from './lib/stores';
import './lib/request';
import { errorHandler, notFoundApi } from './middleware/error-handler';
import { createBuildAccess } from './middleware/build-access';
import { moneyFilter } from './middleware/money-filter';
import { originCheck } from './middleware/origin-check';
import { requestLog } from './middleware/request-log';
import { helmetOptions, securityHeaders } from './middleware/security-headers';
import { assertNoNul } from './middleware/validate';
import { loadSession } from './middleware/require-auth';
import type { AppDeps } from './lib/deps';
import { devMailRouter } from './features/mail/dev-mail.router';
import { findRole } from './features/members';
import { sharedPageShell } from './features/sharing';
import { apiRoutes, listRoutes } from './routes';

/** Builds the Express app. Never listens: server/index.ts and the tests do that. */
export function createApp(opts: {
  db: Database;
  config: AppConfig;
  logger?: Logger;
  storage?: Storage;
}) {
  const logger = opts.logger ?? createLogger(opts.config.logLevel);
  // Photos and attachments: the store the config names (the local disk by default) unless the caller passes one.
  const storage = opts.storage ?? createStorage(opts.config);
  const deps: AppDeps = {
    ...opts,
    logger,
    sessions: createSessions(opts.db.pool),
    storage,
    access: createBuildAccess(opts.db.knex, findRole),
  };
  const app = express();

  app.disable('x-powered-by');
  // No automatic ETag: API answers are no-store, so hashing each one served nobody. Answers
  // that are revalidated set their own (calendar feed, stored files: lib/etag.ts; the shared
  // page: sharing.http.ts); express.static and sendFile keep theirs.
  app.set('etag', false);
  // gzip for the client's files and large JSON (photo bytes are JPEG already and are skipped).
  // A smaller answer reaches the browser in the first round trip anyway (TCP's initial window
  // is about 14 KB), so gzip would only cost CPU: a zlib stream for every answer.
  // The health check ({ok}, polled by monitors) skips it: its wrapping alone costs more than the answer.
  const compress = compression({ threshold: '8kb' });
  app.use((req, res, next) => (req.url === '/api/health' ? next() : compress(req, res, next)));
  app.set('trust proxy', opts.config.trustProxy ? 1 : false);
  app.use(
    securityHeaders(
      helmetOptions({ imageOrigin: storage.signedUrlOrigin, hsts: opts.config.trustProxy }),
    ),
  );
  // One line a request, written asynchronously; the health check (polled by monitors) is not logged.
  if (opts.config.env !== 'test') {
    app.use(requestLog(logger.requests, { ignore: (url) => url === '/api/health' }));
  }

  const api = express.Router();
  // One layer before every route (each router layer costs on every request, the health
  // check's too). API answers are per person and may carry money: no browser or proxy
  // cache keeps them; routes that send photo or file bytes set their own private caching.
  // A write's JSON body is parsed, refused if it holds U+0000 (PostgreSQL cannot store it),
  // then its Origin is checked (CSRF); a read has no body to parse.
  const parseJson = express.json({ limit: '2mb' });
  const checkOrigin = originCheck(opts.config.allowedOrigins);
  api.use((req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    if (req.method === 'GET' || req.method === 'HEAD') return next();
    // Inside body-parser's callback a throw would not reach Express: it is passed on.
    parseJson(req, res, (err?: unknown) => {
      try {
        if (err) throw err;
        assertNoNul(req.body);
        checkOrigin(req, res, next);
      } catch (refused) {
        next(refused);
      }
    });
  });
  const mounts = apiRoutes(deps);
  // Routes that need no session (the health check) answer without the session lookup.
  for (const mount of mounts.filter((m) => m.anonymous)) api.use(mount.path, mount.router);
  api.use(loadSession(deps.sessions));
  api.use(moneyFilter);
  for (const mount of mounts.filter((m) => !m.anonymous)) api.use(mount.path, mount.router);
  api.use(notFoundApi);
  api.use(errorHandler(logger));
  app.use('/api', api);
  // The local catcher's mailbox; 404 in production and when real SMTP is set.
  app.use('/dev/mail', devMailRouter(opts.config));

  const distDir = opts.config.clientDir;
  if (opts.config.serveClient && fs.existsSync(path.join(distDir, 'index.html'))) {
    app.use(express.static(distDir, { index: false, maxAge: '1h' }));
    // A shared build's page: its link-preview tags written into the shell (previews run no script).
    app.get(['/shared/:token', '/shared/:token/sheet'], ...sharedPageShell(deps));
    // Client-side routes: every other GET gets the app shell.
    app.get(/.*/, (_req, res) => res.sendFile(path.join(distDir, 'index.html')));
  }
  app.use(errorHandler(logger));
  // The route table, for the fuzz test and the README's route list.
  return Object.assign(app, { routes: listRoutes(mounts) });
}
