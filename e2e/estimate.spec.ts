import { expect, test, type Page } from '@playwright/test';
import { signUpThroughPage, uniqueEmail } from './helpers';

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

  await page.getByRole('link', { name: 'Power estimate' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Power estimate' })).toBeVisible();
  const answer = page.getByRole('region', { name: 'Weakest link' });
  await expect(answer).toContainText(
    'The turbocharger gives out first: +11.1 % headroom at 600 crank hp',
  );
  await expect(answer).toContainText('666.7 crank hp');
  await expect(page.getByText(/Each rating is its maker’s claim/)).toBeVisible();
  await expect(page.getByRole('alert')).toHaveCount(0);

  // "Show the working" opens the arithmetic with the source of each constant.
  const parts = page.getByRole('region', { name: 'Rated parts' });
  await parts.getByText('Show the working').first().click();
  await expect(parts.getByText('capacity = rating (for the part as fitted)').first()).toBeVisible();

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
  await expect(previewAlert).toContainText('past its rating by 50 crank hp (7.1 %)');
  await expect(answer).toContainText('The bottom end gives out before the target: −6.7 % headroom');
  await page.getByRole('button', { name: 'Back to the saved target' }).click();
  await expect(page.getByRole('alert')).toHaveCount(0);
  await expect(page.getByText('Saved estimate, from the server')).toBeVisible();

  // Saving a 750 crank hp target on the build's edit page: the server's estimate warns too.
  await page.goto(`/builds/${buildId}/edit`);
  await page.getByLabel('Target power', { exact: true }).fill('750');
  await page.getByRole('button', { name: 'Save changes' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Night Freight' })).toBeVisible();
  await page.getByRole('link', { name: 'Power estimate' }).click();
  await expect(page.getByText('Saved estimate, from the server')).toBeVisible();
  const alert = page.getByRole('alert');
  await expect(alert).toContainText(
    'The target is past the bottom-end rating by 50 crank hp (7.1 %)',
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
  await page.getByRole('link', { name: 'Power estimate' }).click();

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
