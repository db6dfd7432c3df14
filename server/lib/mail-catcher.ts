/**
 * The local mail catcher for development and tests: an SMTP server on loopback
 * (smtp-server) that keeps every message it receives as an .eml file, and the
 * readers behind /dev/mail. It never runs when real SMTP settings are given.
 */
import fs from 'node:fs/promises';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import { simpleParser } from 'mailparser';
import { SMTPServer } from 'smtp-server';

export type MailCatcher = { port: number; dir: string; close: () => Promise<void> };

const maxMessageBytes = 25 * 1024 * 1024;

/** Names sort in the order the messages arrived: 20261202T101530123Z-1a2b3c4d.eml */
function fileName() {
  const stamp = new Date().toISOString().replace(/[-:.]/g, '');
  return `${stamp}-${randomBytes(4).toString('hex')}.eml`;
}

/** Starts the catcher on 127.0.0.1:port (0 picks a free port). */
export async function startMailCatcher(opts: { port: number; dir: string }): Promise<MailCatcher> {
  await fs.mkdir(opts.dir, { recursive: true });
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    banner: 'Headroom mail catcher',
    size: maxMessageBytes,
    logger: false,
    onAuth(_auth, _session, callback) {
      callback(null, { user: 'catcher' });
    },
    onData(stream, _session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (c: Buffer) => chunks.push(c));
      stream.on('error', callback);
      stream.on('end', () => {
        if ((stream as { sizeExceeded?: boolean }).sizeExceeded) {
          callback(Object.assign(new Error('Message too large'), { responseCode: 552 }));
          return;
        }
        // Written beside and renamed, so a reader never sees half a message; the
        // sender is told "accepted" only once the file is there.
        const name = fileName();
        const tmp = path.join(opts.dir, `.${name}.tmp`);
        fs.writeFile(tmp, Buffer.concat(chunks))
          .then(() => fs.rename(tmp, path.join(opts.dir, name)))
          .then(() => callback(null, `kept as ${name}`))
          .catch((err: Error) => callback(err));
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(opts.port, '127.0.0.1', () => {
      server.off('error', reject);
      resolve();
    });
  });
  // Later errors (a client dropping the line) are the client's problem, not a crash.
  server.on('error', () => undefined);
  const { port } = server.server.address() as AddressInfo;
  return {
    port,
    dir: opts.dir,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}

export type CaughtMail = {
  file: string;
  to: string;
  from: string;
  subject: string;
  date: string | null;
  text: string;
  html: string | null;
  /** Every http(s) link in the plain-text part, in order. */
  links: string[];
};

const filePattern = /^[0-9TZ]+-[0-9a-f]{8}\.eml$/;

async function parse(dir: string, file: string): Promise<CaughtMail> {
  const mail = await simpleParser(await fs.readFile(path.join(dir, file)));
  const addresses = (v: typeof mail.to) =>
    Array.isArray(v) ? v.map((a) => a.text).join(', ') : (v?.text ?? '');
  const text = mail.text ?? '';
  return {
    file,
    to: addresses(mail.to),
    from: addresses(mail.from),
    subject: mail.subject ?? '',
    date: mail.date ? mail.date.toISOString() : null,
    text,
    html: mail.html || null,
    links: text.match(/https?:\/\/[^\s<>"]+/g) ?? [],
  };
}

/** The newest caught messages first (at most `limit`). */
export async function listCaughtMail(dir: string, limit = 200): Promise<CaughtMail[]> {
  const files = await fs.readdir(dir).catch(() => [] as string[]);
  const newest = files
    .filter((f) => filePattern.test(f))
    .sort()
    .reverse()
    .slice(0, limit);
  return Promise.all(newest.map((f) => parse(dir, f)));
}

/** One caught message by file name; null for a name that is not a caught message. */
export async function readCaughtMail(dir: string, file: string): Promise<CaughtMail | null> {
  if (!filePattern.test(file)) return null;
  try {
    return await parse(dir, file);
  } catch {
    return null;
  }
}

/** The raw .eml, for a download; null when there is no such message. */
export async function readCaughtMailSource(dir: string, file: string): Promise<Buffer | null> {
  if (!filePattern.test(file)) return null;
  return fs.readFile(path.join(dir, file)).catch(() => null);
}
