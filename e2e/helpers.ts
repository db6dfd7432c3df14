import { expect, request, type APIRequestContext, type Page } from '@playwright/test';
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

/** A JSON POST with the Origin the server's CSRF check asks for; fails the test unless 2xx. */
export async function postJson<T = unknown>(
  api: APIRequestContext,
  origin: string,
  url: string,
  data: unknown,
): Promise<T> {
  const response = await api.post(url, { data, headers: { Origin: origin } });
  expect(response.ok(), `POST ${url}: ${response.status()} ${await response.text()}`).toBe(true);
  return (await response.json()) as T;
}

/**
 * A new account made through the API. `api` is signed in as it (dispose it when done);
 * `storageState` signs a browser context in: `browser.newContext({ storageState })`.
 */
export async function signUpThroughApi(baseURL: string, displayName: string, prefix: string) {
  const api = await request.newContext({ baseURL });
  const email = uniqueEmail(prefix);
  await postJson(api, baseURL, '/api/auth/sign-up', { email, password, displayName });
  return { api, email, storageState: await api.storageState() };
}

/**
 * The owner invites someone from the build's overview: opens the dialog, sends, waits for the
 * confirmation and closes it again.
 */
export async function inviteFromOverview(page: Page, email: string, role: string) {
  await page.getByRole('button', { name: 'Invite someone' }).click();
  const dialog = page.getByRole('dialog', { name: 'Invite someone' });
  await dialog.getByLabel('Address to invite').fill(email);
  await dialog.getByLabel('Invite as').selectOption(role);
  await dialog.getByRole('button', { name: 'Send invitation' }).click();
  await expect(dialog.getByText(`Invitation sent to ${email}`)).toBeVisible();
  await dialog.getByRole('button', { name: 'Close' }).click();
  await expect(dialog).toBeHidden();
}
