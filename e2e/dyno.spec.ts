import { expect, test, type Page } from '@playwright/test';
import { signUpThroughPage, uniqueEmail } from './helpers';

// A long journey (sign-up, a build, a session, two imports, four standards, a phone): give it room.
test.describe.configure({ timeout: 150_000 });

/** A pull as a dyno's CSV: rows every 100 rpm, a little out of order at the start. */
function curveCsv(scale: number) {
  const rows: string[] = [];
  for (let rpm = 1800; rpm <= 3400; rpm += 100) {
    const torque = (1000 - 0.0002 * (rpm - 2300) ** 2) * scale;
    const power = (torque * rpm) / 5252.113122;
    rows.push(
      `${rpm},${power.toFixed(1)},${torque.toFixed(1)},${Math.min(36, 16 + (rpm - 1800) / 60).toFixed(1)}`,
    );
  }
  [rows[0], rows[1]] = [rows[1], rows[0]];
  return ['rpm,power_hp,torque_lbft,boost_psi', ...rows].join('\n');
}

async function importRun(page: Page, name: string, csv: string, gear: string) {
  await page.getByRole('button', { name: 'Import a run from CSV' }).click();
  const dialog = page.getByRole('dialog', { name: 'Import a run from CSV' });
  await dialog.getByLabel('Curve CSV file').setInputFiles({
    name,
    mimeType: 'text/csv',
    buffer: Buffer.from(csv),
  });
  await expect(dialog.getByText('17 rows are ready')).toBeVisible();
  await expect(dialog.getByText(/not in rpm order; they are saved sorted/)).toBeVisible();
  await dialog.getByLabel('Gear').fill(gear);
  await dialog.getByRole('button', { name: 'Save the run' }).click();
  await expect(dialog).toBeHidden();
}

test('the owner imports two runs from CSV, sees them over the target, and switches standards', async ({
  page,
  baseURL,
}) => {
  await signUpThroughPage(page, 'Ines Varga', uniqueEmail('dyno-owner'));
  // The build through the API from the page's own session: the build form is another journey's.
  const created = await page.request.post('/api/builds', {
    headers: { Origin: baseURL! },
    data: {
      name: 'Dust Runner',
      cylinders: 8,
      displacementLiters: 6.6,
      aspiration: 'single-turbo',
      targetPowerHp: 650,
      targetPowerBasis: 'crank',
    },
  });
  expect(created.status(), await created.text()).toBe(201);
  const buildId = ((await created.json()) as { build: { id: string } }).build.id;

  await page.goto(`/builds/${buildId}`);
  await expect(page.getByRole('region', { name: 'Dyno progress' })).toContainText(
    'No dyno result yet',
  );
  await page.getByRole('link', { name: 'Dyno', exact: true }).click();
  await expect(page.getByRole('heading', { level: 1, name: 'Dyno days' })).toBeVisible();
  await expect(page.getByText('No dyno days yet')).toBeVisible();
  await expect(page.getByRole('complementary', { name: 'Dyno safety' })).toContainText(
    'runaway diesel',
  );

  // A chassis-dyno day at reference.md's check weather: 30 °C, 97 kPa, dry.
  await page.getByRole('button', { name: 'New dyno session' }).first().click();
  const form = page.getByRole('dialog', { name: 'New dyno session' });
  await form.getByLabel('Date').fill('2026-11-14');
  await form.getByLabel('Place').fill('Test cell');
  await form.getByLabel('Air temperature (dry bulb)').fill('30');
  await form.getByLabel('Temperature unit').selectOption('c');
  await form.getByLabel('Station pressure').fill('97');
  await form.getByLabel('Pressure unit').selectOption('kpa');
  await form.getByLabel('Humidity given as').selectOption('none');
  await form.getByRole('button', { name: 'Add session' }).click();
  await expect(
    page.getByRole('heading', { level: 1, name: 'Dyno day, Nov 14, 2026' }),
  ).toBeVisible();

  // A bad file is refused row by row before anything is sent.
  await page.getByRole('button', { name: 'Import a run from CSV' }).click();
  const dialog = page.getByRole('dialog', { name: 'Import a run from CSV' });
  await dialog.getByLabel('Curve CSV file').setInputFiles({
    name: 'bad.csv',
    mimeType: 'text/csv',
    buffer: Buffer.from('rpm,power_hp\n2000,300\n0,310\n2400,lots\n'),
  });
  await expect(dialog.getByText('Some rows need fixing')).toBeVisible();
  await expect(
    dialog.getByRole('cell', { name: /Row 3, power_hp: "lots" is not a number/ }),
  ).toBeVisible();
  await expect(dialog.getByRole('button', { name: 'Save the run' })).toBeDisabled();
  await dialog.getByRole('button', { name: 'Cancel' }).click();

  await importRun(page, 'pull-1.csv', curveCsv(0.9), '4th');
  await importRun(page, 'pull-2.csv', curveCsv(0.94), '4th');
  const runs = page.getByRole('region', { name: 'Runs' });
  await expect(runs.getByRole('article')).toHaveCount(2);

  // Both curves over the target, drawn at the wheels: 650 crank hp × (1 − 18 %) = 533 wheel hp.
  const chart = page.getByTestId('dyno-chart');
  await expect(chart.getByText('Target 533 wheel hp')).toBeVisible();
  await expect(chart.locator('path.recharts-line-curve')).toHaveCount(4);
  await expect(chart.getByText('Run 1').first()).toBeVisible();
  await expect(chart.getByText('Run 2').first()).toBeVisible();
  await expect(chart).toContainText(
    '533 wheel hp with the build’s 18 % drivetrain-loss assumption',
  );

  // Run 2's peak as measured, from its curve, is the best.
  const best = runs.getByRole('article', { name: 'Run 2' });
  await expect(best.getByText('Best run')).toBeVisible();
  const factor = page.getByTestId('correction-factor');
  const peak = best.getByTestId('run-peak-power');

  // SAE J1349 by default: reference.md's check (30 °C, 97 kPa) → 1.0343913.
  await expect(factor).toHaveText('1.0344');
  const j1349Peak = await peak.textContent();
  await page.getByLabel('Correction standard').selectOption('uncorrected');
  await expect(factor).toHaveText('1');
  await expect(page.getByRole('region', { name: 'Curves' })).toContainText('As measured');
  const measured = await peak.textContent();
  expect(measured).not.toBe(j1349Peak);
  // DIN 70020 (30 °C, 970 mbar) → 1.0620017.
  await page.getByLabel('Correction standard').selectOption('din-70020');
  await expect(factor).toHaveText('1.062');
  const dinPeak = await peak.textContent();
  expect(dinPeak).not.toBe(measured);
  expect(parseFloat(dinPeak!)).toBeCloseTo(parseFloat(measured!) * 1.0620017, 0);
  // R85 says which engine factor it used and why.
  await page.getByLabel('Correction standard').selectOption('ece-r85');
  await expect(
    page.getByRole('region', { name: 'Weather and correction' }).getByTestId('engine-factor'),
  ).toContainText('worked out from the run');
  await expect(page).toHaveURL(/standard=ece-r85/);

  // The list and the overview read the same best run.
  await page.getByRole('link', { name: 'Dyno days' }).first().click();
  await expect(page.getByRole('region', { name: 'Against the plan' })).toContainText(
    'of the 650 crank hp target',
  );
  await page.getByRole('link', { name: 'Overview' }).click();
  await expect(page.getByTestId('dyno-progress')).toContainText('of 650 crank hp');
  await expect(page.getByTestId('dyno-progress')).toContainText('18 % drivetrain-loss assumption');
});

