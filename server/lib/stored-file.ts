/**
 * One way to answer with a stored file, for every route that serves one
 * (photos, bench originals, dyno attachments), always after the route's own
 * access check:
 *
 * - a store that signs (S3 with S3_PRESIGNED_URLS=1): 302 to a signed GET URL,
 *   so the bytes go from the store to the browser without passing through the
 *   app. The URL fixes the response's type, disposition and caching, whatever
 *   metadata the object has. Its signing time is rounded down to a window of
 *   `cacheSeconds`, so every request in a window gets the same URL and the
 *   browser's cache of the image holds; the redirect itself may be kept until
 *   the window ends, and the URL stays valid a few minutes past that.
 * - any other store: the bytes streamed through the app with the same headers.
 */
import { pipeline } from 'node:stream/promises';
import { create as contentDispositionHeader } from 'content-disposition';
import type { Response } from 'express';
import { NotFoundError } from './errors';
import { weakEtag } from './etag';
import type { Storage } from './storage';

export type StoredFileOptions = {
  contentType: string;
  /** inline (shown in the page, e.g. an image) or attachment (always a download). */
  disposition: 'inline' | 'attachment';
  /** The name offered to the browser; may hold any Unicode (sent as RFC 6266 allows). */
  fileName: string;
  /** How long a browser may keep the file (private: members only, never a shared cache). */
  cacheSeconds: number;
  /** The message of the 404 when the store has no such object. */
  missingMessage?: string;
  /** Called when the store has no such object (the caller logs what it was). */
  onMissing?: () => void;
  /** The clock, for tests. */
  now?: () => number;
};

/** Extra life of a signed URL past its window: the time between a redirect and the browser's GET. */
export const signedUrlGraceSeconds = 300;

export function contentDisposition(type: 'inline' | 'attachment', fileName: string) {
  return contentDispositionHeader(fileName, { type });
}

/**
 * The signing time and life of the URL for `now`: the window's start, and the
 * window plus the grace. The redirect may be cached until the window ends.
 */
export function signingWindow(now: number, cacheSeconds: number) {
  const windowMs = Math.max(1, Math.round(cacheSeconds)) * 1000;
  const start = Math.floor(now / windowMs) * windowMs;
  return {
    signingDate: new Date(start),
    expiresInSeconds: windowMs / 1000 + signedUrlGraceSeconds,
    redirectMaxAge: Math.max(0, Math.floor((start + windowMs - now) / 1000)),
  };
}

export async function sendStoredFile(
  res: Response,
  storage: Storage,
  key: string,
  options: StoredFileOptions,
): Promise<void> {
  const disposition = contentDisposition(options.disposition, options.fileName);
  const cacheControl = `private, max-age=${Math.round(options.cacheSeconds)}`;

  if (storage.signedGetUrl) {
    const w = signingWindow((options.now ?? Date.now)(), options.cacheSeconds);
    const url = await storage.signedGetUrl(key, {
      contentType: options.contentType,
      contentDisposition: disposition,
      cacheControl,
      signingDate: w.signingDate,
      expiresInSeconds: w.expiresInSeconds,
    });
    res.set('Cache-Control', `private, max-age=${w.redirectMaxAge}`).redirect(302, url);
    return;
  }

  const missing = () => {
    options.onMissing?.();
    return new NotFoundError(options.missingMessage ?? 'File not found');
  };
  res
    .type(options.contentType)
    .set('Cache-Control', cacheControl)
    .set('Content-Disposition', disposition)
    .set('X-Content-Type-Options', 'nosniff');

  if (!storage.open) {
    const data = await storage.get(key);
    if (!data) throw missing();
    res.set('ETag', weakEtag(data)).send(data);
    return;
  }
  const file = await storage.open(key);
  if (!file) throw missing();
  if (file.etag) {
    res.set('ETag', file.etag);
    if (res.req.fresh) {
      file.body.destroy();
      res.status(304).end();
      return;
    }
  }
  res.set('Content-Length', String(file.size));
  if (res.req.method === 'HEAD') {
    file.body.destroy();
    res.end();
    return;
  }
  try {
    await pipeline(file.body, res);
  } catch (err) {
    // The browser went away, or the store broke off: nothing more can be said on this response.
    if (!res.headersSent) throw err;
    res.destroy();
  }
}
