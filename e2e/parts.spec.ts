import { expect, test, type Page } from '@playwright/test';
import sharp from 'sharp';
import {
  inviteFromOverview,
  password,
  signInThroughPage,
  signUpThroughPage,
  uniqueEmail,
} from './helpers';
import { linkTo, waitForMail } from './mail';

type NewPart = { name: string; category: string; status: string; price: string };

async function addPart(page: Page, part: NewPart) {
  await page.getByRole('button', { name: 'Add part' }).first().click();
  const dialog = page.getByRole('dialog', { name: 'Add a part' });
  await expect(dialog).toBeVisible();
  await dialog.getByLabel('Name').fill(part.name);
  await dialog.getByLabel('Category').selectOption({ label: part.category });
  await dialog.getByLabel('Status').selectOption({ label: part.status });
  await dialog.getByLabel('Unit price').fill(part.price);
  await dialog.getByRole('button', { name: 'Add part' }).click();
  await expect(dialog).toBeHidden();
  await expect(page.getByRole('status').filter({ hasText: `Added “${part.name}”.` })).toBeVisible();
}

/** The Spent figure of one category in the budget's table (the data the bar chart draws). */
function spentIn(page: Page, category: string) {
  // Cells after the row header: parts, planned, committed, spent, core owed.
  return page
    .getByRole('row', { name: new RegExp(`^${category}`) })
    .getByRole('cell')
    .nth(3);
}

