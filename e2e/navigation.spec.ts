/**
 * The build's section navigation and overview at phone width (issue 20): every section one
 * tap away with no sideways scrolling, the current one always in view and marked, Notices
 * in its place among them, room for the sections still to come; the overview shows what
 * happened lately to every role, and one way to add people.
 */
import { expect, test, type Locator, type Page } from '@playwright/test';
import { ensureDemo, signedInState } from './demo';
import { signUpThroughPage, uniqueEmail } from './helpers';
import { joinByInvitation } from './mail';

const phone = { width: 390, height: 844 };

async function call<T>(page: Page, url: string, data: unknown): Promise<T> {
  const res = await page.request.post(url, {
    data,
    headers: { Origin: new URL(page.url()).origin },
  });
  expect(res.ok(), `POST ${url}: ${await res.text()}`).toBe(true);
  return (await res.json()) as T;
}

/**
 * A label is drawn whole, with no ellipsis: its text's own width fits its box. Not scrollWidth,
 * which is rounded to whole pixels and misses an ellipsis drawn for a fraction of a pixel.
 */
async function isWhole(label: Locator) {
  return label.evaluate((e) => {
    const text = document.createRange();
    text.selectNodeContents(e);
    return text.getBoundingClientRect().width <= e.getBoundingClientRect().width + 0.01;
  });
}

/** Every link of the section navigation lies inside the phone's screen, whole. */
async function expectAllInView(page: Page) {
  const nav = page.getByRole('navigation', { name: 'Build sections' });
  const links = nav.getByRole('link');
  await expect(links.first()).toBeVisible();
  const n = await links.count();
  for (let i = 0; i < n; i++) {
    const box = (await links.nth(i).boundingBox())!;
    expect(box.x, await links.nth(i).innerText()).toBeGreaterThanOrEqual(0);
    expect(box.x + box.width).toBeLessThanOrEqual(phone.width);
    expect(box.height).toBeGreaterThanOrEqual(44);
    await expect(links.nth(i)).toBeInViewport({ ratio: 1 });
    // The label is whole: no "Budg…" cut short by its box.
    const label = links.nth(i).locator('span');
    expect(await isWhole(label), await label.innerText()).toBe(true);
  }
  // Nothing scrolls sideways (and so nothing clips a focus ring).
  const list = nav.getByRole('list');
  expect(await list.evaluate((el) => el.scrollWidth <= el.clientWidth)).toBe(true);
  for (const el of [nav, list]) {
    expect(await el.evaluate((e) => getComputedStyle(e).overflowX)).toBe('visible');
  }
  return n;
}

