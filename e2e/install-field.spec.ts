/**
 * The install log as the crew, the owner and a shop use it from a phone (issue 20): ticked
 * cautions, readings at each stage by cylinder, a wrench past its calibration flagged, a
 * sign-off over open items that does not look like a clean one, and a shop's steps
 * numbered among the ones it sees.
 */
import { expect, test, type Page } from '@playwright/test';
import { signUpThroughPage, uniqueEmail } from './helpers';
import { joinByInvitation } from './mail';

const phone = { width: 390, height: 844 };

async function call<T>(page: Page, url: string, data: unknown): Promise<T> {
  const res = await page.request.post(url, {
    data,
    headers: { Origin: new URL(page.url()).origin },
  });
  expect(res.ok(), `POST ${url}: ${await res.text()}`).toBe(true);
  return (await res.json()) as T;
}

const daysAgo = (n: number) => new Date(Date.now() - n * 86_400_000).toISOString().slice(0, 10);

test('crew, owner and shop work one job from their phones', async ({ browser }) => {
  test.setTimeout(180_000);
  const crewEmail = uniqueEmail('crew');
  const shopEmail = uniqueEmail('shop');
  const crewContext = await browser.newContext({ viewport: phone, hasTouch: true });
  const crew = await crewContext.newPage();
  await signUpThroughPage(crew, 'Teddy Brandt', crewEmail);
  const shopContext = await browser.newContext({ viewport: phone, hasTouch: true });
  const shop = await shopContext.newPage();
  await signUpThroughPage(shop, 'Ridgeback Fuel Lab', shopEmail);
  const ownerContext = await browser.newContext({ viewport: phone, hasTouch: true });
  const owner = await ownerContext.newPage();
  await signUpThroughPage(owner, 'Marisol Okafor', uniqueEmail('owner'));

  const { build } = await call<{ build: { id: string } }>(owner, '/api/builds', {
    name: 'Gravel Hauler',
    cylinders: 8,
    aspiration: 'single-turbo',
    targetPowerHp: 700,
    targetPowerBasis: 'crank',
  });
  const api = `/api/builds/${build.id}`;
  await joinByInvitation(owner, crew, { buildId: build.id, email: crewEmail, role: 'crew' });
  const shopId = await joinByInvitation(owner, shop, {
    buildId: build.id,
    email: shopEmail,
    role: 'shop',
  });
  const { part } = await call<{ part: { id: string } }>(owner, `${api}/parts`, {
    category: 'fuel-injection',
    name: 'Injector set (8)',
    status: 'at-shop',
    shopUserId: shopId,
    sentOutOn: daysAgo(10),
  });
  const { job } = await call<{ job: { id: string } }>(owner, `${api}/jobs`, {
    title: 'Fit the rebuilt injectors',
  });
  await call(owner, `${api}/jobs/${job.id}/steps`, { title: 'Pull the valve covers' });
  const { step } = await call<{ step: { id: string } }>(owner, `${api}/jobs/${job.id}/steps`, {
    title: 'Seat the injectors',
    partIds: [part.id],
  });

  // ---- The crew adds a step; the cautions its words suggest are ticked, with the reason.
  await crew.goto(`/builds/${build.id}/install`);
  await crew.getByRole('button', { name: /Add step to Fit the rebuilt injectors/ }).tap();
  const form = crew.getByRole('dialog', { name: 'Add a step' });
  await form.getByLabel('Step name').fill('Pulling the cab for the head studs');
  const lifting = form.getByRole('checkbox', { name: /Truck or cab off the ground/ });
  const critical = form.getByRole('checkbox', { name: /Critical fasteners/ });
  const fuel = form.getByRole('checkbox', { name: /High-pressure fuel/ });
  await expect(lifting).toBeChecked();
  await expect(critical).toBeChecked();
  await expect(form.getByText('Suggested: Says “Pulling the cab”')).toBeVisible();
  await expect(fuel).not.toBeChecked();
  // The author knows this job opens the fuel lines too: ticked, it shows whatever the words.
  await fuel.check();
  await form.getByRole('button', { name: 'Add step' }).tap();
  await crew.getByRole('link', { name: /Pulling the cab for the head studs/ }).tap();
  const cautions = crew.getByRole('region', { name: 'Cautions' });
  for (const title of ['High-pressure fuel', 'Lifting and stands', 'Critical fasteners']) {
    await expect(cautions.getByText(title, { exact: true })).toBeVisible();
  }

  // ---- A staged spec named by cylinder, typed in the form.
  await crew.goto(`/builds/${build.id}/install/steps/${step.id}`);
  await crew.getByRole('button', { name: 'Add a fastener spec' }).tap();
  const spec = crew.getByRole('dialog', { name: 'Add a fastener spec' });
  await spec.getByLabel('Fastener').fill('Injector hold-down bolts');
  await spec.getByLabel('How many').fill('2');
  await spec.getByLabel('Target torque').fill('37');
  await spec.getByLabel('Tolerance', { exact: true }).selectOption('value');
  await spec.getByLabel(/Tolerance, ±/).fill('2');
  await spec.getByLabel('Threads').selectOption('oiled');
  await spec.getByLabel('Stages before the final torque').fill('10');
  await spec.getByRole('button', { name: 'Name them Cyl 1 to Cyl 2' }).tap();
  await spec
    .getByLabel('Where the spec comes from')
    .fill('Service manual, fuel system (test entry)');
  await spec.getByRole('button', { name: 'Add the spec' }).tap();
  await expect(spec).toBeHidden();

  const bolts = crew.getByRole('region', { name: /Injector hold-down bolts/ });
  // An old wrench, last calibrated well over a year ago.
  await bolts.getByRole('button', { name: 'Add a wrench' }).tap();
  await bolts.getByLabel('Wrench name or number').fill('Beam wrench, 0–150 lbf·ft');
  await bolts.getByLabel('Last calibrated').fill(daysAgo(420));
  await bolts.getByRole('button', { name: 'Add the wrench' }).tap();
  await expect(bolts.getByText(/Calibration was due .* \(12 months on this build\)/)).toBeVisible();

  // Stage 1 first: the card starts there, positions by cylinder.
  const stages = bolts.getByRole('group', { name: 'Reading now' });
  await expect(stages.getByRole('radio', { name: /Stage 1/ })).toBeChecked();
  await bolts.getByLabel('Stage 1 torque at Cyl 1').fill('10');
  await bolts.getByRole('button', { name: 'Record stage 1 Cyl 1' }).tap();
  await bolts.getByLabel('Stage 1 torque at Cyl 2').fill('10.5');
  await bolts.getByRole('button', { name: 'Record stage 1 Cyl 2' }).tap();
  const cyl1 = bolts.getByRole('listitem', { name: 'Position Cyl 1' });
  await expect(cyl1.getByText('Stage 1:')).toBeVisible();
  // Every position read at stage 1: the card moves on to the final torque.
  await expect(stages.getByRole('radio', { name: /Final/ })).toBeChecked();
  await bolts.getByLabel('Torque at Cyl 1', { exact: true }).fill('37');
  await bolts.getByRole('button', { name: 'Record Cyl 1', exact: true }).tap();
  await expect(cyl1.getByText('In spec', { exact: true })).toBeVisible();
  await expect(cyl1.getByText(/Stage 1: 10\slbf·ft ✓/)).toBeVisible();
  // Recorded, and flagged: the wrench was past its calibration.
  await expect(bolts.getByText(/Beam wrench, 0–150 lbf·ft was due for calibration/)).toBeVisible();
  await expect(cyl1.getByText(/Wrench was due for calibration/)).toBeVisible();
  await crewContext.close();

  // ---- The owner signs it off over the missing reading, saying why.
  await owner.goto(`/builds/${build.id}/install/steps/${step.id}`);
  const signOff = owner.getByRole('region', { name: 'Sign-off' });
  await expect(signOff.getByText(/Injector hold-down bolts: no reading for Cyl 2/)).toBeVisible();
  await signOff.getByRole('button', { name: /Sign off anyway/ }).tap();
  await signOff
    .getByLabel('Why sign off anyway?')
    .fill('Cyl 2 torqued with the shop’s wrench; sheet in photos');
  await signOff.getByRole('button', { name: /Sign off over 1 open item/ }).tap();
  await expect(owner.getByText('Signed off over open items').first()).toBeVisible();

  // The Install list tells it from a clean sign-off, the reason one tap away.
  await owner.goto(`/builds/${build.id}/install`);
  const card = owner.getByRole('region', { name: 'Fit the rebuilt injectors' });
  await expect(card.getByText('Signed off over open items').first()).toBeVisible();
  await expect(card.getByText('Signed off', { exact: true })).toHaveCount(0);
  const why = card.getByText('Why it was signed off anyway');
  await why.tap();
  await expect(
    card.getByText('“Cyl 2 torqued with the shop’s wrench; sheet in photos”'),
  ).toBeVisible();
  await ownerContext.close();

  // ---- The shop sees only the step using its parts, numbered among what it sees.
  await shop.goto(`/builds/${build.id}/install`);
  const shopCard = shop.getByRole('region', { name: 'Fit the rebuilt injectors' });
  await expect(shopCard.getByText('1 of 1 step using your parts signed off')).toBeVisible();
  await expect(shopCard.getByRole('link')).toHaveCount(1);
  await shopCard.getByRole('link', { name: /Step 1: Seat the injectors/ }).tap();
  await expect(
    shop.getByText('Fit the rebuilt injectors · step 1 of the one using your parts'),
  ).toBeVisible();
  await expect(shop.getByText(/step 2 of/)).toHaveCount(0);
  await shopContext.close();
});
