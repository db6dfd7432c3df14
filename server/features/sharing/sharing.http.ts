/**
 * How every public answer leaves (the page's HTML, its data, its photos): `no-cache`, so a
 * browser or proxy may keep a copy but must ask again each time — and a switched-off or
 * renewed address answers 404 at once — with a strong ETag of the bytes, 304 when the
 * client already has them, and `noindex` unless the owner allowed search engines.
 */
import { createHash } from 'node:crypto';
import type { Request, Response } from 'express';

export const noindex = 'noindex, nofollow, noarchive';

export function etagOf(body: string | Buffer) {
  return `"${createHash('sha256').update(body).digest('base64url').slice(0, 32)}"`;
}

export function publicHeaders(res: Response, allowIndexing: boolean) {
  res.set('Cache-Control', 'no-cache');
  if (allowIndexing) res.removeHeader('X-Robots-Tag');
  else res.set('X-Robots-Tag', noindex);
}

/** Sends `body` with the public headers; 304 without a body when If-None-Match matches. */
export function sendPublic(
  req: Request,
  res: Response,
  body: string | Buffer,
  opts: { type: string; allowIndexing: boolean; status?: number },
) {
  publicHeaders(res, opts.allowIndexing);
  res.status(opts.status ?? 200).type(opts.type);
  if ((opts.status ?? 200) === 200) {
    res.set('ETag', etagOf(body));
    if (req.fresh) {
      res.status(304).end();
      return;
    }
  }
  res.send(body);
}
