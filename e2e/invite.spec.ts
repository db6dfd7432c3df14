import { expect, test, type Page } from '@playwright/test';
import {
  inviteFromOverview,
  password,
  signInThroughPage,
  signUpThroughPage,
  uniqueEmail,
} from './helpers';
import { linkTo, waitForMail } from './mail';

async function startBuild(page: Page, name: string) {
  await page.getByRole('link', { name: 'Start a build' }).first().click();
  await page.getByLabel('Build name').fill(name);
  await page.getByLabel('Cylinders').fill('8');
  await page.getByLabel('Target power', { exact: true }).fill('700');
  await page.getByLabel('Budget').fill('9800');
  await page.getByRole('button', { name: 'Create build' }).click();
  await expect(page.getByRole('heading', { level: 1, name })).toBeVisible();
}

async function invite(page: Page, email: string, role: string) {
  await inviteFromOverview(page, email, role);
  await expect(
    page.getByRole('list', { name: 'Pending invitations' }).getByText(email),
  ).toBeVisible();
}

test('the owner invites a crew member by e-mail; they sign up from the mail and land on the build', async ({
  browser,
}) => {
  const owner = await browser.newContext();
  const page = await owner.newPage();
  await signUpThroughPage(page, 'Dale Kowalski', uniqueEmail('owner'));
  await startBuild(page, 'Switchback Puller');
  const buildUrl = new URL(page.url()).pathname;

  const crewEmail = uniqueEmail('crew');
  await invite(page, crewEmail, 'crew');

  const mail = await waitForMail(page.request, crewEmail, /invited to a build on Headroom/);
  const invitePath = linkTo(mail, '/invite/');

  const crew = await browser.newContext();
  const crewPage = await crew.newPage();
  await crewPage.goto(invitePath);
  await expect(
    crewPage.getByRole('heading', { level: 1, name: 'Join Switchback Puller' }),
  ).toBeVisible();
  await expect(crewPage.getByText('Dale Kowalski invited you')).toBeVisible();
  await expect(crewPage.getByText(crewEmail).first()).toBeVisible();
  await crewPage.getByLabel('Your name').fill('Marisol Ortega');
  await crewPage.getByLabel('Password').fill(password);
  await crewPage.getByRole('button', { name: 'Join the build' }).click();

  await expect(crewPage).toHaveURL(buildUrl);
  await expect(
    crewPage.getByRole('heading', { level: 1, name: 'Switchback Puller' }),
  ).toBeVisible();
  await expect(crewPage.getByTestId('signed-in-user')).toHaveText('Marisol Ortega');
  await expect(crewPage.getByText('You: Crew')).toBeVisible();
  // Crew never see money, and have no invitations to manage.
  await expect(crewPage.getByRole('heading', { name: 'Invitations' })).toHaveCount(0);
  expect(await crewPage.locator('body').innerText()).not.toMatch(/\$|9,800|budget/i);

  // The link is single-use.
  await crewPage.goto(invitePath);
  await expect(
    crewPage.getByRole('heading', { level: 1, name: 'This invitation has already been used' }),
  ).toBeVisible();
  await crew.close();

  // The owner sees them on the crew, and the invitation gone from the pending list.
  await page.reload();
  await expect(
    page.getByRole('list', { name: 'Members' }).getByText('Marisol Ortega'),
  ).toBeVisible();
  await expect(page.getByText('None waiting')).toBeVisible();
  await owner.close();
});

test('an existing user signs in from the invitation and accepts with one click', async ({
  browser,
}) => {
  const viewerEmail = uniqueEmail('viewer');
  const viewer = await browser.newContext();
  const viewerPage = await viewer.newPage();
  await signUpThroughPage(viewerPage, 'Priya Natarajan', viewerEmail);
  await viewerPage.getByRole('button', { name: 'Sign out' }).click();
  await expect(viewerPage.getByRole('heading', { name: 'Sign in' })).toBeVisible();
  // Signing out says it worked; a reload does not say it again.
  await expect(viewerPage.getByText('You have signed out')).toBeVisible();
  await viewerPage.reload();
  await expect(viewerPage.getByRole('heading', { name: 'Sign in' })).toBeVisible();
  await expect(viewerPage.getByText('You have signed out')).toHaveCount(0);

  const owner = await browser.newContext();
  const page = await owner.newPage();
  await signUpThroughPage(page, 'Wes Harlow', uniqueEmail('owner'));
  await startBuild(page, 'Quarry Sled');
  await invite(page, viewerEmail, 'viewer');
  const mail = await waitForMail(page.request, viewerEmail, /invited to a build on Headroom/);
  await owner.close();

  await viewerPage.goto(linkTo(mail, '/invite/'));
  await viewerPage.getByRole('link', { name: 'Sign in to accept' }).click();
  await viewerPage.getByLabel('E-mail').fill(viewerEmail);
  await viewerPage.getByLabel('Password').fill(password);
  await viewerPage.getByRole('button', { name: 'Sign in' }).click();

  await viewerPage.getByRole('button', { name: 'Accept and open the build' }).click();
  await expect(viewerPage.getByRole('heading', { level: 1, name: 'Quarry Sled' })).toBeVisible();
  await expect(viewerPage.getByText('You: Viewer')).toBeVisible();
  await viewer.close();
});

test('a forgotten password is replaced through the link in the mail', async ({ page }) => {
  const email = uniqueEmail('forgetful');
  await signUpThroughPage(page, 'Tomas Reyes', email);
  await page.getByRole('button', { name: 'Sign out' }).click();

  await page.getByRole('link', { name: 'Forgot your password?' }).click();
  // The sign-in page has an E-mail field too: wait for the new page before typing.
  await expect(page.getByRole('heading', { name: 'Forgot your password?' })).toBeVisible();
  await page.getByLabel('E-mail').fill(email);
  await page.getByRole('button', { name: 'E-mail me a link' }).click();
  await expect(page.getByText(/a link to set a new password is on its way/)).toBeVisible();

  const mail = await waitForMail(page.request, email, /Set a new Headroom password/);
  await page.goto(linkTo(mail, '/reset-password/'));
  await expect(page.getByText(email)).toBeVisible();
  const newPassword = 'new-glow-plugs-2028';
  await page.getByLabel('New password').fill(newPassword);
  await page.getByRole('button', { name: 'Set new password' }).click();
  await expect(page.getByRole('heading', { name: 'My builds' })).toBeVisible();
  await expect(page.getByTestId('signed-in-user')).toHaveText('Tomas Reyes');

  // The new password is the one that works now.
  await page.getByRole('button', { name: 'Sign out' }).click();
  await signInThroughPage(page, email, newPassword);
});
