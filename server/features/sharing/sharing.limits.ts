/**
 * Rate limits on the public pages, counted in PostgreSQL like every other limit
 * (shared by every process): the page's HTML and data on one counter, its photos
 * on another, per client address per minute.
 */
import type { AppDeps } from '@server/lib/deps';
import { createRateLimit } from '@server/middleware/rate-limit';

export function sharedLimits({ db, config }: Pick<AppDeps, 'db' | 'config'>) {
  const message = 'Too many requests for shared builds from here. Wait a minute and try again.';
  return {
    page: createRateLimit(db.knex, {
      prefix: `${config.rateLimitPrefix}shared-page:`,
      limit: config.sharedPageRateLimit,
      windowMs: 60_000,
      message,
    }),
    photo: createRateLimit(db.knex, {
      prefix: `${config.rateLimitPrefix}shared-photo:`,
      limit: config.sharedPhotoRateLimit,
      windowMs: 60_000,
      message,
    }),
  };
}
