/**
 * What every router receives from createApp(). Here in lib, not in app.ts, so
 * features depend on lib and never on the app that assembles them.
 */
import type { RequestHandler } from 'express';
import type { Action } from '@shared/permissions';
import type { AppConfig } from '@server/config';
import type { Sessions } from './auth';
import type { Database } from './database';
import type { Logger } from './logger';
import type { Storage } from './storage';

/** The one access check for /api/builds/:buildId/…: 401, 404 for strangers, 403 by role. */
export type BuildAccess = (action: Action) => RequestHandler;

export type AppDeps = {
  db: Database;
  config: AppConfig;
  logger: Logger;
  sessions: Sessions;
  storage: Storage;
  access: BuildAccess;
};
