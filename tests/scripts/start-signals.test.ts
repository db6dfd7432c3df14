/**
 * `npm start` must stop everything — server and PostgreSQL — when its parent
 * sends TERM or INT to npm. npm forwards the signal to its `sh -c`, which
 * passes nothing on unless the script runs under `exec`.
 */
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { freePort } from '../../scripts/lib/pg-cluster';

const root = path.resolve(import.meta.dirname, '../..');
const dataRoot = fs.mkdtempSync(path.join(os.tmpdir(), 'headroom-start-'));
fs.chmodSync(dataRoot, 0o755);
const children: ChildProcess[] = [];

afterAll(() => {
  // After a failure, leave nothing running: the whole process group, then PostgreSQL
  // (pg_ctl starts it in a session of its own).
  for (const c of children) {
    try {
      process.kill(-c.pid!, 'SIGKILL');
    } catch {
      // already gone
    }
  }
  const pgData = path.join(dataRoot, 'postgres');
  if (fs.existsSync(path.join(pgData, 'postmaster.pid'))) {
    const pgCtl = fs
      .readdirSync('/usr/lib/postgresql')
      .map((v) => `/usr/lib/postgresql/${v}/bin/pg_ctl`)
      .find((f) => fs.existsSync(f));
    if (pgCtl) {
      const args = ['-D', pgData, '-m', 'immediate', 'stop'];
      try {
        if (process.getuid?.() === 0)
          execFileSync('runuser', ['-u', 'postgres', '--', pgCtl, ...args]);
        else execFileSync(pgCtl, args);
      } catch {
        // not running after all
      }
    }
  }
  fs.rmSync(dataRoot, { recursive: true, force: true });
});

const listening = (port: number) =>
  new Promise<boolean>((resolve) => {
    const s = net.connect(port, '127.0.0.1');
    s.once('connect', () => {
      s.destroy();
      resolve(true);
    });
    s.once('error', () => resolve(false));
  });

async function until(check: () => Promise<boolean>, ms: number) {
  const end = Date.now() + ms;
  while (Date.now() < end) {
    if (await check()) return true;
    await new Promise((r) => setTimeout(r, 250));
  }
  return false;
}

async function startAndSignal(signal: 'SIGTERM' | 'SIGINT') {
  const [pgPort, port, mailPort] = [await freePort(), await freePort(), await freePort()];
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    HEADROOM_DATA: dataRoot,
    PGPORT: String(pgPort),
    PORT: String(port),
    MAIL_CATCHER_PORT: String(mailPort),
    HEADROOM_SKIP_BUILD: '1',
    SERVE_CLIENT: '0',
    NODE_ENV: 'development',
    LOG_LEVEL: 'warn',
  };
  delete env.DATABASE_URL;
  delete env.STORAGE_DIR;
  delete env.MAIL_DIR;
  let output = '';
  // Its own process group, so a failed test can clean up everything npm started.
  const npm = spawn('npm', ['start'], {
    cwd: root,
    env,
    stdio: ['ignore', 'pipe', 'pipe'],
    detached: true,
  });
  children.push(npm);
  npm.stdout!.on('data', (d) => (output += d));
  npm.stderr!.on('data', (d) => (output += d));
  const exited = new Promise<void>((r) => npm.once('exit', () => r()));

  const up = await until(async () => {
    try {
      return (await fetch(`http://127.0.0.1:${port}/api/health`)).ok;
    } catch {
      return false;
    }
  }, 120_000);
  expect(up, output.slice(-2000)).toBe(true);
  expect(await listening(pgPort)).toBe(true);

  npm.kill(signal);
  const stopped = await Promise.race([
    exited.then(() => true),
    new Promise<boolean>((r) => setTimeout(() => r(false), 30_000)),
  ]);
  expect(stopped, output.slice(-2000)).toBe(true);
  // Everything it started is gone: the server's port, PostgreSQL's port and its pid file.
  expect(await until(async () => !(await listening(port)), 10_000)).toBe(true);
  expect(await until(async () => !(await listening(pgPort)), 10_000)).toBe(true);
  expect(fs.existsSync(path.join(dataRoot, 'postgres', 'postmaster.pid'))).toBe(false);
  expect(output).toMatch(/stopping PostgreSQL/);
}

describe('npm start under a signal from its parent', () => {
  it('stops the server and PostgreSQL on TERM to npm', () => startAndSignal('SIGTERM'), 180_000);
  it('stops the server and PostgreSQL on INT to npm', () => startAndSignal('SIGINT'), 180_000);
});
