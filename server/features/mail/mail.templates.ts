/**
 * Headroom's one mail layout: a graphite header with the name, a heading, plain
 * paragraphs, at most one burnt-orange button, and a small footer. Both the
 * plain-text and the HTML part come from the same content, so they never differ.
 * HTML mail clients ignore style sheets: every style is inline, layout is tables.
 */

export type MailContent = {
  subject: string;
  heading: string;
  /** Paragraphs separated by a blank line; a single line break stays a line break. */
  body: string;
  action?: { label: string; url: string };
  footer?: string;
};

const colors = {
  graphite: '#1b2230',
  orange: '#d9622b',
  page: '#eef0f3',
  muted: '#5b6472',
  rule: '#e3e6ea',
};
const font = "'Source Sans 3','Segoe UI',Helvetica,Arial,sans-serif";

export function escapeHtml(s: string): string {
  return s
    .replace(/&/g, '&amp;')
    .replace(/</g, '&lt;')
    .replace(/>/g, '&gt;')
    .replace(/"/g, '&quot;')
    .replace(/'/g, '&#39;');
}

function paragraphs(body: string): string[] {
  return body
    .split(/\n\s*\n/)
    .map((p) => p.trim())
    .filter(Boolean);
}

export function renderText(c: MailContent): string {
  const lines = ['HEADROOM', '', c.heading, '='.repeat(Math.min(c.heading.length, 60)), ''];
  for (const p of paragraphs(c.body)) lines.push(p, '');
  if (c.action) lines.push(`${c.action.label}:`, c.action.url, '');
  if (c.footer) lines.push('--', c.footer, '');
  return lines.join('\n');
}

export function renderHtml(c: MailContent): string {
  const p = (text: string) =>
    `<p style="margin:0 0 14px;font-size:16px;line-height:1.5;">${escapeHtml(text).replace(/\n/g, '<br>')}</p>`;
  const action = c.action
    ? `<table role="presentation" cellpadding="0" cellspacing="0" border="0" style="margin:22px 0 18px;">
<tr><td style="background:${colors.orange};border-radius:4px;">
<a href="${escapeHtml(c.action.url)}" style="display:inline-block;padding:12px 22px;font-family:${font};font-size:16px;font-weight:700;color:#ffffff;text-decoration:none;">${escapeHtml(c.action.label)}</a>
</td></tr></table>
<p style="margin:0 0 4px;font-size:13px;line-height:1.5;color:${colors.muted};">If the button does not work, copy this address into your browser:<br>
<a href="${escapeHtml(c.action.url)}" style="color:#b04d1f;word-break:break-all;">${escapeHtml(c.action.url)}</a></p>`
    : '';
  const footer = c.footer
    ? `<tr><td style="padding:14px 24px 18px;border-top:1px solid ${colors.rule};font-size:13px;line-height:1.5;color:${colors.muted};">${escapeHtml(c.footer).replace(/\n/g, '<br>')}</td></tr>`
    : '';
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>${escapeHtml(c.subject)}</title></head>
<body style="margin:0;padding:0;background:${colors.page};">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" border="0" style="background:${colors.page};">
<tr><td align="center" style="padding:24px 12px;">
<table role="presentation" width="100%" cellpadding="0" cellspacing="0" border="0" style="max-width:560px;background:#ffffff;border-radius:6px;font-family:${font};color:${colors.graphite};">
<tr><td style="background:${colors.graphite};border-radius:6px 6px 0 0;padding:16px 24px;font-size:20px;font-weight:700;letter-spacing:0.5px;color:#ffffff;">Headroom</td></tr>
<tr><td style="padding:24px 24px 12px;">
<h1 style="margin:0 0 16px;font-size:21px;line-height:1.3;color:${colors.graphite};">${escapeHtml(c.heading)}</h1>
${paragraphs(c.body).map(p).join('\n')}
${action}
</td></tr>
${footer}
</table>
</td></tr></table>
</body></html>
`;
}

/** Both parts of a mail from its content. */
export function renderMail(c: MailContent): { subject: string; text: string; html: string } {
  return { subject: c.subject, text: renderText(c), html: renderHtml(c) };
}
