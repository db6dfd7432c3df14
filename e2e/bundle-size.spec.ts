/**
 * The client's size budget: the JavaScript a first visit to the sign-in page and
 * to a build's overview loads, gzipped, stays within 160 kB each; charts and the
 * table library are not part of it. Sizes, not times: this does not flake on a
 * busy machine.
 */
import { gzipSync } from 'node:zlib';
import { expect, test, type Page } from '@playwright/test';
import { password, uniqueEmail } from './helpers';

// The budget; BUDGET_KB=0 lists what each page loads.
const budgetKb = Number(process.env.BUDGET_KB ?? 160);

/** Loads `path` in a fresh page and returns each same-origin script with its gzipped size. */
async function scriptsOf(page: Page, path: string) {
  const scripts: { url: string; body: Buffer }[] = [];
  page.on('response', async (res) => {
    if (
      res.request().resourceType() === 'script' &&
      res.url().startsWith(new URL(page.url() || res.url()).origin)
    ) {
      scripts.push({ url: res.url(), body: await res.body() });
    }
  });
  await page.goto(path);
  await page.waitForLoadState('networkidle');
  return scripts.map((s) => ({ url: s.url, gzipped: gzipSync(s.body, { level: 9 }).length }));
}

const kb = (bytes: number) => Math.round(bytes / 102.4) / 10;
const total = (xs: { gzipped: number }[]) => xs.reduce((n, s) => n + s.gzipped, 0);

test('the sign-in page and a build overview load at most 160 kB of JavaScript, gzipped, and no charts', async ({
  browser,
  baseURL,
}) => {
  const signIn = await browser.newContext();
  const first = await scriptsOf(await signIn.newPage(), '/sign-in');
  const signInTotal = total(first);
  console.log(`sign-in page: ${kb(signInTotal)} kB gzipped in ${first.length} scripts`);
  expect(first.length).toBeGreaterThan(0);
  await signIn.close();

  // A signed-in owner opening a build's overview straight from a link.
  const owner = await browser.newContext();
  const api = owner.request;
  const email = uniqueEmail('size');
  const headers = { Origin: baseURL! };
  expect(
    (
      await api.post('/api/auth/sign-up', {
        data: { email, password, displayName: 'Size check' },
        headers,
      })
    ).status(),
  ).toBe(201);
  const build = await api.post('/api/builds', {
    headers,
    data: {
      name: 'Size check build',
      cylinders: 6,
      aspiration: 'single-turbo',
      targetPowerHp: 600,
      targetPowerBasis: 'crank',
      currency: 'USD',
    },
  });
  expect(build.status(), await build.text()).toBe(201);
  const { id } = (await build.json()).build;
  const overview = await scriptsOf(await owner.newPage(), `/builds/${id}`);
  const overviewTotal = total(overview);
  console.log(`build overview: ${kb(overviewTotal)} kB gzipped in ${overview.length} scripts`);
  const list = (xs: typeof first) =>
    xs
      .map((s) => `  ${new URL(s.url).pathname} ${kb(s.gzipped)} kB`)
      .sort()
      .join('\n');
  expect(kb(signInTotal), `sign-in page:\n${list(first)}`).toBeLessThanOrEqual(budgetKb);
  expect(kb(overviewTotal), `build overview:\n${list(overview)}`).toBeLessThanOrEqual(budgetKb);
  // Charts (recharts) and the table library come only with the pages that draw them.
  for (const s of [...first, ...overview]) {
    const name = new URL(s.url).pathname;
    expect(name).not.toMatch(/BarChart|LineChart|recharts|react-table/i);
  }
  await owner.close();
});
