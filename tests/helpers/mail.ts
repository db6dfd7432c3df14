/**
 * Mail in API tests: a test file that asks for it (useTestApp(…, { mail: true }))
 * gets its own database — so its mail worker sends only its own outbox — a real
 * SMTP catcher on a free loopback port writing .eml files to a temp folder, and
 * a worker it runs by hand. Messages are read back from the .eml files with
 * mailparser, not through the app.
 */
import fs from 'node:fs/promises';
import os from 'node:os';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import knexFactory from 'knex';
import { simpleParser, type ParsedMail } from 'mailparser';
import { knexConfig } from '@db/knexfile';
import type { AppConfig } from '@server/config';
import type { Database } from '@server/lib/database';
import { createLogger } from '@server/lib/logger';
import { startMailCatcher, type MailCatcher } from '@server/lib/mail-catcher';
import { createMailer } from '@server/lib/mailer';
import { createMailWorker, type MailWorker } from '@server/features/mail/mail.worker';

export type CaughtMessage = ParsedMail & { file: string; textBody: string };

export type TestMail = {
  dir: string;
  port: number;
  worker: MailWorker;
  /** Sends everything due, as the server's worker would on its next passes. */
  deliver: () => ReturnType<MailWorker['drain']>;
  /** Moves the worker's clock forward, so a retry falls due without waiting. */
  advanceClock: (ms: number) => void;
  /** Puts the worker's clock back to the real time. */
  resetClock: () => void;
  /** Takes the SMTP server down (connections are refused) and brings it back on the same port. */
  stopCatcher: () => Promise<void>;
  startCatcher: () => Promise<void>;
  /** Every caught message, oldest first, parsed from its .eml file. */
  messages: () => Promise<CaughtMessage[]>;
  /** Caught messages to one address, oldest first. */
  to: (email: string) => Promise<CaughtMessage[]>;
};

export async function readMailbox(dir: string): Promise<CaughtMessage[]> {
  const files = (await fs.readdir(dir)).filter((f) => f.endsWith('.eml')).sort();
  return Promise.all(
    files.map(async (file) => {
      const parsed = await simpleParser(await fs.readFile(path.join(dir, file)));
      return Object.assign(parsed, { file, textBody: parsed.text ?? '' });
    }),
  );
}

export function recipients(m: ParsedMail): string[] {
  const list = Array.isArray(m.to) ? m.to : m.to ? [m.to] : [];
  return list.flatMap((a) => a.value.map((v) => (v.address ?? '').toLowerCase()));
}

/** The token at the end of a link to `clientPath` (e.g. /invite/) in the plain-text part. */
export function tokenFrom(m: CaughtMessage, clientPath: string): string {
  const match = m.textBody.match(new RegExp(`https?://[^\\s]+${clientPath}([A-Za-z0-9_-]+)`));
  if (!match) throw new Error(`no ${clientPath} link in: ${m.textBody}`);
  return match[1];
}

async function adminQuery(baseUrl: string, sql: string) {
  const admin = knexFactory(knexConfig(baseUrl));
  try {
    await admin.raw(sql);
  } finally {
    await admin.destroy();
  }
}

/** Before the app starts: a fresh migrated database, a catcher, and the config that uses both. */
export async function prepareTestMail(config: AppConfig) {
  const name = `hr_mail_${randomUUID().replace(/-/g, '').slice(0, 16)}`;
  const url = new URL(config.databaseUrl);
  const baseUrl = url.toString();
  await adminQuery(baseUrl, `create database "${name}"`);
  url.pathname = `/${name}`;
  const databaseUrl = url.toString();
  const migrator = knexFactory(knexConfig(databaseUrl));
  try {
    await migrator.migrate.latest();
  } finally {
    await migrator.destroy();
  }
  const dir = await fs.mkdtemp(path.join(os.tmpdir(), 'headroom-mail-'));
  let catcher: MailCatcher | null = await startMailCatcher({ port: 0, dir });
  const port = catcher.port;
  const mailConfig = { ...config.mail, smtp: null, catcherPort: port, dir };

  /** Once the app listens: the worker, as server/index.ts would start it, but run by hand. */
  function attach(db: Database, appUrl: string): TestMail {
    const mailer = createMailer(mailConfig);
    let offset = 0;
    const worker = createMailWorker({
      knex: db.knex,
      mailer,
      logger: createLogger('silent'),
      appUrl,
      now: () => new Date(Date.now() + offset),
    });
    const mail: TestMail = {
      dir,
      port,
      worker,
      deliver: () => worker.drain(),
      advanceClock: (ms) => {
        offset += ms;
      },
      resetClock: () => {
        offset = 0;
      },
      stopCatcher: async () => {
        await catcher?.close();
        catcher = null;
      },
      startCatcher: async () => {
        catcher ??= await startMailCatcher({ port, dir });
      },
      messages: () => readMailbox(dir),
      to: async (email) =>
        (await readMailbox(dir)).filter((m) => recipients(m).includes(email.toLowerCase())),
    };
    closers.push(async () => {
      await worker.stop();
      mailer.close();
    });
    return mail;
  }

  const closers: (() => Promise<void>)[] = [];
  return {
    config: { ...config, databaseUrl, mail: mailConfig } satisfies AppConfig,
    attach,
    /** After the app's database pool is closed. */
    async teardown() {
      for (const c of closers) await c();
      await catcher?.close();
      await fs.rm(dir, { recursive: true, force: true });
      await adminQuery(baseUrl, `drop database if exists "${name}" with (force)`);
    },
  };
}
