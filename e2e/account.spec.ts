/**
 * The account page (issue 20): signed in, a person changes their name, their e-mail (with
 * the current password, confirmed from the new address by mail) and their password (which
 * signs out every other device), at phone width.
 */
import { expect, test } from '@playwright/test';
import { password, signInThroughPage, signUpThroughPage, uniqueEmail } from './helpers';
import { linkTo, waitForMail } from './mail';

const phone = { width: 390, height: 844 };

test('a person changes their name, e-mail and password from their account page', async ({
  browser,
}) => {
  test.setTimeout(120_000);
  const email = uniqueEmail('acct');
  const context = await browser.newContext({ viewport: phone, hasTouch: true });
  const page = await context.newPage();
  await signUpThroughPage(page, 'Teddy Brant', email);
  // The same account on another device: it is signed out when the password changes.
  const laptopContext = await browser.newContext();
  const laptop = await laptopContext.newPage();
  await signInThroughPage(laptop, email, password);

  await page.getByRole('link', { name: /Teddy Brant\s*: your account/ }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Your account' })).toBeVisible();

  // Name: shows in the header at once.
  const nameForm = page.getByRole('form', { name: 'Your name' });
  await nameForm.getByLabel('Name').fill('Teddy Brandt');
  await nameForm.getByRole('button', { name: 'Save name' }).click();
  await expect(nameForm.getByText('Name saved.')).toBeVisible();
  await expect(page.getByTestId('signed-in-user')).toHaveText('Teddy Brandt');

  // E-mail: the current password first, then a link to the new address.
  const next = uniqueEmail('moved');
  const emailForm = page.getByRole('form', { name: 'Your e-mail address' });
  await emailForm.getByLabel('New e-mail address').fill(next);
  await emailForm.getByLabel('Current password').fill('not-the-password');
  await emailForm.getByRole('button', { name: 'Send the link' }).click();
  await expect(emailForm.getByText('That is not your current password')).toBeVisible();
  await emailForm.getByLabel('Current password').fill(password);
  await emailForm.getByRole('button', { name: 'Send the link' }).click();
  await expect(emailForm.getByText(`follow the link we sent to ${next}`)).toBeVisible();
  await expect(emailForm.getByText(email)).toBeVisible();

  const mail = await waitForMail(page.request, next, /Confirm your new Headroom e-mail address/);
  await page.goto(linkTo(mail, '/confirm-email/'));
  await expect(
    page.getByRole('heading', { level: 1, name: 'Confirm your new address' }),
  ).toBeVisible();
  await page.getByRole('button', { name: 'Confirm this address' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Address changed' })).toBeVisible();
  await page.getByRole('link', { name: 'Back to your account' }).click();
  await expect(
    page.getByRole('form', { name: 'Your e-mail address' }).getByText(next),
  ).toBeVisible();

  // Password: with the current one; the laptop is signed out, this phone is not.
  const newPassword = 'a-new-garage-passphrase';
  const passwordForm = page.getByRole('form', { name: 'Your password' });
  await passwordForm.getByLabel('Current password').fill(password);
  await passwordForm.getByLabel('New password').fill(newPassword);
  await passwordForm.getByRole('button', { name: 'Change password' }).click();
  await expect(passwordForm.getByText(/Password changed/)).toBeVisible();
  await page.goto('/builds');
  await expect(page.getByRole('heading', { name: 'My builds' })).toBeVisible();
  await laptop.goto('/builds');
  await expect(laptop.getByRole('heading', { name: 'Sign in' })).toBeVisible();
  await signInThroughPage(laptop, next, newPassword);
  await expect(laptop.getByTestId('signed-in-user')).toHaveText('Teddy Brandt');
  await context.close();
  await laptopContext.close();
});
