import { expect, test } from '@playwright/test';
import { password, signInThroughPage, signUpThroughPage, uniqueEmail } from './helpers';

test('an owner signs up, starts a build, adds crew; the crew member sees it without money', async ({
  browser,
}) => {
  // The crew member-to-be makes an account first (adding members needs an existing account).
  const crewEmail = uniqueEmail('crew');
  const crewContext = await browser.newContext();
  const crewPage = await crewContext.newPage();
  await signUpThroughPage(crewPage, 'Rosa Tillman', crewEmail);
  await crewContext.close();

  const ownerContext = await browser.newContext();
  const page = await ownerContext.newPage();
  await signUpThroughPage(page, 'Harlan Voss', uniqueEmail('owner'));
  await expect(page.getByText(/no builds yet|start your first build/i)).toBeVisible();

  await page.getByRole('link', { name: 'Start a build' }).first().click();
  await page.getByLabel('Build name').fill('Red Dust Runner');
  await page.getByLabel('Cylinders').fill('6');
  await page.getByLabel('Target power', { exact: true }).fill('650');
  await page.getByLabel('Budget').fill('14250.50');
  await page.getByRole('button', { name: 'Create build' }).click();

  await expect(page.getByRole('heading', { level: 1, name: 'Red Dust Runner' })).toBeVisible();
  await expect(page.getByText('$14,250.50')).toBeVisible();

  await page.goto('/builds');
  await expect(page.getByText('Red Dust Runner')).toBeVisible();
  await page.getByText('Red Dust Runner').click();

  const addForm = page.getByRole('form', { name: 'Add someone' });
  await addForm.getByLabel('E-mail', { exact: true }).fill(crewEmail);
  await addForm.getByLabel('Role', { exact: true }).selectOption('crew');
  await addForm.getByRole('button', { name: 'Add member' }).click();
  await expect(page.getByText('Rosa Tillman')).toBeVisible();
  const buildUrl = page.url();
  await ownerContext.close();

  const crew = await browser.newContext();
  const crewView = await crew.newPage();
  await signInThroughPage(crewView, crewEmail, password);
  await expect(crewView.getByText('Red Dust Runner')).toBeVisible();
  await crewView.getByText('Red Dust Runner').click();
  await expect(crewView.getByRole('heading', { level: 1, name: 'Red Dust Runner' })).toBeVisible();
  await expect(crewView).toHaveURL(buildUrl);
  const text = await crewView.locator('body').innerText();
  expect(text).not.toMatch(/\$|14,250|budget/i);
  await crew.close();
});