test('at phone width every section is one tap away and the current one is always in view', async ({
  browser,
}) => {
  const context = await browser.newContext({ viewport: phone, hasTouch: true });
  const owner = await context.newPage();
  await signUpThroughPage(owner, 'Marisol Okafor', uniqueEmail('owner'));
  const { build } = await call<{ build: { id: string } }>(owner, '/api/builds', {
    name: 'Gravel Hauler',
    cylinders: 8,
    aspiration: 'single-turbo',
    targetPowerHp: 700,
    targetPowerBasis: 'crank',
  });
  const { job } = await call<{ job: { id: string } }>(owner, `/api/builds/${build.id}/jobs`, {
    title: 'Fit the injectors',
  });
  const { step } = await call<{ step: { id: string } }>(
    owner,
    `/api/builds/${build.id}/jobs/${job.id}/steps`,
    { title: 'Seat the injectors' },
  );

  await owner.goto(`/builds/${build.id}`);
  const nav = owner.getByRole('navigation', { name: 'Build sections' });
  const current = nav.locator('[aria-current="page"]');
  expect(await expectAllInView(owner)).toBe(13);
  await expect(current).toHaveText('Overview');

  // Install, the crew's main section, is one tap from anywhere, and stays marked below it.
  await nav.getByRole('link', { name: 'Install' }).tap();
  await expect(owner.getByRole('heading', { level: 1, name: 'Install' })).toBeVisible();
  await expect(current).toHaveText('Install');
  await owner.goto(`/builds/${build.id}/install/steps/${step.id}`);
  await expect(owner.getByRole('heading', { level: 1, name: 'Seat the injectors' })).toBeVisible();
  await expect(current).toHaveText('Install');
  await expect(current).toBeInViewport({ ratio: 1 });

  // Notices has its place: a section like the others, marked when open.
  await nav.getByRole('link', { name: 'Notices' }).tap();
  await expect(owner.getByRole('heading', { level: 1, name: 'Notices' })).toBeVisible();
  await expect(current).toHaveText('Notices');
  await expectAllInView(owner);

  // The keyboard's focus ring is drawn whole around a tab.
  await nav.getByRole('link', { name: 'Parts' }).focus();
  await owner.keyboard.press('Tab');
  const focused = owner.locator(':focus');
  await expect(focused).toHaveText('Send-outs');
  expect(await focused.evaluate((e) => getComputedStyle(e).outlineStyle)).toBe('solid');

  // Room for sections still to come: with three more, all sixteen still fit the phone's
  // width without scrolling.
  await owner.goto(`/builds/${build.id}`);
  await nav.evaluate((el) => {
    const list = el.querySelector('ul')!;
    for (const name of ['Documents', 'Towing', 'Tuning']) {
      const li = list.lastElementChild!.cloneNode(true) as HTMLElement;
      li.querySelector('span')!.textContent = name;
      li.querySelector('a')!.setAttribute('href', `#${name}`);
      list.appendChild(li);
    }
  });
  expect(await expectAllInView(owner)).toBe(16);
  await context.close();
});

test('a viewer at phone width gets every section it may open, whole; a desktop gets them in one row', async ({
  browser,
}) => {
  const ownerContext = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  const owner = await ownerContext.newPage();
  await signUpThroughPage(owner, 'Marisol Okafor', uniqueEmail('owner'));
  const viewerEmail = uniqueEmail('viewer');
  const viewerContext = await browser.newContext({ viewport: phone, hasTouch: true });
  const viewer = await viewerContext.newPage();
  await signUpThroughPage(viewer, 'Jo Whitlock', viewerEmail);
  const { build } = await call<{ build: { id: string } }>(owner, '/api/builds', {
    name: 'Gravel Hauler',
    cylinders: 8,
    aspiration: 'single-turbo',
    targetPowerHp: 700,
    targetPowerBasis: 'crank',
  });
  await joinByInvitation(owner, viewer, { buildId: build.id, email: viewerEmail, role: 'viewer' });

  // The viewer: no budget (money), every other section whole and one tap away, the current
  // one marked on its page.
  await viewer.goto(`/builds/${build.id}`);
  const nav = viewer.getByRole('navigation', { name: 'Build sections' });
  expect(await expectAllInView(viewer)).toBe(11);
  await expect(nav.getByRole('link', { name: 'Budget' })).toHaveCount(0);
  for (const name of ['Dyno', 'Photos', 'Estimate']) {
    await nav.getByRole('link', { name, exact: true }).tap();
    await expect(nav.locator('[aria-current="page"]')).toHaveText(name);
    await expect(nav.locator('[aria-current="page"]')).toBeInViewport({ ratio: 1 });
  }

  // A desktop: the owner's thirteen sections in one row, none cut short, nothing scrolling.
  await owner.goto(`/builds/${build.id}/budget`);
  const wide = owner.getByRole('navigation', { name: 'Build sections' });
  const links = wide.getByRole('link');
  await expect(links).toHaveCount(13);
  await expect(wide.locator('[aria-current="page"]')).toHaveText('Budget');
  const tops = new Set<number>();
  for (let i = 0; i < 13; i++) {
    tops.add(Math.round((await links.nth(i).boundingBox())!.y));
    const label = links.nth(i).locator('span');
    expect(await isWhole(label), await label.innerText()).toBe(true);
  }
  expect([...tops]).toHaveLength(1);
  expect(await wide.getByRole('list').evaluate((el) => el.scrollWidth <= el.clientWidth)).toBe(
    true,
  );
  await ownerContext.close();
  await viewerContext.close();
});

