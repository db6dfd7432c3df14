/**
 * The budget's "spending over time" chart (issue 20): dates sit on a time scale, so two
 * purchases two days apart and one two months later are drawn two days and two months apart.
 */
import { expect, test } from '@playwright/test';
import { signUpThroughPage, uniqueEmail } from './helpers';

test('spending over time spaces dates by time, not one after another', async ({ page }) => {
  await signUpThroughPage(page, 'June Calloway', uniqueEmail('owner'));
  const headers = { Origin: new URL(page.url()).origin };
  const build = await page.request.post('/api/builds', {
    headers,
    data: {
      name: 'Salt Flat Shuttle',
      cylinders: 6,
      aspiration: 'single-turbo',
      targetPowerHp: 650,
      targetPowerBasis: 'crank',
      budgetCents: 1_000_000,
    },
  });
  const { id } = (await build.json()).build;
  for (const [name, orderedOn] of [
    ['Head studs', '2026-01-01'],
    ['Lift pump', '2026-01-03'],
    ['Injector set', '2026-03-01'],
  ]) {
    const res = await page.request.post(`/api/builds/${id}/parts`, {
      headers,
      data: { category: 'other', name, status: 'ordered', orderedOn, unitPriceCents: 100_000 },
    });
    expect(res.ok(), await res.text()).toBe(true);
  }
  await page.goto(`/builds/${id}/budget`);
  const chart = page.getByRole('region', { name: /Spending over time/ });
  const labels = chart.locator('text.recharts-cartesian-axis-tick-value');
  await expect(labels.filter({ hasText: /^Jan 1$/ })).toBeVisible();

  // Each date tick's day and x position: pixels per day must be the same all along the axis.
  const points = (
    await labels.evaluateAll((els) =>
      els.map((el) => ({ label: el.textContent ?? '', x: Number(el.getAttribute('x')) })),
    )
  ).filter((p) => /^[A-Z][a-z]{2} \d{1,2}$/.test(p.label));
  const day = (label: string) => Date.parse(`${label} 2026 UTC`) / 86_400_000;
  expect(points.length).toBeGreaterThanOrEqual(3);
  const rates = points
    .slice(1)
    .map((p, i) => (p.x - points[i].x) / (day(p.label) - day(points[i].label)));
  for (const r of rates)
    expect(Math.abs(r / rates[0] - 1), JSON.stringify(points)).toBeLessThan(0.02);
  // And the three purchases' dates lie inside the axis: January 1 to March 1.
  expect(day(points[0].label)).toBeGreaterThanOrEqual(day('Jan 1'));
  expect(day(points.at(-1)!.label)).toBeLessThanOrEqual(day('Mar 1'));
});