test('the owner builds a ledger, moves a part in its row and the budget follows; crew sees no money', async ({
  browser,
}) => {
  const crewEmail = uniqueEmail('crew');
  const crewContext = await browser.newContext();
  await signUpThroughPage(await crewContext.newPage(), 'Dale Okonkwo', crewEmail);
  await crewContext.close();

  const ownerContext = await browser.newContext();
  const page = await ownerContext.newPage();
  await signUpThroughPage(page, 'June Calloway', uniqueEmail('owner'));
  await page.getByRole('link', { name: 'Start a build' }).first().click();
  await page.getByLabel('Build name').fill('Salt Flat Shuttle');
  await page.getByLabel('Cylinders').fill('6');
  await page.getByLabel('Target power', { exact: true }).fill('700');
  await page.getByLabel('Budget').fill('10000');
  await page.getByRole('button', { name: 'Create build' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Salt Flat Shuttle' })).toBeVisible();

  // The crew member joins through an invitation, the one way in.
  await inviteFromOverview(page, crewEmail, 'crew');
  const mail = await waitForMail(page.request, crewEmail, /invited to a build on Headroom/);
  const crewJoin = await browser.newContext();
  const joinPage = await crewJoin.newPage();
  await signInThroughPage(joinPage, crewEmail, password);
  await joinPage.goto(linkTo(mail, '/invite/'));
  await joinPage.getByRole('button', { name: 'Accept and open the build' }).click();
  await expect(
    joinPage.getByRole('heading', { level: 1, name: 'Salt Flat Shuttle' }),
  ).toBeVisible();
  await crewJoin.close();

  const sections = page.getByRole('navigation', { name: 'Build sections' });
  await sections.getByRole('link', { name: 'Parts' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Parts' })).toBeVisible();
  await expect(page.getByText('No parts yet')).toBeVisible();

  await addPart(page, {
    name: 'Injector set, stage 2',
    category: 'Fuel injection',
    status: 'On order',
    price: '1800.00',
  });
  await addPart(page, {
    name: 'Head studs, 12-point',
    category: 'Cylinder head & studs',
    status: 'In the garage',
    price: '850',
  });
  await addPart(page, {
    name: 'Lift pump, 220 L/h',
    category: 'Fuel supply',
    status: 'On the list',
    price: '640.50',
  });

  const ledger = page.getByRole('table', { name: /Parts ledger/ });
  for (const name of ['Injector set, stage 2', 'Head studs, 12-point', 'Lift pump, 220 L/h']) {
    await expect(ledger.getByRole('rowheader', { name })).toBeVisible();
  }
  await expect(page.getByText('Total: $3,290.50')).toBeVisible();

  // Before: the injectors are only ordered, so nothing is spent on fuel injection.
  await sections.getByRole('link', { name: 'Budget' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Budget' })).toBeVisible();
  await expect(spentIn(page, 'Fuel injection')).toHaveText('$0.00');
  await expect(
    page
      .getByRole('row', { name: /^All categories/ })
      .getByRole('cell')
      .nth(3),
  ).toHaveText('$850.00');

  // The injectors arrive: their status is changed right in the ledger row.
  await sections.getByRole('link', { name: 'Parts' }).click();
  const status = page.getByLabel('Status of Injector set, stage 2');
  await status.selectOption({ label: 'In the garage' });
  await expect(status).toBeEnabled();
  await expect(status).toHaveValue('in-hand');

  await sections.getByRole('link', { name: 'Budget' }).click();
  await expect(spentIn(page, 'Fuel injection')).toHaveText('$1,800.00');
  await expect(
    page
      .getByRole('row', { name: /^All categories/ })
      .getByRole('cell')
      .nth(3),
  ).toHaveText('$2,650.00');

  // A photo of the part itself, from its edit dialog (a plain drawn square, nothing real).
  await sections.getByRole('link', { name: 'Parts' }).click();
  await page.getByRole('button', { name: 'Edit Injector set, stage 2' }).first().click();
  const edit = page.getByRole('dialog', { name: 'Edit Injector set, stage 2' });
  await edit.getByLabel('Add photos').setInputFiles({
    name: 'injectors.png',
    mimeType: 'image/png',
    buffer: await sharp({
      create: { width: 96, height: 64, channels: 3, background: { r: 90, g: 80, b: 120 } },
    })
      .png()
      .toBuffer(),
  });
  await edit.getByRole('button', { name: 'Upload 1 photo' }).click();
  await expect(edit.getByText('Photo added.')).toBeVisible();
  await expect(edit.getByRole('list', { name: 'Photos of this part' })).toBeVisible();
  await ownerContext.close();

  // The crew member reads the same ledger without a single amount of money.
  const crew = await browser.newContext();
  const crewPage = await crew.newPage();
  await signInThroughPage(crewPage, crewEmail, password);
  await crewPage.getByText('Salt Flat Shuttle').click();
  const crewSections = crewPage.getByRole('navigation', { name: 'Build sections' });
  await expect(crewSections.getByRole('link', { name: 'Budget' })).toHaveCount(0);
  await crewSections.getByRole('link', { name: 'Parts' }).click();
  const crewLedger = crewPage.getByRole('table', { name: /Parts ledger/ });
  await expect(crewLedger.getByRole('rowheader', { name: 'Injector set, stage 2' })).toBeVisible();
  await expect(crewLedger.getByRole('rowheader', { name: 'Lift pump, 220 L/h' })).toBeVisible();
  await expect(crewPage.getByLabel('Status of Injector set, stage 2')).toHaveValue('in-hand');
  for (const header of ['Total', 'Unit price', 'Labor', 'Your quote']) {
    await expect(crewLedger.getByRole('columnheader', { name: header })).toHaveCount(0);
  }
  const text = await crewPage.locator('body').innerText();
  expect(text).not.toMatch(/\$|1,800|3,290|subtotal/i);
  await crew.close();
});

test('the ledger counts parts, not category rows: 32 parts all listed, 45 listed 40 then 5 more', async ({
  page,
  baseURL,
}) => {
  const headers = { Origin: baseURL! };
  await signUpThroughPage(page, 'Tess Marlowe', uniqueEmail('ledger-paging'));
  const created = await page.request.post('/api/builds', {
    headers,
    data: {
      name: 'Parts Mule',
      cylinders: 6,
      aspiration: 'single-turbo',
      targetPowerHp: 600,
      targetPowerBasis: 'crank',
    },
  });
  const buildId = ((await created.json()) as { build: { id: string } }).build.id;
  const add = async (category: string, name: string) => {
    const res = await page.request.post(`/api/builds/${buildId}/parts`, {
      headers,
      data: { category, name },
    });
    expect(res.status(), await res.text()).toBe(201);
  };
  // 32 parts over 12 categories: 44 rows with their headers, more than the 40 a step lists.
  const categories = [
    'fuel-injection',
    'fuel-supply',
    'turbocharger',
    'air-intake',
    'exhaust',
    'head-and-studs',
    'bottom-end',
    'transmission',
    'torque-converter',
    'driveline',
    'cooling',
    'tuning',
  ];
  for (let i = 0; i < 32; i += 1)
    await add(categories[i % 12], `Part ${String(i + 1).padStart(2, '0')}`);

  await page.goto(`/builds/${buildId}/parts`);
  const ledger = page.getByRole('table', { name: /Parts ledger/ });
  // A part's row is headed by its name (scope="row"); a category's by scope="rowgroup".
  const partRows = ledger.locator('tbody th[scope="row"]');
  await expect(page.getByText('32 parts', { exact: true })).toBeVisible();
  await expect(partRows).toHaveCount(32);
  await expect(page.getByRole('button', { name: /^Show \d+ more$/ })).toHaveCount(0);

  for (let i = 32; i < 45; i += 1) await add('other', `Part ${i + 1}`);
  await page.reload();
  await expect(partRows).toHaveCount(40);
  await expect(page.getByTestId('ledger-listing')).toContainText('Listing 40 of 45 parts');
  // The list stops inside "Other": its header is listed with its first parts, and says so.
  await expect(page.getByRole('button', { name: /^Other 13 parts, 8 listed$/ })).toBeVisible();
  // No category header is listed without a part of its own under it.
  const rowKinds = await ledger
    .locator('tbody > tr')
    .evaluateAll((rows) => rows.map((r) => (r.querySelector('th[scope="rowgroup"]') ? 'h' : 'p')));
  expect(rowKinds.at(-1)).toBe('p');
  expect(rowKinds.join('')).not.toMatch(/hh/);
  await page.getByRole('button', { name: 'Show 5 more' }).click();
  await expect(partRows).toHaveCount(45);
  await expect(page.getByTestId('ledger-listing')).toHaveCount(0);
});
