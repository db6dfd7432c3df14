import { expect, test, type Page } from '@playwright/test';
import sharp from 'sharp';
import { signUpThroughPage, uniqueEmail } from './helpers';
import { joinByInvitation } from './mail';

const phone = { width: 390, height: 844 };

/** A calendar date `n` days ago, as a date box takes it. */
const daysAgo = (n: number) => new Date(Date.now() - n * 86_400_000).toISOString().slice(0, 10);

/** A JSON call as the signed-in user of `page`, with the Origin the server asks for. */
async function call<T>(page: Page, method: 'post', url: string, data: unknown): Promise<T> {
  const response = await page.request[method](url, {
    data,
    headers: { Origin: new URL(page.url()).origin },
  });
  expect(response.ok(), `${method.toUpperCase()} ${url}: ${await response.text()}`).toBe(true);
  return (await response.json()) as T;
}

/** A small drawing (no photo of anything real): a grey bore on a green bench. */
function benchPhoto() {
  return sharp({
    create: { width: 160, height: 120, channels: 3, background: { r: 62, g: 107, b: 88 } },
  })
    .composite([
      {
        input: Buffer.from(
          '<svg xmlns="http://www.w3.org/2000/svg" width="160" height="120"><circle cx="80" cy="60" r="34" fill="#9aa3ad"/><circle cx="80" cy="60" r="14" fill="#20242a"/></svg>',
        ),
      },
    ])
    .png()
    .toBuffer();
}

