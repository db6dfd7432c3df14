import { expect, test } from '@playwright/test';
import {
  inviteFromOverview,
  password,
  signInThroughPage,
  signUpThroughPage,
  uniqueEmail,
} from './helpers';
import { linkTo, waitForMail } from './mail';

test('an owner signs up, starts a build, invites crew; the crew member sees it without money', async ({
  browser,
}) => {
  // The crew member-to-be already has an account: the invitation is the same either way.
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

  // One way to add people: an invitation by e-mail, whether or not they have an account.
  await expect(page.getByRole('form', { name: 'Add someone' })).toHaveCount(0);
  await inviteFromOverview(page, crewEmail, 'crew');
  const buildUrl = page.url();
  const mail = await waitForMail(page.request, crewEmail, /invited to a build on Headroom/);
  await ownerContext.close();

  const crew = await browser.newContext();
  const crewView = await crew.newPage();
  await signInThroughPage(crewView, crewEmail, password);
  await crewView.goto(linkTo(mail, '/invite/'));
  await crewView.getByRole('button', { name: 'Accept and open the build' }).click();
  await expect(crewView).toHaveURL(buildUrl);
  await crewView.goto('/builds');
  await expect(crewView.getByText('Red Dust Runner')).toBeVisible();
  await crewView.getByText('Red Dust Runner').click();
  await expect(crewView.getByRole('heading', { level: 1, name: 'Red Dust Runner' })).toBeVisible();
  await expect(crewView).toHaveURL(buildUrl);
  const text = await crewView.locator('body').innerText();
  expect(text).not.toMatch(/\$|14,250|budget/i);
  await crew.close();
});
