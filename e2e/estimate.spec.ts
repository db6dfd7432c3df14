import { expect, test, type Page } from '@playwright/test';
import { signInThroughPage, signUpThroughPage, uniqueEmail } from './helpers';
import { joinByInvitation } from './mail';

// Long journeys (sign-up, a build, parts, reloads, an edit): give them room on a busy 2-core machine.
test.describe.configure({ timeout: 120_000 });

/** Sets up parts through the API from the page's own session (the parts form is another page's job). */
async function addPart(
  page: Page,
  baseURL: string,
  buildId: string,
  data: Record<string, unknown>,
) {
  const response = await page.request.post(`/api/builds/${buildId}/parts`, {
    data,
    headers: { Origin: baseURL },
  });
  expect(response.status(), await response.text()).toBe(201);
  return ((await response.json()) as { part: { id: string } }).part.id;
}

test('the owner sees the weakest link move when a rating changes, and the bottom-end warning when the target passes it', async ({
  page,
  baseURL,
}) => {
  const origin = baseURL!;
  await signUpThroughPage(page, 'Dale Whitcombe', uniqueEmail('estimate-owner'));

  await page.getByRole('link', { name: 'Start a build' }).first().click();
  await page.getByLabel('Build name').fill('Night Freight');
  await page.getByLabel('Cylinders').fill('8');
  await page.getByLabel('Target power', { exact: true }).fill('600');
  await page.getByLabel('Target basis').selectOption('crank');
  await page.getByRole('button', { name: 'Create build' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Night Freight' })).toBeVisible();
  const buildId = new URL(page.url()).pathname.split('/')[2];

  // At 600 crank hp (defaults: 0.40 lb/(hp·h), 18:1) the turbo must move 72 lb/min: an 80 lb/min
  // turbo has +11.1 %, less than the 700 hp bottom end's +16.7 %, so the turbo is the weakest link.
  await addPart(page, origin, buildId, {
    category: 'bottom-end',
    name: 'Stock bottom end',
    ratingValue: 700,
    ratingUnit: 'hp-crank',
  });
  const turboId = await addPart(page, origin, buildId, {
    category: 'turbocharger',
    name: 'Drop-in turbo',
    ratingValue: 80,
    ratingUnit: 'lb-per-min',
  });
  await addPart(page, origin, buildId, {
    category: 'fuel-injection',
    name: 'Injectors, set of 8',
    ratingValue: 250,
    ratingUnit: 'mm3-per-stroke',
  });
  await addPart(page, origin, buildId, {
    category: 'transmission',
    name: 'Built transmission',
    ratingValue: 1500,
    ratingUnit: 'lbf-ft',
  });

  await page.getByRole('link', { name: 'Estimate', exact: true }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Power estimate' })).toBeVisible();
  const answer = page.getByRole('region', { name: 'Weakest link' });
  await expect(answer).toContainText(
    'The turbocharger gives out first: +11.1 % headroom at 600 crank hp',
  );
  await expect(answer).toContainText('666.7 crank hp');
  await expect(page.getByText(/Each rating is its maker’s claim/)).toBeVisible();
  await expect(page.getByRole('alert')).toHaveCount(0);

  // "Show the working" opens the arithmetic with the source of each constant, its figures
  // rounded as on the rest of the page: the turbo's 80 ÷ 72 − 1 is 11.1 %, not 11.1111 %.
  const parts = page.getByRole('region', { name: 'Rated parts' });
  await parts.getByText('Show the working').first().click();
  await expect(parts.getByText('capacity = rating (for the part as fitted)').first()).toBeVisible();
  const turboWorking = parts.getByRole('group').filter({ hasText: 'Drop-in turbo headroom' });
  await expect(turboWorking.getByText('= 11.1 %')).toBeVisible();
  await expect(turboWorking).not.toContainText('11.1111');

  // A bigger turbo: the bottom end becomes the weakest link.
  const patched = await page.request.patch(`/api/builds/${buildId}/parts/${turboId}`, {
    data: { ratingValue: 110 },
    headers: { Origin: origin },
  });
  expect(patched.status(), await patched.text()).toBe(200);
  await page.reload();
  await expect(answer).toContainText(
    'The bottom end gives out first: +16.7 % headroom at 600 crank hp',
  );
  await expect(answer).toContainText('700 crank hp');

  // What if 750 crank hp? The browser's preview shows the bottom-end warning at once.
  await page.getByLabel('What-if target in crank hp').fill('750');
  await expect(page.getByText('Preview: not saved')).toBeVisible();
  const previewAlert = page.getByRole('alert');
  // One basis: 50 of the 750 hp needed is the −6.7 % the headroom says, not 50/700 = 7.1 %.
  await expect(previewAlert).toContainText('past its rating by 50 crank hp (−6.7 % headroom)');
  await expect(answer).toContainText('The bottom end gives out before the target: −6.7 % headroom');
  await page.getByRole('button', { name: 'Back to the saved target' }).click();
  await expect(page.getByRole('alert')).toHaveCount(0);
  await expect(page.getByText('Saved estimate, from the server')).toBeVisible();

  // Saving a 750 crank hp target on the build's edit page: the server's estimate warns too.
  await page.goto(`/builds/${buildId}/edit`);
  await page.getByLabel('Target power', { exact: true }).fill('750');
  await page.getByRole('button', { name: 'Save changes' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Night Freight' })).toBeVisible();
  await page.getByRole('link', { name: 'Estimate', exact: true }).click();
  await expect(page.getByText('Saved estimate, from the server')).toBeVisible();
  const alert = page.getByRole('alert');
  await expect(alert).toContainText(
    'The target is past the bottom-end rating by 50 crank hp (−6.7 % headroom)',
  );
  await expect(alert).toContainText('50 crank hp short of the target');
  await expect(page.getByRole('region', { name: 'Warnings' })).toContainText(
    'The target exceeds the bottom-end rating',
  );
});

test('the owner saves assumptions in g/kWh and resets them to the defaults', async ({ page }) => {
  await signUpThroughPage(page, 'Ines Calloway', uniqueEmail('estimate-assumptions'));
  await page.getByRole('link', { name: 'Start a build' }).first().click();
  await page.getByLabel('Build name').fill('Feed Store Special');
  await page.getByLabel('Cylinders').fill('6');
  await page.getByLabel('Target power', { exact: true }).fill('500');
  await page.getByRole('button', { name: 'Create build' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Feed Store Special' })).toBeVisible();
  await page.getByRole('link', { name: 'Estimate', exact: true }).click();

  // No rated parts: an empty state, and every category is unknown rather than fine.
  await expect(page.getByText('No rated parts yet')).toBeVisible();
  await expect(page.getByText('Bottom end: unknown')).toBeVisible();

  const form = page.getByRole('region', { name: 'Assumptions' });
  await form.getByLabel('Unit of brake specific fuel consumption').selectOption('g-per-kwh');
  // The box converts 0.4 lb/(hp·h) to g/kWh rather than reading 0.4 as g/kWh.
  await expect(form.getByLabel('Brake specific fuel consumption at peak power')).toHaveValue(
    '243.3',
  );
  await form.getByLabel('Brake specific fuel consumption at peak power').fill('230');
  await form.getByLabel('Drivetrain loss').fill('15');
  await form.getByRole('button', { name: 'Save assumptions' }).click();
  await expect(form.getByText('Saved. The estimate above uses these now.')).toBeVisible();

  await page.reload();
  await expect(form.getByLabel('Brake specific fuel consumption at peak power')).toHaveValue('230');
  await expect(form.getByLabel('Drivetrain loss')).toHaveValue('15');
  await expect(page.getByRole('region', { name: 'Target', exact: true })).toContainText(
    '425 wheel hp at 15 % drivetrain loss',
  );

  await form.getByLabel('Air–fuel ratio at full load').fill('50');
  await form.getByRole('button', { name: 'Save assumptions' }).click();
  await expect(form.getByText('At most 35')).toBeVisible();

  await form.getByRole('button', { name: 'Reset to defaults' }).click();
  await expect(form.getByText('Back to the defaults.')).toBeVisible();
  await expect(form.getByLabel('Drivetrain loss')).toHaveValue('18');
});

test('the landing page calculator names the weakest link without signing in', async ({ page }) => {
  await page.goto('/');
  const calculator = page.getByRole('region', { name: 'Try it: which part gives out first?' });
  await expect(calculator).toContainText(
    'The bottom end gives out first: +3.9 % headroom at 731.7 crank hp',
  );
  await expect(calculator.getByText('checked by the Headroom server')).toBeVisible();
  await calculator.getByLabel('Target power').fill('700');
  await expect(calculator.getByRole('alert')).toContainText('past the bottom-end rating');
  await calculator.getByLabel('Bottom end rating').fill('');
  await expect(calculator).toContainText('Not rated — unknown');
});

test('links from the estimate open the part: the owner at its rating, crew at its row, a shop only to its own parts', async ({
  browser,
  baseURL,
}) => {
  const origin = baseURL!;
  const crewEmail = uniqueEmail('estimate-crew');
  const shopEmail = uniqueEmail('estimate-shop');
  const joiners: Page[] = [];
  for (const [name, email] of [
    ['Rosa Pike', crewEmail],
    ['Gauge Line Injection', shopEmail],
  ]) {
    const joiner = await (await browser.newContext()).newPage();
    await signUpThroughPage(joiner, name, email);
    joiners.push(joiner);
  }

  const ownerContext = await browser.newContext();
  const page = await ownerContext.newPage();
  await signUpThroughPage(page, 'Wade Ostrander', uniqueEmail('estimate-links'));
  const headers = { Origin: origin };
  const created = await page.request.post('/api/builds', {
    headers,
    data: {
      name: 'Long Haul',
      cylinders: 8,
      aspiration: 'single-turbo',
      targetPowerHp: 800,
      targetPowerBasis: 'crank',
      // Above the 800 × 5252.113 / 3000 = 1400.6 lbf·ft peak power needs: the target governs.
      targetTorqueLbft: 1600,
    },
  });
  expect(created.status(), await created.text()).toBe(201);
  const buildId = ((await created.json()) as { build: { id: string } }).build.id;
  const members: Record<string, string> = {};
  for (const [i, [email, role]] of (
    [
      [crewEmail, 'crew'],
      [shopEmail, 'shop'],
    ] as const
  ).entries()) {
    // Members join the one way there is: an invitation by e-mail, accepted.
    members[role] = await joinByInvitation(page, joiners[i]!, { buildId, email, role });
    await joiners[i]!.context().close();
  }
  // 44 unrated injection parts list first, so the bottom end is past the first 40 parts.
  for (let i = 1; i <= 44; i += 1) {
    await addPart(page, origin, buildId, { category: 'fuel-injection', name: `Seal kit ${i}` });
  }
  await addPart(page, origin, buildId, {
    category: 'bottom-end',
    name: 'Forged bottom end',
    ratingValue: 1100,
    ratingUnit: 'hp-crank',
  });
  await addPart(page, origin, buildId, {
    category: 'transmission',
    name: 'Built transmission',
    status: 'at-shop',
    shopUserId: members.shop,
    sentOutOn: '2026-11-01',
    ratingValue: 1700,
    ratingUnit: 'lbf-ft',
  });
  await addPart(page, origin, buildId, {
    category: 'fuel-supply',
    name: 'Lift pump',
    ratingValue: 300,
    ratingUnit: 'l-per-h',
  });

  // On screen: the torque target loads the transmission, and its supported power says it
  // assumes the torque curve scales; the lift pump says return flow is not counted.
  await page.goto(`/builds/${buildId}/estimate`);
  const rated = page.getByRole('region', { name: 'Rated parts' });
  const trans = rated.getByRole('listitem').filter({ hasText: 'Built transmission' }).first();
  await expect(trans).toContainText('if the whole torque curve scales');
  await expect(trans.getByTestId('note-torque-curve-scaled')).toContainText(
    'The torque target, 1,600 lbf·ft, is above the 1,400.6 lbf·ft',
  );
  const pump = rated.getByRole('listitem').filter({ hasText: 'Lift pump' }).first();
  await expect(pump.getByTestId('note-return-flow-not-counted')).toContainText(
    'return flow (injector leak-off and the pressure regulator’s return to the tank) is not counted',
  );

  // The owner's link opens the part's form with the rated value ready to change.
  await page
    .getByRole('link', { name: /Change its rating in the parts ledger \(Forged bottom end/ })
    .click();
  const dialog = page.getByRole('dialog', { name: 'Edit Forged bottom end' });
  await expect(dialog).toBeVisible();
  await expect(dialog.getByLabel('Rated value')).toBeFocused();
  await expect(dialog.getByLabel('Rated value')).toHaveValue('1100');
  await ownerContext.close();

  // Crew: the ledger opens at that part's row, though it lies past the first 40 parts.
  const crewContext = await browser.newContext();
  const crewPage = await crewContext.newPage();
  await signInThroughPage(crewPage, crewEmail);
  await crewPage.goto(`/builds/${buildId}/estimate`);
  await crewPage
    .getByRole('link', { name: /See it in the parts ledger \(Forged bottom end/ })
    .click();
  const picked = crewPage.locator('[aria-current="true"]');
  await expect(picked).toHaveCount(1);
  await expect(picked.getByRole('rowheader', { name: 'Forged bottom end' })).toBeInViewport();
  await expect(crewPage.getByRole('dialog')).toHaveCount(0);
  await crewContext.close();

  // Shop: the parts not sent to it are no links (its ledger does not hold them); its own is.
  const shopContext = await browser.newContext();
  const shopPage = await shopContext.newPage();
  await signInThroughPage(shopPage, shopEmail);
  await shopPage.goto(`/builds/${buildId}/estimate`);
  const shopRated = shopPage.getByRole('region', { name: 'Rated parts' });
  await expect(shopRated.getByText('Not sent to your shop: shown by category only')).toHaveCount(2);
  await expect(shopRated.getByRole('link', { name: /parts ledger/ })).toHaveCount(1);
  await shopRated
    .getByRole('link', { name: /See it in the parts ledger \(Built transmission/ })
    .click();
  await expect(
    shopPage
      .locator('[aria-current="true"]')
      .getByRole('rowheader', { name: 'Built transmission' }),
  ).toBeVisible();
  await shopContext.close();
});
