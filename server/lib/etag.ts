/**
 * Express's weak ETag of a body, in its own format (`W/"<length>-<sha1>"`), for the few
 * answers that are revalidated: the app turns Express's automatic ETag off (app.ts), since
 * hashing every `no-store` API answer (20–40 µs for the parts list's 22 KB) bought nothing.
 * Set it before res.send: Express still answers 304 when the request's If-None-Match matches.
 */
import { createHash } from 'node:crypto';

export function weakEtag(body: string | Buffer) {
  const bytes = typeof body === 'string' ? Buffer.from(body) : body;
  const hash = createHash('sha1').update(bytes).digest('base64').substring(0, 27);
  return `W/"${bytes.length.toString(16)}-${hash}"`;
}
