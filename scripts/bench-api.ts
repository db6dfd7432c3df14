/**
 * npm run bench:api — the API under load, measured against a floor.
 *
 * Starts its own throwaway PostgreSQL with the demo data, the Headroom server as
 * `npm start` runs it, and a bare Express + pg `select 1` endpoint on the same
 * database (the floor). Then, on loopback only, runs autocannon against the floor
 * and each endpoint in alternation and prints req/s, p50 and p99 latency, their
 * ratio to the floor, errors and the server's memory. Prints figures; asserts nothing.
 *
 *   npm run bench:api                       all endpoints, 50 connections, 5 s a run, 2 rounds
 *   npm run bench:api -- --connections 200 --duration 30 --rounds 1 --only parts
 *   npm run bench:api -- --only jobs --cpu-prof /tmp/prof   the server's CPU profile, written when it stops
 */
import { fork, spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { parseArgs } from 'node:util';
import autocannon from 'autocannon';
import knexFactory from 'knex';
import { knexConfig } from '@db/knexfile';
import { seedDemo } from '@db/seeds/demo';
import { createLocalDiskStorage } from '@server/lib/storage';
import { createPgCluster, freePort } from './lib/pg-cluster';
import { clusterPids, cpuMsOf, rssOf } from './bench/proc';

const { values: opts } = parseArgs({
  options: {
    connections: { type: 'string', default: '50' },
    duration: { type: 'string', default: '5' },
    rounds: { type: 'string', default: '2' },
    only: { type: 'string' },
    'cpu-prof': { type: 'string' },
  },
});
const connections = Math.min(1000, Number(opts.connections));
const duration = Math.min(120, Number(opts.duration));
const rounds = Math.min(10, Number(opts.rounds));
const root = path.resolve(import.meta.dirname, '..');

async function waitFor(url: string) {
  for (let i = 0; i < 300; i++) {
    try {
      if ((await fetch(url)).ok) return;
    } catch {
      // not yet
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`${url} never answered`);
}

type Result = {
  rps: number;
  p50: number;
  p99: number;
  errors: number;
  non2xx: number;
  /** CPU time per request, in µs: the app process's, and PostgreSQL's (all its processes). */
  appUs: number;
  pgUs: number;
};

/** CPU ms of each pid now, so a run can take the difference (new backends start from 0). */
function cpuSnapshot(pids: number[]) {
  return new Map(pids.map((pid) => [pid, cpuMsOf([pid])]));
}
function cpuSince(before: Map<number, number>, pids: number[]) {
  return pids.reduce((ms, pid) => ms + cpuMsOf([pid]) - (before.get(pid) ?? 0), 0);
}

async function run(
  url: string,
  headers: Record<string, string>,
  appPid: number,
  pgPort: number,
): Promise<Result> {
  const app = cpuMsOf([appPid]);
  const pg = cpuSnapshot(clusterPids(pgPort));
  const r = await autocannon({ url, connections, duration, headers, pipelining: 1 });
  const requests = r.requests.total || 1;
  return {
    rps: r.requests.average,
    p50: r.latency.p50,
    p99: r.latency.p99,
    errors: r.errors + r.timeouts,
    non2xx: r.non2xx,
    appUs: ((cpuMsOf([appPid]) - app) * 1000) / requests,
    pgUs: (cpuSince(pg, clusterPids(pgPort)) * 1000) / requests,
  };
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

const children: ChildProcess[] = [];
const cluster = await createPgCluster('headroom_bench');
try {
  const knex = knexFactory(knexConfig(cluster.url));
  await knex.migrate.latest();
  const storageDir = fs.mkdtempSync('/tmp/headroom-bench-files-');
  await knex.transaction((trx) => seedDemo(trx, { storage: createLocalDiskStorage(storageDir) }));
  await knex.destroy();

  const [appPort, floorPort, mailPort] = [await freePort(), await freePort(), await freePort()];
  const pgPort = Number(new URL(cluster.url).port);
  const profile = opts['cpu-prof'] ? ['--cpu-prof', `--cpu-prof-dir=${opts['cpu-prof']}`] : [];
  const server = spawn('node', [...profile, '--import', 'tsx', 'server/index.ts'], {
    cwd: root,
    env: {
      ...process.env,
      DATABASE_URL: cluster.url,
      PORT: String(appPort),
      NODE_ENV: 'development',
      SERVE_CLIENT: '0',
      MAIL_CATCHER_PORT: String(mailPort),
      MAIL_DIR: path.join(storageDir, 'mail'),
      STORAGE_DIR: storageDir,
      LOG_LEVEL: process.env.LOG_LEVEL ?? 'info',
    },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  children.push(server);
  const floor = fork(path.join(root, 'scripts/bench/floor-server.ts'), {
    env: { ...process.env, DATABASE_URL: cluster.url, PORT: String(floorPort) },
    execArgv: ['--import', 'tsx'],
  });
  children.push(floor);
  const base = `http://127.0.0.1:${appPort}`;
  await waitFor(`${base}/api/health`);
  await waitFor(`http://127.0.0.1:${floorPort}/floor`);

  const signIn = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', Origin: `http://127.0.0.1:${appPort}` },
    body: JSON.stringify({ email: 'owner@example.test', password: 'headroom-demo' }),
  });
  const cookie = (signIn.headers.get('set-cookie') ?? '').split(';')[0];
  const headers = { cookie };
  const builds = (await (await fetch(`${base}/api/builds`, { headers })).json()) as {
    builds: { id: string }[];
  };
  const b = `/api/builds/${builds.builds[0].id}`;
  const endpoints: [string, string][] = [
    ['health', '/api/health'],
    ['build', b],
    ['estimate', `${b}/estimate`],
    ['budget', `${b}/budget`],
    ['parts', `${b}/parts`],
    ['jobs', `${b}/jobs`],
  ];
  const chosen = opts.only
    ? endpoints.filter(([n]) => opts.only!.split(',').includes(n))
    : endpoints;
  for (const [, p] of chosen) {
    const res = await fetch(base + p, { headers });
    if (!res.ok) throw new Error(`${p} answered ${res.status} before the benchmark`);
  }

  console.log(
    `\nHeadroom API benchmark: ${connections} connections, ${duration} s a run, ${rounds} round(s), loopback\n`,
  );
  const rssStart = rssOf(server.pid!);
  const floorRuns: Result[] = [];
  const table: { name: string; runs: Result[]; floor: Result[] }[] = [];
  let peakRss = rssStart;
  for (const [name, p] of chosen) {
    const runs: Result[] = [];
    const floors: Result[] = [];
    for (let i = 0; i < rounds; i++) {
      floors.push(await run(`http://127.0.0.1:${floorPort}/floor`, {}, floor.pid!, pgPort));
      runs.push(await run(base + p, headers, server.pid!, pgPort));
      peakRss = Math.max(peakRss, rssOf(server.pid!));
    }
    floorRuns.push(...floors);
    table.push({ name, runs, floor: floors });
  }
  const pad = (s: string | number, n: number) => String(s).padStart(n);
  const line = (name: string, c: (string | number)[]) =>
    console.log(
      name.padEnd(10) + c.map((v, i) => pad(v, [9, 9, 9, 11, 11, 8, 9, 10, 10][i])).join(''),
    );
  line('endpoint', [
    'req/s',
    'p50 ms',
    'p99 ms',
    'p50×floor',
    'p99×floor',
    'errors',
    'non-2xx',
    'app µs',
    'pg µs',
  ]);
  const med = (rs: Result[], k: keyof Result) => median(rs.map((r) => r[k]));
  line('floor', [
    Math.round(med(floorRuns, 'rps')),
    med(floorRuns, 'p50'),
    med(floorRuns, 'p99'),
    '1.0',
    '1.0',
    0,
    0,
    Math.round(med(floorRuns, 'appUs')),
    Math.round(med(floorRuns, 'pgUs')),
  ]);
  for (const row of table) {
    const p50 = med(row.runs, 'p50');
    const p99 = med(row.runs, 'p99');
    // Against the floor runs made next to these ones, so a busy machine shifts both alike.
    const f50 = med(row.floor, 'p50') || 1;
    const f99 = med(row.floor, 'p99') || 1;
    line(row.name, [
      Math.round(med(row.runs, 'rps')),
      p50,
      p99,
      (p50 / f50).toFixed(1),
      (p99 / f99).toFixed(1),
      row.runs.reduce((n, r) => n + r.errors, 0),
      row.runs.reduce((n, r) => n + r.non2xx, 0),
      Math.round(med(row.runs, 'appUs')),
      Math.round(med(row.runs, 'pgUs')),
    ]);
  }
  console.log(
    "\napp µs, pg µs: CPU time per request of the app process (the floor's for the floor row) and of PostgreSQL",
  );
  console.log(
    `\nserver memory (RSS): ${rssStart.toFixed(0)} MB at start, ${peakRss.toFixed(0)} MB at most, ${rssOf(server.pid!).toFixed(0)} MB at the end\n`,
  );
  fs.rmSync(storageDir, { recursive: true, force: true });
} finally {
  for (const c of children) c.kill('SIGTERM');
  // The server writes its CPU profile as it exits.
  await Promise.all(
    children.map((c) =>
      c.exitCode === null
        ? Promise.race([
            new Promise((r) => c.once('exit', r)),
            new Promise((r) => setTimeout(r, 5000)),
          ])
        : null,
    ),
  );
  cluster.remove();
}
