/**
 * A throwaway PostgreSQL cluster of a test's own, from Debian's binaries, for
 * tests that stop and start the database under a running app. The other test
 * files share the cluster npm test starts; this one is never that cluster.
 */
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';

function pgBin(): string {
  const root = '/usr/lib/postgresql';
  const versions = fs.existsSync(root) ? fs.readdirSync(root).sort() : [];
  for (const v of versions.reverse()) {
    const dir = path.join(root, v, 'bin');
    if (fs.existsSync(path.join(dir, 'pg_ctl'))) return dir;
  }
  throw new Error(
    'PostgreSQL binaries not found under /usr/lib/postgresql (npm test installs them)',
  );
}

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const s = net.createServer();
    s.once('error', reject);
    s.listen(0, '127.0.0.1', () => {
      const { port } = s.address() as net.AddressInfo;
      s.close(() => resolve(port));
    });
  });
}

export type PgCluster = {
  url: string;
  start: () => void;
  /** `pg_ctl stop -m fast`: what an operator's restart does to open connections. */
  stop: () => void;
  remove: () => void;
};

export async function createPgCluster(dbName = 'headroom_own'): Promise<PgCluster> {
  const bin = pgBin();
  const asRoot = process.getuid?.() === 0;
  const run = (cmd: string, args: string[]) =>
    asRoot
      ? execFileSync('runuser', ['-u', 'postgres', '--', path.join(bin, cmd), ...args], {
          stdio: 'pipe',
        })
      : execFileSync(path.join(bin, cmd), args, { stdio: 'pipe' });
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'headroom-pg-'));
  fs.chmodSync(dir, 0o700);
  if (asRoot) execFileSync('chown', ['postgres:postgres', dir]);
  const port = await freePort();
  run('initdb', ['-D', dir, '-U', 'headroom', '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8']);
  const opts = `-c listen_addresses=127.0.0.1 -p ${port} -k ${dir} -c fsync=off -c synchronous_commit=off -c full_page_writes=off`;
  const start = () =>
    void run('pg_ctl', [
      '-D',
      dir,
      '-l',
      path.join(dir, 'server.log'),
      '-o',
      opts,
      '-w',
      '-t',
      '60',
      'start',
    ]);
  const stop = () => void run('pg_ctl', ['-D', dir, '-m', 'fast', '-w', 'stop']);
  start();
  execFileSync(path.join(bin, 'createdb'), [
    '-h',
    '127.0.0.1',
    '-p',
    String(port),
    '-U',
    'headroom',
    dbName,
  ]);
  return {
    url: `postgres://headroom@127.0.0.1:${port}/${dbName}`,
    start,
    stop,
    remove: () => {
      try {
        stop();
      } catch {
        // already stopped
      }
      fs.rmSync(dir, { recursive: true, force: true });
    },
  };
}
