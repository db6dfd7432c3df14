/**
 * Sharing (issue 12): the owner switches a build's public page on, a stranger reads it signed out
 * at phone width, a new address retires the old one, and switched off the page is gone; the
 * build sheet prints on A4 and US Letter with the build's name and weakest link, and money only
 * on the owner's copy when asked.
 */
import { expect, test, type Page } from '@playwright/test';
import sharp from 'sharp';
import { paths } from '@/config/paths';
import { ensureDemo, signedInState } from './demo';
import { postJson, signUpThroughApi } from './helpers';

test.describe.configure({ timeout: 120_000 });

const buildName = 'Late Shift Hauler';
const vendor = 'Backroom Parts Counter';
const publicCaption = 'Turbo bolted in';
const privateCaption = 'Receipt from the counter';

/** Money as the sheet and the ledger write it: "$1,234.56". */
const moneyPattern = /\$\s?\d/;

/** The PUT that saves a sharing switch, so the next step reads what the server has. */
const shareSaved = (page: Page) =>
  page.waitForResponse(
    (r) => r.request().method() === 'PUT' && /\/share$/.test(new URL(r.url()).pathname),
  );

test('the owner shares a build, a stranger reads it at phone width, a new address retires the old one, and switched off the page is gone', async ({
  browser,
  baseURL,
}) => {
  const origin = baseURL!;
  const { api, storageState } = await signUpThroughApi(origin, 'Tamsin Orrell', 'share-owner');
  const { build } = await postJson<{ build: { id: string } }>(api, origin, '/api/builds', {
    name: buildName,
    cylinders: 8,
    aspiration: 'single-turbo',
    targetPowerHp: 600,
    targetPowerBasis: 'crank',
  });
  const { part } = await postJson<{ part: { id: string } }>(
    api,
    origin,
    `/api/builds/${build.id}/parts`,
    {
      category: 'turbocharger',
      name: 'Drop-in turbo',
      vendor,
      status: 'installed',
      unitPriceCents: 184_900,
      notes: 'paid in two parts',
      ratingValue: 80,
      ratingUnit: 'lb-per-min',
    },
  );
  // Two photos of the turbo: one the owner will mark public, one that stays private.
  for (const [caption, background] of [
    [publicCaption, '#3a5a78'],
    [privateCaption, '#7a3a3a'],
  ] as const) {
    const photo = await sharp({ create: { width: 160, height: 120, channels: 3, background } })
      .jpeg()
      .toBuffer();
    const uploaded = await api.post(`/api/builds/${build.id}/parts/${part.id}/photos`, {
      headers: { Origin: origin },
      multipart: { caption, photos: { name: 'photo.jpg', mimeType: 'image/jpeg', buffer: photo } },
    });
    expect(uploaded.status(), await uploaded.text()).toBe(201);
  }
  await api.dispose();

  const owner = await browser.newContext({ storageState });
  const page = await owner.newPage();
  await page.goto(paths.builds.overview.getHref(build.id));
  await page
    .getByRole('navigation', { name: 'Build sections' })
    .getByRole('link', { name: 'Share' })
    .click();
  await expect(page.getByRole('heading', { level: 1, name: 'Share the build' })).toBeVisible();

  const onOff = page.getByRole('switch', { name: 'Share this build on a public page' });
  await expect(onOff).not.toBeChecked();
  const switchedOn = shareSaved(page);
  await onOff.click();
  await switchedOn;
  await expect(onOff).toBeChecked();
  const address = page.getByLabel('Address of the page');
  await expect(address).toHaveValue(/\/shared\/[A-Za-z0-9_-]{43}$/);
  const firstPath = new URL(await address.inputValue()).pathname;

  // Photos stay private until marked: the owner marks one public.
  const photoSaved = page.waitForResponse(
    (r) => r.request().method() === 'PUT' && /\/share\/photos\//.test(r.url()),
  );
  await page.getByRole('checkbox', { name: `Public: ${publicCaption}` }).click();
  await photoSaved;
  await expect(page.getByRole('checkbox', { name: `Public: ${publicCaption}` })).toBeChecked();
  await expect(page.getByRole('checkbox', { name: `Public: ${privateCaption}` })).not.toBeChecked();
  await expect(page.getByRole('radio', { name: `Preview photo: ${publicCaption}` })).toBeChecked();

  // A stranger: a fresh browser, no session, a phone's width.
  const stranger = await browser.newContext({ viewport: { width: 390, height: 844 } });
  const phone = await stranger.newPage();
  const opened = await phone.goto(firstPath);
  expect(opened?.status()).toBe(200);
  await expect(phone.getByRole('heading', { level: 1, name: buildName })).toBeVisible();
  await expect(phone.getByText('Drop-in turbo').first()).toBeVisible();
  await expect(phone.getByRole('heading', { name: 'Power estimate' })).toBeVisible();
  await expect(phone.getByRole('img', { name: publicCaption }).first()).toBeVisible();
  await expect(phone.getByRole('img', { name: privateCaption })).toHaveCount(0);
  const text = await phone.locator('main').innerText();
  expect(text).not.toContain(privateCaption);
  expect(text).not.toMatch(moneyPattern);
  expect(text).not.toContain(vendor);
  expect(text).not.toContain('paid in two parts');
  // Nothing to type into or change, and nothing wider than the phone.
  await expect(phone.locator('main').locator('input, textarea, select, form')).toHaveCount(0);
  expect(await phone.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
  await expect(phone.getByRole('button', { name: 'Sign out' })).toHaveCount(0);

  // A new address, after a confirm: the old one says "not shared" (404), the new one opens.
  await page.getByRole('button', { name: 'New address' }).click();
  const confirm = page.getByRole('dialog', { name: 'Give the page a new address?' });
  await confirm.getByRole('button', { name: 'Make a new address' }).click();
  await expect(confirm).toBeHidden();
  await expect(page.getByText('The page has a new address.')).toBeVisible();
  await expect(address).not.toHaveValue(new RegExp(`${firstPath}$`));
  const secondPath = new URL(await address.inputValue()).pathname;

  const old = await phone.goto(firstPath);
  expect(old?.status()).toBe(404);
  await expect(
    phone.getByRole('heading', { level: 1, name: 'This build is not shared' }),
  ).toBeVisible();
  await expect(phone.getByText(buildName)).toHaveCount(0);
  expect((await phone.request.get(`/api${firstPath}`)).status()).toBe(404);

  // A link preview reads the HTML the server sends, with no script: the built shell carries
  // the build's Open Graph tags and asks search engines to keep away.
  const shell = await phone.request.get(secondPath);
  expect(shell.status()).toBe(200);
  expect(shell.headers()['x-robots-tag']).toContain('noindex');
  expect(shell.headers()['cache-control']).toBe('no-cache');
  const html = await shell.text();
  expect(html).toContain(`<meta property="og:title" content="${buildName}" />`);
  expect(html).toMatch(/<meta name="robots" content="noindex/);
  expect(html).toContain('<div id="root">');
  expect(html).not.toContain(vendor);

  expect((await phone.goto(secondPath))?.status()).toBe(200);
  await expect(phone.getByRole('heading', { level: 1, name: buildName })).toBeVisible();

  // Switched off: the page is gone at once.
  const switchedOff = shareSaved(page);
  await onOff.click();
  await switchedOff;
  await expect(onOff).not.toBeChecked();
  await expect(address).toBeHidden();
  const gone = await phone.goto(secondPath);
  expect(gone?.status()).toBe(404);
  await expect(
    phone.getByRole('heading', { level: 1, name: 'This build is not shared' }),
  ).toBeVisible();

  await stranger.close();
  await owner.close();
});

/** The PDF's page sizes in points, from each page's MediaBox (Chromium writes them uncompressed). */
function pdfPageSizes(pdf: Buffer): { width: number; height: number }[] {
  const text = pdf.toString('latin1');
  expect(text.startsWith('%PDF-')).toBe(true);
  return [...text.matchAll(/\/MediaBox\s*\[\s*0\s+0\s+([\d.]+)\s+([\d.]+)\s*\]/g)].map((m) => ({
    width: Number(m[1]),
    height: Number(m[2]),
  }));
}

/** The PDF's title (Chromium writes the page's title into it, as UTF-16 hex). */
function pdfTitle(pdf: Buffer): string {
  const hex = /\/Title\s*<FEFF([0-9A-Fa-f]*)>/.exec(pdf.toString('latin1'))?.[1] ?? '';
  return Buffer.from(hex, 'hex').swap16().toString('utf16le');
}

// A4 is 210 × 297 mm and US Letter 8.5 × 11 in: 595.3 × 841.9 and 612 × 792 points.
const paperPoints = { a4: { width: 595.3, height: 841.9 }, letter: { width: 612, height: 792 } };

test('the build sheet prints on A4 and US Letter with the build’s name and weakest link, and money only on the owner’s copy when asked', async ({
  browser,
  baseURL,
}) => {
  const demo = await ensureDemo();
  const owner = await browser.newContext({ storageState: await signedInState(baseURL!, 'owner') });
  const page = await owner.newPage();
  const answer = await page.request.get(`/api/builds/${demo.buildId}/sheet`);
  expect(answer.status()).toBe(200);
  const { sheet } = (await answer.json()) as {
    sheet: { name: string; estimate: { weakestLink: { name: string } | null } };
  };
  const weakest = sheet.estimate.weakestLink!.name;

  for (const paper of ['a4', 'letter'] as const) {
    await page.emulateMedia({ media: 'screen' });
    await page.goto(paths.builds.sheet.getHref(demo.buildId) + (paper === 'a4' ? '?paper=a4' : ''));
    await expect(page.getByRole('heading', { level: 1, name: sheet.name })).toBeVisible();
    await expect(page.getByLabel('Paper')).toHaveValue(paper);
    await expect(page.getByRole('switch', { name: 'Include money' })).not.toBeChecked();

    await page.emulateMedia({ media: 'print' });
    // On paper: no header, no section tabs, no controls; the sheet itself.
    await expect(page.getByRole('navigation', { name: 'Build sections' })).toBeHidden();
    await expect(page.getByRole('button', { name: 'Print or save as PDF' })).toBeHidden();
    await expect(page.getByRole('button', { name: 'Sign out' })).toBeHidden();
    const printed = await page.locator('main').innerText();
    expect(printed).toContain(sheet.name);
    expect(printed).toContain(weakest);
    expect(printed).toContain('Parts by category');
    expect(printed).toContain('Install and torque record');
    expect(printed).not.toMatch(moneyPattern);

    const pdf = await page.pdf({ preferCSSPageSize: true, printBackground: true });
    expect(pdfTitle(pdf)).toContain(sheet.name);
    const sizes = pdfPageSizes(pdf);
    // The summary, then the lists from a new page.
    expect(sizes.length).toBeGreaterThanOrEqual(2);
    for (const size of sizes) {
      expect(size.width).toBeCloseTo(paperPoints[paper].width, 0);
      expect(size.height).toBeCloseTo(paperPoints[paper].height, 0);
    }
  }

  // The owner asks for money: the sheet has it, on screen and on paper.
  await page.emulateMedia({ media: 'screen' });
  await page.goto(paths.builds.sheet.getHref(demo.buildId));
  // The switch changes the address (?money=1), which then checks it.
  await page.getByRole('switch', { name: 'Include money' }).click();
  await expect(page).toHaveURL(/money=1/);
  await expect(page.getByRole('switch', { name: 'Include money' })).toBeChecked();
  await expect(page.locator('main dt', { hasText: 'Money' })).toBeVisible();
  await page.emulateMedia({ media: 'print' });
  await expect(page.locator('main')).toContainText(moneyPattern);
  await owner.close();

  // Crew read the sheet without money, and cannot ask for it.
  const crew = await browser.newContext({ storageState: await signedInState(baseURL!, 'crew') });
  const crewPage = await crew.newPage();
  await crewPage.goto(paths.builds.sheet.getHref(demo.buildId, true));
  await expect(crewPage.getByRole('heading', { level: 1, name: sheet.name })).toBeVisible();
  await expect(crewPage.getByRole('switch', { name: 'Include money' })).toHaveCount(0);
  expect(await crewPage.locator('main').innerText()).not.toMatch(moneyPattern);
  await crew.close();

  // The public sheet (the demo's page is shared): the build and its weakest link, never money.
  const stranger = await browser.newContext();
  const visitor = await stranger.newPage();
  await visitor.goto(paths.shared.sheet.getHref(demo.shareToken) + '?paper=a4');
  await expect(visitor.getByRole('heading', { level: 1, name: sheet.name })).toBeVisible();
  await visitor.emulateMedia({ media: 'print' });
  const publicPrinted = await visitor.locator('main').innerText();
  expect(publicPrinted).toContain(weakest);
  expect(publicPrinted).not.toMatch(moneyPattern);
  const publicPdf = pdfPageSizes(await visitor.pdf({ preferCSSPageSize: true }));
  expect(publicPdf[0].width).toBeCloseTo(paperPoints.a4.width, 0);
  await stranger.close();
});