test('at phone width the session page is readable', async ({ page, baseURL }) => {
  await page.setViewportSize({ width: 390, height: 844 });
  await signUpThroughPage(page, 'Ines Varga', uniqueEmail('dyno-phone'));
  const headers = { Origin: baseURL! };
  const build = await page.request.post('/api/builds', {
    headers,
    data: {
      name: 'Pocket Hauler',
      cylinders: 6,
      aspiration: 'single-turbo',
      targetPowerHp: 500,
      targetPowerBasis: 'wheel',
    },
  });
  const buildId = ((await build.json()) as { build: { id: string } }).build.id;
  const session = await page.request.post(`/api/builds/${buildId}/dyno-sessions`, {
    headers,
    data: {
      date: '2026-11-20',
      place: 'A long place name for a dyno cell on the far side of the county',
      dynoKind: 'chassis',
      weather: {
        temperature: 78,
        temperatureUnit: 'f',
        pressure: 29.12,
        pressureUnit: 'inhg',
        relativeHumidityPct: 34,
      },
    },
  });
  const sessionId = ((await session.json()) as { session: { id: string } }).session.id;
  const run = await page.request.post(
    `/api/builds/${buildId}/dyno-sessions/${sessionId}/runs/import`,
    {
      headers,
      multipart: {
        file: { name: 'pull.csv', mimeType: 'text/csv', buffer: Buffer.from(curveCsv(0.9)) },
        run: JSON.stringify({ gear: '4th', tuneRevision: 'R1' }),
      },
    },
  );
  expect(run.status(), await run.text()).toBe(201);

  await page.goto(`/builds/${buildId}/dyno/${sessionId}`);
  await expect(
    page.getByRole('heading', { level: 1, name: 'Dyno day, Nov 20, 2026' }),
  ).toBeVisible();
  await expect(page.getByTestId('correction-factor')).toBeVisible();
  await expect(page.getByRole('article', { name: 'Run 1' })).toBeVisible();
  await expect(page.getByTestId('dyno-chart').locator('path.recharts-line-curve')).toHaveCount(2);
  // Nothing wider than the phone: no sideways scrolling of the page.
  const widths = await page.evaluate(() => ({
    page: document.documentElement.scrollWidth,
    view: window.innerWidth,
  }));
  expect(widths.page).toBeLessThanOrEqual(widths.view);
  // Every button is a thumb's size.
  for (const button of await page
    .getByRole('article', { name: 'Run 1' })
    .getByRole('button')
    .all()) {
    const box = await button.boundingBox();
    expect(box!.height).toBeGreaterThanOrEqual(44);
  }
});