test('at phone width the crew records torque (one out of spec, then corrected) and a photo; the owner signs off', async ({
  browser,
}) => {
  // Two sign-ups, an upload and two browsers: longer than the default minute on a busy machine.
  test.setTimeout(120_000);

  // Two accounts, made through the pages.
  const crewEmail = uniqueEmail('crew');
  const crewContext = await browser.newContext({ viewport: phone, hasTouch: true });
  const crew = await crewContext.newPage();
  await signUpThroughPage(crew, 'Teodor Brandt', crewEmail);

  const ownerContext = await browser.newContext();
  const owner = await ownerContext.newPage();
  await signUpThroughPage(owner, 'Marisol Okafor', uniqueEmail('owner'));

  // The owner's set-up, through the API: a build, the crew member, a job, a step with a
  // check and a fastener spec (2 hold-down bolts, 35 lbf·ft ± 10 %).
  const { build } = await call<{ build: { id: string } }>(owner, 'post', '/api/builds', {
    name: 'Night Shift Hauler',
    cylinders: 6,
    aspiration: 'single-turbo',
    targetPowerHp: 650,
    targetPowerBasis: 'crank',
  });
  const api = `/api/builds/${build.id}`;
  await joinByInvitation(owner, crew, { buildId: build.id, email: crewEmail, role: 'crew' });
  const { job } = await call<{ job: { id: string } }>(owner, 'post', `${api}/jobs`, {
    title: 'Fit the rebuilt injectors',
  });
  const { step } = await call<{ step: { id: string } }>(
    owner,
    'post',
    `${api}/jobs/${job.id}/steps`,
    {
      title: 'Seat the injectors and torque the hold-downs',
      description: 'Match each injector to its cylinder from the bench sheet.',
    },
  );
  await call(owner, 'post', `${api}/steps/${step.id}/checklist`, {
    label: 'New copper washer on each injector',
  });
  await call(owner, 'post', `${api}/steps/${step.id}/fasteners`, {
    name: 'Injector hold-down bolts',
    count: 2,
    targetValue: 35,
    targetUnit: 'lbf-ft',
    toleranceType: 'percent',
    toleranceValue: 10,
    threadCondition: 'oiled',
    specSource: 'Service manual, fuel system, injector installation (test entry)',
  });

  // The crew member finds the step from the build's Install tab.
  await crew.goto('/builds');
  await crew.getByText('Night Shift Hauler').click();
  await crew
    .getByRole('navigation', { name: 'Build sections' })
    .getByRole('link', { name: 'Install' })
    .click();
  await expect(crew.getByRole('heading', { level: 1, name: 'Install' })).toBeVisible();
  await expect(crew.getByRole('heading', { name: 'Fit the rebuilt injectors' })).toBeVisible();
  await crew.getByRole('link', { name: /Seat the injectors and torque the hold-downs/ }).click();
  await expect(
    crew.getByRole('heading', { level: 1, name: 'Seat the injectors and torque the hold-downs' }),
  ).toBeVisible();
  await expect(crew).toHaveURL(new RegExp(`/builds/${build.id}/install/steps/${step.id}$`));

  // The cautions that apply: injectors mean high-pressure fuel; a spec means service information.
  const cautions = crew.getByRole('region', { name: 'Cautions' });
  await expect(cautions.getByText('High-pressure fuel')).toBeVisible();
  await expect(cautions.getByText(/inject fuel through skin/)).toBeVisible();
  await expect(cautions.getByText('Specs come from the service information')).toBeVisible();

  // The spec in both unit systems.
  const bolts = crew.getByRole('region', { name: /Injector hold-down bolts/ });
  await expect(bolts.getByText('35 lbf·ft ±10 %')).toBeVisible();
  await expect(bolts.getByText('(47.5 N·m)')).toBeVisible();
  await expect(bolts.getByText('Oiled')).toBeVisible();

  // Touch targets big enough for a gloved thumb.
  const record1 = bolts.getByRole('button', { name: 'Record #1' });
  expect((await record1.boundingBox())!.height).toBeGreaterThanOrEqual(48);

  // The crew member's own wrench, with its last calibration: kept on the account, offered here.
  await bolts.getByRole('button', { name: 'Add a wrench' }).click();
  await bolts.getByLabel('Wrench name or number').fill('3/8 in. click wrench, 10–80 lbf·ft');
  await bolts.getByLabel('Last calibrated').fill(daysAgo(60));
  await bolts.getByRole('button', { name: 'Add the wrench' }).click();
  await expect(bolts.getByLabel('Wrench used').locator('option:checked')).toHaveText(
    '3/8 in. click wrench, 10–80 lbf·ft',
  );
  await expect(bolts.getByText(/^Calibrated .*, due /)).toBeVisible();

  // #1 in spec.
  await bolts.getByLabel('Torque at #1').fill('36');
  await record1.click();
  const first = bolts.getByRole('listitem', { name: 'Position 1' });
  await expect(first.getByText('In spec')).toBeVisible();
  await expect(first.getByText('= 48.8 N·m')).toBeVisible();
  await expect(first.getByText(/3\/8 in\. click wrench/)).toBeVisible();

  // #2 read in N·m: 60 N·m is 44.3 lbf·ft, over spec, and says so at once.
  await bolts.getByLabel('Unit at #2').selectOption('n-m');
  await bolts.getByLabel('Torque at #2').fill('60');
  await bolts.getByRole('button', { name: 'Record #2' }).click();
  const second = bolts.getByRole('listitem', { name: 'Position 2' });
  await expect(second.getByText('Over spec')).toBeVisible();
  await expect(second.getByText('= 44.3 lbf·ft')).toBeVisible();
  await expect(bolts.getByRole('status')).toHaveText('#2: 60 N·m, over spec.');

  // Sign-off is blocked by it (and by the unticked check).
  const signOff = crew.getByRole('region', { name: 'Sign-off' });
  await expect(signOff.getByText('Not ready to sign off: 2 open items')).toBeVisible();
  await expect(signOff.getByText('Injector hold-down bolts #2: over spec (60 N·m)')).toBeVisible();
  await expect(signOff.getByRole('button', { name: 'Sign off this step' })).toHaveCount(0);

  // The correction is a new reading; the old one stays in the history, struck through.
  await second.getByRole('button', { name: 'Record a correction for #2' }).click();
  await second.getByLabel('Torque at #2').fill('47');
  await second.getByLabel('Unit at #2').selectOption('n-m');
  await second.getByLabel('Note for #2').fill('Wrench was still on the N·m scale');
  await second.getByRole('button', { name: 'Record correction #2' }).click();
  await expect(second.getByText('In spec', { exact: true })).toBeVisible();
  await expect(second.getByText('= 34.7 lbf·ft')).toBeVisible();
  await expect(second.getByText('Over spec')).toHaveCount(0);
  await second.getByRole('button', { name: /History \(1 replaced\) of #2/ }).click();
  const history = second.getByRole('list', { name: 'History of #2' });
  await expect(history.getByRole('listitem')).toHaveCount(2);
  await expect(history.locator('s').filter({ hasText: '60 N·m' })).toBeVisible();
  await expect(history.getByText('replaced')).toBeVisible();

  // The wrench is remembered on this phone for the next entries.
  await crew.reload();
  await expect(bolts.getByLabel('Wrench used').locator('option:checked')).toHaveText(
    '3/8 in. click wrench, 10–80 lbf·ft',
  );

  // The check, ticked with a big box; who ticked it shows.
  const washer = crew.getByRole('checkbox', { name: /New copper washer on each injector/ });
  await washer.click();
  await expect(washer).toBeChecked();
  await expect(crew.getByText('Ticked by Teodor Brandt')).toBeVisible();

  // A photo of the step, with its own progress bar and caption, then in the step's gallery.
  await crew.getByLabel('Add photos').setInputFiles({
    name: 'hold-downs.png',
    mimeType: 'image/png',
    buffer: await benchPhoto(),
  });
  await crew.getByLabel('Caption for hold-downs.png').fill('Hold-downs torqued, cylinder 1 and 2');
  await crew.getByRole('button', { name: 'Upload 1 photo' }).click();
  await expect(crew.getByText('Photo added.')).toBeVisible();
  const gallery = crew.getByRole('list', { name: 'Photos of this step' });
  const thumb = gallery.getByRole('img', { name: 'Hold-downs torqued, cylinder 1 and 2' });
  await expect(thumb).toBeVisible();
  // The thumbnail really loads (served to members with the session cookie).
  await thumb.scrollIntoViewIfNeeded();
  await expect
    .poll(() => thumb.evaluate((img: HTMLImageElement) => img.naturalWidth))
    .toBeGreaterThan(0);
  await gallery.getByRole('button', { name: /Open “Hold-downs torqued/ }).click();
  const viewer = crew.getByRole('dialog', { name: 'Photo 1 of 1' });
  await expect(
    viewer.getByRole('img', { name: 'Hold-downs torqued, cylinder 1 and 2' }),
  ).toBeVisible();
  // Crew may caption but not delete.
  await expect(viewer.getByRole('button', { name: 'Delete photo' })).toHaveCount(0);
  await viewer.getByRole('button', { name: 'Close the photo' }).click();
  await expect(viewer).toBeHidden();

  // Everything in spec and ticked: ready for sign-off.
  await expect(
    signOff.getByText('Every position reads in spec and every check is ticked.'),
  ).toBeVisible();
  await crewContext.close();

  // The owner signs the step off.
  await owner.goto(`/builds/${build.id}/install/steps/${step.id}`);
  const ownerSignOff = owner.getByRole('region', { name: 'Sign-off' });
  await ownerSignOff.getByRole('button', { name: 'Sign off this step' }).click();
  const confirm = owner.getByRole('dialog', { name: 'Sign off this step?' });
  await confirm.getByRole('button', { name: 'Sign off', exact: true }).click();
  await expect(ownerSignOff.getByText('Signed off by Marisol Okafor')).toBeVisible();
  await expect(owner.getByText('Signed off', { exact: true })).toBeVisible();
  // Locked: no more entry boxes for fitting readings.
  await expect(owner.getByLabel('Torque at #1')).toHaveCount(0);

  // The install log shows it done, with who signed off.
  await owner.getByRole('link', { name: 'Install', exact: true }).first().click();
  const jobCard = owner.getByRole('region', { name: 'Fit the rebuilt injectors' });
  await expect(jobCard.getByText('1 of 1 step signed off')).toBeVisible();
  await expect(jobCard.getByText(/Signed off by Marisol Okafor/)).toBeVisible();
  await ownerContext.close();
});

test('the owner renames a job and changes its notes', async ({ browser }) => {
  const context = await browser.newContext({ viewport: phone, hasTouch: true });
  const owner = await context.newPage();
  await signUpThroughPage(owner, 'Marisol Okafor', uniqueEmail('owner'));
  const { build } = await call<{ build: { id: string } }>(owner, 'post', '/api/builds', {
    name: 'Typo Truck',
    cylinders: 8,
    aspiration: 'naturally-aspirated',
    targetPowerHp: 450,
    targetPowerBasis: 'crank',
  });
  await call(owner, 'post', `/api/builds/${build.id}/jobs`, { title: 'Fit the injecters' });

  await owner.goto(`/builds/${build.id}/install`);
  const card = owner.getByRole('region', { name: 'Fit the injecters' });
  const edit = card.getByRole('button', { name: 'Edit the job “Fit the injecters”' });
  expect((await edit.boundingBox())!.height).toBeGreaterThanOrEqual(44);
  await edit.click();
  const dialog = owner.getByRole('dialog', { name: 'Edit the job' });
  await dialog.getByLabel('Job name').fill('Fit the injectors');
  await dialog.getByLabel('Notes').fill('Bench sheet in the blue folder');
  await dialog.getByRole('button', { name: 'Save the job' }).click();

  await expect(dialog).toBeHidden();
  const renamed = owner.getByRole('region', { name: 'Fit the injectors' });
  await expect(renamed.getByText('Bench sheet in the blue folder')).toBeVisible();
  await expect(owner.getByRole('region', { name: 'Fit the injecters' })).toHaveCount(0);
  await context.close();
});
