/**
 * /dev/mail: the messages the local catcher kept, for development and tests.
 * Only when no SMTP server is configured and never in production (404 there).
 * HTML for people; `?format=json` (or Accept: application/json) for scripts
 * and Playwright.
 */
import { Router, type Request, type RequestHandler } from 'express';
import type { AppConfig } from '@server/config';
import {
  listCaughtMail,
  readCaughtMail,
  readCaughtMailSource,
  type CaughtMail,
} from '@server/lib/mail-catcher';
import { configuredHosts } from '@server/middleware/origin-check';
import { escapeHtml } from './mail.templates';

const wantsJson = (req: Request) =>
  req.query.format === 'json' || req.accepts(['html', 'json']) === 'json';

function page(title: string, body: string) {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(title)} · Headroom dev mail</title>
<style>
body{margin:0;font-family:'Source Sans 3','Segoe UI',Helvetica,Arial,sans-serif;color:#1b2230;background:#eef0f3}
header{background:#1b2230;color:#fff;padding:12px 20px;font-weight:700}header a{color:#fff;text-decoration:none}
main{max-width:960px;margin:0 auto;padding:16px}table{width:100%;border-collapse:collapse;background:#fff}
th,td{text-align:left;padding:8px 10px;border-bottom:1px solid #e3e6ea;vertical-align:top}a{color:#b04d1f}
pre{white-space:pre-wrap;background:#fff;padding:12px;border:1px solid #e3e6ea}iframe{width:100%;height:640px;border:1px solid #e3e6ea;background:#fff}
.muted{color:#5b6472;font-size:14px}
</style></head><body><header><a href="/dev/mail">Headroom · dev mail</a></header><main>${body}</main></body></html>`;
}

function listPage(messages: CaughtMail[], dir: string) {
  const rows = messages
    .map(
      (m) =>
        `<tr><td>${escapeHtml(m.date ?? '')}</td><td>${escapeHtml(m.to)}</td><td><a href="/dev/mail/${m.file}">${escapeHtml(m.subject || '(no subject)')}</a></td></tr>`,
    )
    .join('\n');
  return page(
    'Caught mail',
    `<h1>Caught mail</h1><p class="muted">Every message Headroom sent while no SMTP server is set. Files in ${escapeHtml(dir)}.</p>
${messages.length ? `<table><thead><tr><th>When</th><th>To</th><th>Subject</th></tr></thead><tbody>${rows}</tbody></table>` : '<p>No mail yet.</p>'}`,
  );
}

function messagePage(m: CaughtMail) {
  return page(
    m.subject,
    `<p><a href="/dev/mail">← all mail</a> · <a href="/dev/mail/${m.file}/raw">raw .eml</a></p>
<table><tbody>
<tr><th>From</th><td>${escapeHtml(m.from)}</td></tr><tr><th>To</th><td>${escapeHtml(m.to)}</td></tr>
<tr><th>Subject</th><td>${escapeHtml(m.subject)}</td></tr><tr><th>Date</th><td>${escapeHtml(m.date ?? '')}</td></tr>
<tr><th>Links</th><td>${m.links.map((l) => `<a href="${escapeHtml(l)}">${escapeHtml(l)}</a>`).join('<br>')}</td></tr>
</tbody></table>
<h2>HTML part</h2>${m.html ? `<iframe title="HTML part" sandbox src="/dev/mail/${m.file}/html"></iframe>` : '<p>None.</p>'}
<h2>Plain-text part</h2><pre>${escapeHtml(m.text)}</pre>`,
  );
}

const notFound: RequestHandler = (_req, res) => {
  res.status(404).json({ error: { code: 'not_found', message: 'No such page' } });
};

export function devMailRouter(config: AppConfig) {
  const router = Router();
  if (config.env === 'production' || config.mail.smtp) {
    router.use(notFound);
    return router;
  }
  const dir = config.mail.dir;

  // Caught mail holds live sign-in links: answer only on this machine, even
  // when the app itself listens on every interface.
  // And only under the configured host names: a DNS-rebinding page reaches this
  // machine's loopback under a name of its own, which is not on the list.
  const loopback = new Set(['127.0.0.1', '::1', '::ffff:127.0.0.1']);
  const hosts = configuredHosts(config.allowedOrigins);
  router.use((req, res, next) =>
    loopback.has(req.socket.remoteAddress ?? '') && hosts.has(req.get('host') ?? '')
      ? next()
      : notFound(req, res, next),
  );

  router.get('/', async (req, res) => {
    const messages = await listCaughtMail(dir);
    if (wantsJson(req)) res.json({ messages });
    else res.type('html').send(listPage(messages, dir));
  });
  router.get('/:file', async (req, res) => {
    const m = await readCaughtMail(dir, String(req.params.file));
    if (!m) return notFound(req, res, () => undefined);
    if (wantsJson(req)) res.json({ message: m });
    else res.type('html').send(messagePage(m));
  });
  router.get('/:file/html', async (req, res) => {
    const m = await readCaughtMail(dir, String(req.params.file));
    if (!m?.html) return notFound(req, res, () => undefined);
    res.type('html').send(m.html);
  });
  router.get('/:file/raw', async (req, res) => {
    const source = await readCaughtMailSource(dir, String(req.params.file));
    if (!source) return notFound(req, res, () => undefined);
    res.type('text/plain; charset=utf-8').send(source);
  });
  router.use(notFound);
  return router;
}
