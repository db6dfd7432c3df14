/**
 * The timeline journey: an owner whose browser is in Denver starts a build (it takes that
 * time zone), sets the target date, sees a late part flagged on the overview and the
 * timeline, and clicks through to it in the ledger; at phone width the page fits, a
 * milestone is added and ticked off, and a calendar link is made and answers iCalendar.
 */
import { expect, test, type Page } from '@playwright/test';
import { addDays, todayIn } from '@shared/dates';
import { postJson, signUpThroughPage, uniqueEmail } from './helpers';

const zone = 'America/Denver';

/** Fits the viewport: no sideways scrolling. */
async function expectNoSidewaysScroll(page: Page) {
  const overflow = await page.evaluate(
    () => document.documentElement.scrollWidth - document.documentElement.clientWidth,
  );
  expect(overflow).toBeLessThanOrEqual(0);
}

test('the owner sets a date, sees a late part flagged and clicks through to it; the page works at phone width', async ({
  browser,
  baseURL,
}) => {
  const context = await browser.newContext({ timezoneId: zone });
  const page = await context.newPage();
  await signUpThroughPage(page, 'Rosa Lindqvist', uniqueEmail('owner'));
  await page.getByRole('link', { name: 'Start a build' }).first().click();
  await page.getByLabel('Build name').fill('Canyon Runner');
  await page.getByLabel('Cylinders').fill('6');
  await page.getByLabel('Target power', { exact: true }).fill('650');
  await page.getByRole('button', { name: 'Create build' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Canyon Runner' })).toBeVisible();
  const buildId = new URL(page.url()).pathname.split('/')[2];

  // Two parts on order: one due before the cut-off, one four days after it.
  const today = todayIn(zone);
  const target = addDays(today, 30);
  for (const [name, expectedOn] of [
    ['Lift pump, 250 L/h', addDays(today, 10)],
    ['Billet intercooler', addDays(target, -3)],
  ]) {
    await postJson(page.request, baseURL!, `/api/builds/${buildId}/parts`, {
      category: 'air-intake',
      name,
      status: 'ordered',
      expectedOn,
    });
  }

  // The owner sets the date on the build.
  await page.getByRole('link', { name: 'Edit build' }).click();
  await page.getByLabel('Target date').fill(target);
  await page.getByLabel('Event').fill('Canyon pull');
  await page.getByRole('button', { name: 'Save changes' }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Canyon Runner' })).toBeVisible();

  // The overview counts down and names the threat.
  const summary = page.getByRole('region', { name: 'Timeline' });
  await expect(summary.getByText('30 days to go')).toBeVisible();
  await expect(summary.getByText('1 thing threatens the date')).toBeVisible();
  await expect(summary.getByRole('link', { name: 'Billet intercooler' })).toBeVisible();

  await page
    .getByRole('navigation', { name: 'Build sections' })
    .getByRole('link', { name: 'Timeline' })
    .click();
  await expect(page.getByRole('heading', { level: 1, name: 'Timeline' })).toBeVisible();
  // The build took the browser's time zone when it was made.
  await expect(page.getByText(`in ${zone}`)).toBeVisible();
  const threats = page.getByRole('list', { name: 'What threatens the date' });
  await expect(threats.getByRole('listitem')).toHaveCount(1);
  await expect(threats).toContainText('Part arriving late');
  await expect(threats).toContainText('4 days late');
  await expect(threats).toContainText('4 days after the parts cut-off');
  // The on-time part is on the timeline, not among the threats.
  await expect(page.getByRole('region', { name: 'Dates' })).toContainText('Lift pump, 250 L/h');

  await threats.getByRole('link', { name: 'Billet intercooler' }).click();
  await expect(page).toHaveURL(/\/parts\?part=/);
  const dialog = page.getByRole('dialog', { name: /Billet intercooler/ });
  await expect(dialog).toBeVisible();
  await expect(dialog.getByLabel('Expected')).toHaveValue(addDays(target, -3));
  await dialog.getByRole('button', { name: 'Cancel' }).click();

  // At phone width.
  await page.setViewportSize({ width: 390, height: 844 });
  await page.goto(`/builds/${buildId}/timeline`);
  await expect(page.getByText('1 thing threatens the date')).toBeVisible();
  await expectNoSidewaysScroll(page);

  const add = page.getByRole('form', { name: 'Add a milestone' });
  await add.getByLabel('Milestone').fill('Engine back together');
  await add.getByLabel('Date').fill(addDays(today, 12));
  await add.getByRole('button', { name: 'Add milestone' }).click();
  const milestones = page.getByRole('region', { name: 'Milestones' });
  const done = milestones.getByRole('checkbox', { name: 'Engine back together' });
  await expect(done).not.toBeChecked();
  await done.click();
  await expect(done).toBeChecked();
  await expect(page.getByRole('region', { name: 'Dates' })).toContainText('Engine back together');
  await expectNoSidewaysScroll(page);

  // My calendar link answers iCalendar to anyone holding it, with no session.
  await page.getByRole('button', { name: 'Make my calendar link' }).click();
  const link = page.getByLabel('Your calendar link');
  await expect(link).toHaveValue(/\/api\/calendar-feeds\/.+\/calendar\.ics$/);
  const feed = await browser.newContext();
  const res = await feed.request.get(await link.inputValue());
  expect(res.status()).toBe(200);
  const ics = await res.text();
  expect(ics).toContain('BEGIN:VCALENDAR');
  expect(ics).toContain('SUMMARY:Target date: Canyon pull');
  expect(ics).toContain('SUMMARY:Expected: Billet intercooler');
  await feed.close();
  await expectNoSidewaysScroll(page);
  await context.close();
});
