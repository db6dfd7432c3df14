/**
 * The HTML shell of a public build page (/shared/:token and its printable sheet):
 * the built client's index.html with the page's title, description, Open Graph
 * and robots tags written in by Express, because link previews (messaging apps,
 * forums) read the HTML and run no script. A page that is not shared gets the
 * shell with a 404 status and nothing of any build in it.
 */
import fs from 'node:fs/promises';
import path from 'node:path';
import type { RequestHandler } from 'express';
import type { AppDeps } from '@server/lib/deps';
import { NotFoundError } from '@server/lib/errors';
import { noindex, sendPublic } from './sharing.http';
import { previewOf, type Preview } from './sharing.preview';
import { sharedLimits } from './sharing.limits';
import * as service from './sharing.service';
import { paths } from '@shared/paths';

const escape = (s: string) =>
  s.replace(
    /[&<>"']/g,
    (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!,
  );

function headTags(p: Preview | null, opts: { url: string; allowIndexing: boolean }) {
  const meta = (attr: 'name' | 'property', key: string, value: string) =>
    `<meta ${attr}="${key}" content="${escape(value)}" />`;
  const tags: string[] = [];
  if (!opts.allowIndexing) tags.push(meta('name', 'robots', noindex));
  if (!p) {
    tags.push('<title>Build not shared · Headroom</title>');
    return tags.join('\n    ');
  }
  tags.push(
    `<title>${escape(p.title)} · Headroom</title>`,
    meta('name', 'description', p.description),
    meta('property', 'og:type', 'website'),
    meta('property', 'og:site_name', 'Headroom'),
    meta('property', 'og:title', p.title),
    meta('property', 'og:description', p.description),
    meta('property', 'og:url', opts.url),
  );
  if (p.image) {
    tags.push(
      meta('property', 'og:image', p.image.url),
      meta('property', 'og:image:width', String(p.image.width)),
      meta('property', 'og:image:height', String(p.image.height)),
      meta('property', 'og:image:alt', p.image.alt),
      meta('name', 'twitter:card', 'summary_large_image'),
    );
  } else {
    tags.push(meta('name', 'twitter:card', 'summary'));
  }
  return tags.join('\n    ');
}

/** The built shell with its generic title and description replaced by `tags`. */
function withHead(template: string, tags: string) {
  return template
    .replace(/\s*<meta\s+name="description"[^>]*>/i, '')
    .replace(/<title>[^<]*<\/title>/i, tags);
}

/** GET /shared/:token and /shared/:token/sheet, before the client's catch-all. */
export function sharedPageShell(deps: AppDeps): RequestHandler[] {
  const { knex } = deps.db;
  const { appUrl, clientDir } = deps.config;
  const handler: RequestHandler = async (req, res) => {
    // Read per request: a new client build is served without a restart.
    const template = await fs.readFile(path.join(clientDir, 'index.html'), 'utf8');
    const token = String(req.params.token);
    const share = await service.resolve(knex, token).catch((err: unknown) => {
      if (err instanceof NotFoundError) return null;
      throw err;
    });
    if (!share) {
      sendPublic(req, res, withHead(template, headTags(null, { url: '', allowIndexing: false })), {
        type: 'html',
        allowIndexing: false,
        status: 404,
      });
      return;
    }
    const base = `${appUrl}/api/shared/${share.token}`;
    const preview = await previewOf(knex, share, {
      photo: (id) => `${base}/photos/${id}/web`,
    });
    const html = withHead(
      template,
      headTags(preview, {
        url: appUrl + paths.shared.page.getHref(share.token),
        allowIndexing: share.allowIndexing,
      }),
    );
    sendPublic(req, res, html, { type: 'html', allowIndexing: share.allowIndexing });
  };
  return [sharedLimits(deps).page, handler];
}