test('the overview shows every role what happened lately, without money, and one way to add people', async ({
  browser,
}) => {
  const ownerContext = await browser.newContext({ viewport: phone });
  const owner = await ownerContext.newPage();
  await signUpThroughPage(owner, 'Marisol Okafor', uniqueEmail('owner'));
  const viewerEmail = uniqueEmail('viewer');
  const viewerContext = await browser.newContext({ viewport: phone });
  const viewer = await viewerContext.newPage();
  await signUpThroughPage(viewer, 'Jo Whitlock', viewerEmail);

  const { build } = await call<{ build: { id: string } }>(owner, '/api/builds', {
    name: 'Gravel Hauler',
    cylinders: 8,
    aspiration: 'single-turbo',
    targetPowerHp: 700,
    targetPowerBasis: 'crank',
    budgetCents: 1_800_000,
  });
  const api = `/api/builds/${build.id}`;
  await call(owner, `${api}/parts`, {
    category: 'head-and-studs',
    name: 'Head studs',
    status: 'in-hand',
    receivedOn: new Date().toISOString().slice(0, 10),
    unitPriceCents: 64_900,
  });
  await joinByInvitation(owner, viewer, { buildId: build.id, email: viewerEmail, role: 'viewer' });

  await viewer.goto(`/builds/${build.id}`);
  const lately = viewer.getByRole('region', { name: 'Lately' });
  await expect(lately.getByRole('link', { name: /Head studs arrived/ })).toBeVisible();
  await expect(lately.getByText('Today')).toBeVisible();
  expect(await viewer.locator('body').innerText()).not.toMatch(/\$|649|18,000/);
  // No way for a viewer to add anyone.
  await expect(viewer.getByRole('button', { name: 'Invite someone' })).toHaveCount(0);

  // The owner has exactly one way to add people: the invitation by e-mail.
  await owner.goto(`/builds/${build.id}`);
  await expect(owner.getByRole('heading', { name: 'Invite by e-mail' })).toBeVisible();
  await expect(owner.getByRole('form', { name: 'Add someone' })).toHaveCount(0);
  await expect(owner.getByRole('button', { name: 'Add member' })).toHaveCount(0);
  await owner.getByRole('button', { name: 'Invite someone' }).click();
  await expect(owner.getByRole('form', { name: 'Send an invitation' })).toHaveCount(1);
  await ownerContext.close();
  await viewerContext.close();
});

test('"Lately" shows five entries on a phone and the rest one tap away', async ({
  browser,
}, testInfo) => {
  const demo = await ensureDemo();
  const storageState = await signedInState(testInfo.project.use.baseURL!, 'crew');
  const context = await browser.newContext({ viewport: phone, storageState });
  const page = await context.newPage();
  await page.goto(`/builds/${demo.buildId}`);
  const lately = page.getByRole('region', { name: 'Lately' });
  const entries = lately.getByRole('list', { name: 'Recent activity' }).getByRole('listitem');
  await expect(entries).toHaveCount(5);
  const more = lately.getByRole('button', { name: /^Show \d+ more$/ });
  await expect(more).toHaveAttribute('aria-expanded', 'false');
  const hidden = Number((await more.textContent())!.match(/\d+/)![0]);
  await more.click();
  await expect(entries).toHaveCount(5 + hidden);
  const fewer = lately.getByRole('button', { name: 'Show fewer' });
  await expect(fewer).toHaveAttribute('aria-expanded', 'true');
  await fewer.click();
  await expect(entries).toHaveCount(5);
  await context.close();
});
