import { expect, type Page } from '@playwright/test';
import { randomUUID } from 'node:crypto';

export const password = 'garage-door-open-2027';

export function uniqueEmail(prefix: string) {
  return `${prefix}-${randomUUID().slice(0, 8)}@example.test`;
}

export async function signUpThroughPage(page: Page, name: string, email: string) {
  await page.goto('/sign-up');
  await page.getByLabel('Your name').fill(name);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Create account' }).click();
  await expect(page.getByRole('heading', { name: 'My builds' })).toBeVisible();
}

export async function signInThroughPage(page: Page, email: string, pw = password) {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(pw);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await expect(page.getByRole('heading', { name: 'My builds' })).toBeVisible();
}
