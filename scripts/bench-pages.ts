/**
 * npm run bench:pages — a first visit to the estimate page and to a step page in
 * Debian's Chromium on a throttled profile (a phone on a weak mobile signal:
 * 1.6 Mbit/s down, 750 kbit/s up, 150 ms round trip, CPU slowed 4×), from a
 * cold cache, signed in as the demo's crew. Prints when the page's main content
 * showed and how much was transferred; asserts nothing.
 */
import { execFileSync, spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium } from '@playwright/test';
import knexFactory from 'knex';
import { knexConfig } from '@db/knexfile';
import { seedDemo } from '@db/seeds/demo';
import { createLocalDiskStorage } from '@server/lib/storage';
import { createPgCluster, freePort } from './lib/pg-cluster';

const root = path.resolve(import.meta.dirname, '..');
const runs = 3;
const profile = { latency: 150, downloadThroughput: 200_000, uploadThroughput: 93_750, cpu: 4 };

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

const children: ChildProcess[] = [];
const cluster = await createPgCluster('headroom_pages');
const work = fs.mkdtempSync(path.join(os.tmpdir(), 'headroom-bench-pages-'));
try {
  const knex = knexFactory(knexConfig(cluster.url));
  await knex.migrate.latest();
  await knex.transaction((trx) =>
    seedDemo(trx, { storage: createLocalDiskStorage(path.join(work, 'uploads')) }),
  );
  const buildId = (await knex('builds').first('id')).id as string;
  const stepId = (await knex('install_steps').where({ build_id: buildId }).first('id'))
    .id as string;
  await knex.destroy();

  console.log('building the client …');
  execFileSync(
    'npx',
    ['vite', 'build', '--logLevel', 'warn', '--outDir', path.join(work, 'dist')],
    {
      cwd: root,
      stdio: 'inherit',
    },
  );
  const port = await freePort();
  const server = spawn('node', ['--import', 'tsx', 'server/index.ts'], {
    cwd: root,
    env: {
      ...process.env,
      DATABASE_URL: cluster.url,
      PORT: String(port),
      NODE_ENV: 'development',
      CLIENT_DIR: path.join(work, 'dist'),
      STORAGE_DIR: path.join(work, 'uploads'),
      MAIL_CATCHER_PORT: String(await freePort()),
      MAIL_DIR: path.join(work, 'mail'),
      LOG_LEVEL: 'warn',
    },
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  children.push(server);
  const base = `http://127.0.0.1:${port}`;
  await waitFor(`${base}/api/health`);

  const executablePath = ['/usr/lib/chromium/chromium', '/usr/bin/chromium'].find((p) =>
    fs.existsSync(p),
  );
  const browser = await chromium.launch({
    executablePath,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-dev-shm-usage',
      '--disable-background-networking',
    ],
  });
  const pages: [string, string, string][] = [
    ['estimate', `/builds/${buildId}/estimate`, 'Power estimate'],
    ['step', `/builds/${buildId}/install/steps/${stepId}`, ''],
  ];
  console.log(
    `\nFirst visit, cold cache, ${profile.latency} ms RTT, ${(profile.downloadThroughput * 8) / 1e6} Mbit/s down, CPU ÷${profile.cpu} (median of ${runs})\n`,
  );
  for (const [name, url, heading] of pages) {
    const shown: number[] = [];
    const bytes: number[] = [];
    for (let i = 0; i < runs; i++) {
      const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
      // Sign in unthrottled: the visit measured is the page, not the sign-in.
      const res = await context.request.post(`${base}/api/auth/sign-in`, {
        headers: { Origin: base },
        data: { email: 'crew@example.test', password: 'headroom-demo' },
      });
      if (!res.ok()) throw new Error(`sign-in failed: ${res.status()}`);
      const page = await context.newPage();
      const cdp = await context.newCDPSession(page);
      await cdp.send('Network.enable');
      await cdp.send('Network.emulateNetworkConditions', { offline: false, ...profile });
      await cdp.send('Emulation.setCPUThrottlingRate', { rate: profile.cpu });
      let transferred = 0;
      cdp.on('Network.loadingFinished', (e: { encodedDataLength: number }) => {
        transferred += e.encodedDataLength;
      });
      const t0 = Date.now();
      await page.goto(base + url, { waitUntil: 'commit' });
      // Main content: the page's own heading (h1) is on screen.
      const h1 = heading
        ? page.getByRole('heading', { level: 1, name: heading })
        : page.getByRole('heading', { level: 1 });
      await h1.first().waitFor({ state: 'visible', timeout: 120_000 });
      shown.push(Date.now() - t0);
      await page.waitForLoadState('networkidle');
      bytes.push(transferred);
      await context.close();
    }
    const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
    console.log(
      `${name.padEnd(9)} content shown after ${(median(shown) / 1000).toFixed(1)} s; ${(median(bytes) / 1024).toFixed(0)} kB transferred`,
    );
  }
  await browser.close();
  console.log('');
} finally {
  for (const c of children) c.kill('SIGTERM');
  await new Promise((r) => setTimeout(r, 500));
  cluster.remove();
  fs.rmSync(work, { recursive: true, force: true });
}
