/**
 * The garage with no signal (issue 17). The crew, at phone width, opens a step while online;
 * the network goes (the context offline, and the service worker's own requests blocked too,
 * which offline does not cover); readings, a checklist tick and a photo are recorded and kept on the
 * phone, a reload still shows the step and the entries waiting, and when the network returns
 * they arrive once, in order, judged by the server. A reading whose target the owner changed
 * meanwhile comes back refused, with the message, and stays for the crew to copy or discard.
 */
import { expect, test, type BrowserContext, type Page } from '@playwright/test';
import sharp from 'sharp';
import { password, signUpThroughApi, signUpThroughPage, uniqueEmail } from './helpers';
import { joinByInvitation } from './mail';

const phone = { width: 390, height: 844 };

test.use({ serviceWorkers: 'allow' });

async function call<T>(page: Page, method: 'post' | 'patch', url: string, data: unknown) {
  const res = await page.request[method](url, {
    data,
    headers: { Origin: new URL(page.url()).origin },
  });
  expect(res.ok(), `${method} ${url}: ${await res.text()}`).toBe(true);
  return (await res.json()) as T;
}

const spec = (name: string, count: number) => ({
  name,
  count,
  targetValue: 30,
  targetUnit: 'lbf-ft',
  toleranceType: 'percent',
  toleranceValue: 10,
  threadCondition: 'oiled',
  specSource: "Maker's service manual (test entry)",
});

/** The network gone: pages and the service worker's own fetches alike. */
async function goOffline(context: BrowserContext) {
  await context.setOffline(true);
  await context.route('**/*', (route) => route.abort('internetdisconnected'));
}

async function goOnline(context: BrowserContext) {
  await context.unrouteAll({ behavior: 'ignoreErrors' });
  await context.setOffline(false);
}

/** Whether the step's title is in the query cache saved on the device. */
function savedCacheHas(page: Page, text: string) {
  return page.evaluate(async (needle) => {
    const user = localStorage.getItem('headroom-user');
    if (!user) return false;
    const db = await new Promise<IDBDatabase>((resolve, reject) => {
      const open = indexedDB.open(`headroom-cache-${user}`);
      open.onsuccess = () => resolve(open.result);
      open.onerror = () => reject(open.error);
    });
    if (!db.objectStoreNames.contains('cache')) return false;
    const keys = await new Promise<unknown[]>((resolve) => {
      const req = db.transaction('cache').objectStore('cache').getAll();
      req.onsuccess = () => resolve(req.result);
    });
    db.close();
    return keys.some((v) => typeof v === 'string' && v.includes(needle));
  }, text);
}

test('the crew records readings and a photo without signal; they arrive once, in order', async ({
  browser,
}) => {
  test.setTimeout(180_000);
  const crewEmail = uniqueEmail('crew');
  const ownerContext = await browser.newContext({ viewport: phone });
  const owner = await ownerContext.newPage();
  await signUpThroughPage(owner, 'Odile Pemberton', uniqueEmail('owner'));
  const crewContext = await browser.newContext({ viewport: phone, hasTouch: true });
  const crew = await crewContext.newPage();
  await signUpThroughPage(crew, 'Teodor Brandt', crewEmail);

  const { build } = await call<{ build: { id: string } }>(owner, 'post', '/api/builds', {
    name: 'Back Forty Hauler',
    cylinders: 6,
    aspiration: 'single-turbo',
    targetPowerHp: 650,
    targetPowerBasis: 'crank',
  });
  const api = `/api/builds/${build.id}`;
  await joinByInvitation(owner, crew, { buildId: build.id, email: crewEmail, role: 'crew' });
  const { job } = await call<{ job: { id: string } }>(owner, 'post', `${api}/jobs`, {
    title: 'Valve train',
  });
  const { step } = await call<{ step: { id: string } }>(
    owner,
    'post',
    `${api}/jobs/${job.id}/steps`,
    {
      title: 'Fit the rocker arms',
    },
  );
  const rockers = (
    await call<{ fastener: { id: string } }>(
      owner,
      'post',
      `${api}/steps/${step.id}/fasteners`,
      spec('Rocker arm bolts', 2),
    )
  ).fastener;
  const covers = (
    await call<{ fastener: { id: string } }>(
      owner,
      'post',
      `${api}/steps/${step.id}/fasteners`,
      spec('Valve cover bolts', 1),
    )
  ).fastener;

  await call(owner, 'post', `${api}/steps/${step.id}/checklist`, {
    label: 'Pushrods seated in their cups',
  });

  // ---- Online: the crew opens the step; the app shell and the step are kept on the phone.
  const stepUrl = `/builds/${build.id}/install/steps/${step.id}`;
  await crew.goto(stepUrl);
  await expect(crew.getByRole('heading', { level: 1, name: 'Fit the rocker arms' })).toBeVisible();
  // Online with nothing waiting, the line has nothing to say.
  await expect(crew.getByTestId('offline-status')).toHaveText('');
  await expect(crew.getByText('Online', { exact: true })).toHaveCount(0);
  await crew.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await expect.poll(() => crew.evaluate(() => !!navigator.serviceWorker.controller)).toBe(true);
  await expect.poll(() => savedCacheHas(crew, 'Fit the rocker arms')).toBe(true);

  // ---- No signal.
  await goOffline(crewContext);
  await expect(crew.getByTestId('offline-status')).toContainText('Offline');
  // A write the phone does not keep says at once that it needs signal, instead of spinning.
  await crew.getByRole('button', { name: 'Start this step' }).click();
  await expect(
    crew.getByText('Could not reach Headroom. Check your connection and try again.'),
  ).toBeVisible();
  await expect(crew.getByRole('button', { name: 'Start this step' })).toBeEnabled();
  // So does signing out (the server ends the session): the status line says why.
  await crew.getByRole('button', { name: 'Sign out' }).click();
  await expect(crew.getByTestId('offline-status')).toContainText('signing out needs signal');
  await expect(crew.getByTestId('signed-in-user')).toHaveText('Teodor Brandt');
  const rockerCard = crew.getByRole('region', { name: /Rocker arm bolts/ });
  await rockerCard.getByLabel('Torque at #1').fill('31');
  await rockerCard.getByRole('button', { name: 'Record #1' }).click();
  await expect(
    rockerCard.getByText('31 lbf·ft kept on this phone: waiting to send.'),
  ).toBeVisible();
  // The field is cleared, so a second tap does not keep the same reading twice.
  await expect(rockerCard.getByLabel('Torque at #1')).toHaveValue('');
  await rockerCard.getByLabel('Torque at #2').fill('36');
  await rockerCard.getByRole('button', { name: 'Record #2' }).click();
  const coverCard = crew.getByRole('region', { name: /Valve cover bolts/ });
  await coverCard.getByLabel('Torque at #1').fill('30');
  await coverCard.getByRole('button', { name: 'Record #1' }).click();

  await crew.getByRole('checkbox', { name: /Pushrods seated in their cups/ }).click();
  await expect(crew.getByRole('checkbox', { name: /Pushrods seated/ })).toBeChecked();
  // Sign-off still lists them as open (the server has not had them yet), and says why.
  await expect(crew.getByTestId('sign-off-waiting')).toHaveText(
    'Entries waiting on this phone count here once they are sent.',
  );

  const photo = await sharp({
    create: { width: 2400, height: 1800, channels: 3, background: { r: 70, g: 90, b: 110 } },
  })
    .jpeg()
    .toBuffer();
  await crew.getByLabel('Add photos').setInputFiles({
    name: 'rockers.jpg',
    mimeType: 'image/jpeg',
    buffer: photo,
  });
  await crew.getByLabel('Caption for rockers.jpg').fill('Rockers in, before the covers');
  await crew.getByRole('button', { name: 'Upload 1 photo' }).click();
  await expect(crew.getByText('Photo kept on this phone: waiting to send.')).toBeVisible();

  // Signing out with entries waiting asks first (and says they stay for this account only).
  await crew.getByRole('button', { name: 'Sign out' }).click();
  const ask = crew.getByRole('dialog', { name: 'Sign out with entries waiting?' });
  await expect(ask).toContainText('5 entries have not reached Headroom yet');
  await expect(ask).toContainText('never with another');
  await ask.getByRole('button', { name: 'Cancel' }).click();
  await expect(ask).toHaveCount(0);

  // ---- A reload without signal: the step opens from the phone, the entries still wait.
  await crew.reload();
  await expect(crew.getByRole('heading', { level: 1, name: 'Fit the rocker arms' })).toBeVisible();
  const waiting = crew.getByRole('region', { name: 'On this phone' });
  await expect(waiting.getByTestId('waiting-entry')).toHaveText([
    /Rocker arm bolts #1: 31 lbf·ft · waiting to send/,
    /Rocker arm bolts #2: 36 lbf·ft · waiting to send/,
    /Valve cover bolts #1: 30 lbf·ft · waiting to send/,
    /Ticked: Pushrods seated in their cups · waiting to send/,
    /Photo rockers\.jpg \(“Rockers in, before the covers”\) · waiting to send/,
  ]);
  await expect(crew.getByTestId('offline-status')).toContainText('5 entries waiting to send');
  await expect(crew.getByRole('checkbox', { name: /Pushrods seated/ })).toBeChecked();

  // Meanwhile the owner changes the valve cover bolts' target.
  await call(owner, 'patch', `${api}/fasteners/${covers.id}`, { targetValue: 25 });

  // ---- The network returns: sent in order, once, judged by the server.
  await goOnline(crewContext);
  await expect(waiting.getByTestId('waiting-entry')).toHaveCount(0, { timeout: 30_000 });
  const first = rockerCard.getByRole('listitem', { name: 'Position 1' });
  const second = rockerCard.getByRole('listitem', { name: 'Position 2' });
  await expect(first.getByText('In spec')).toBeVisible();
  await expect(second.getByText('Over spec')).toBeVisible();
  await expect(crew.getByTestId('offline-status')).toContainText(/Online.*last sent/);
  const gallery = crew.getByRole('list', { name: 'Photos of this step' });
  await expect(gallery.getByRole('img', { name: 'Rockers in, before the covers' })).toBeVisible();

  const { readings } = await (
    await crew.request.get(`${api}/fasteners/${rockers.id}/readings`)
  ).json();
  expect(readings).toHaveLength(2);
  const byPosition = (p: number) => readings.find((r: { position: number }) => r.position === p);
  expect(byPosition(1).verdict).toBe('in-spec');
  expect(byPosition(2).verdict).toBe('over');
  expect(Date.parse(byPosition(1).recordedAt)).toBeLessThan(Date.parse(byPosition(2).recordedAt));
  // Each keeps the time it was taken on the phone, before it arrived.
  expect(Date.parse(byPosition(1).takenAt)).toBeLessThan(Date.parse(byPosition(1).recordedAt));
  const { step: after } = await (await crew.request.get(`${api}/steps/${step.id}`)).json();
  expect(after.checklist[0]).toMatchObject({ done: true, doneBy: { name: 'Teodor Brandt' } });
  const photos = (await (await crew.request.get(`${api}/steps/${step.id}/photos`)).json()).photos;
  expect(photos).toHaveLength(1);
  // Resized on the phone to the web size before it was kept.
  expect(photos[0].original.width).toBeLessThanOrEqual(1600);

  // ---- The conflict: refused with the server's message, kept to copy or discard.
  await expect(
    waiting.getByText(/Not saved: The target of Valve cover bolts changed/),
  ).toBeVisible();
  const covered = await (await crew.request.get(`${api}/fasteners/${covers.id}/readings`)).json();
  expect(covered.readings).toHaveLength(0);
  await expect(crew.getByTestId('offline-status')).toContainText('1 entry refused');
  await waiting.getByRole('button', { name: 'Discard' }).click();
  await expect(waiting).toHaveCount(0);

  await crewContext.close();
  await ownerContext.close();
});

/** Signs in on the page as it stands (the sign-in form the app sent them to). */
async function signInHere(page: Page, email: string) {
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

test('entries waiting when the session ends stay, are never sent as another user, and go once the same user is back', async ({
  browser,
  baseURL,
}) => {
  test.setTimeout(180_000);
  const crewEmail = uniqueEmail('crew');
  const ownerContext = await browser.newContext({ viewport: phone });
  const owner = await ownerContext.newPage();
  await signUpThroughPage(owner, 'Odile Pemberton', uniqueEmail('owner'));
  const { build } = await call<{ build: { id: string } }>(owner, 'post', '/api/builds', {
    name: 'Shared Bench Hauler',
    cylinders: 6,
    aspiration: 'single-turbo',
    targetPowerHp: 600,
    targetPowerBasis: 'crank',
  });
  const api = `/api/builds/${build.id}`;
  const { job } = await call<{ job: { id: string } }>(owner, 'post', `${api}/jobs`, {
    title: 'Top end',
  });
  const { step } = await call<{ step: { id: string } }>(
    owner,
    'post',
    `${api}/jobs/${job.id}/steps`,
    { title: 'Torque the intake manifold' },
  );
  const { fastener } = await call<{ fastener: { id: string } }>(
    owner,
    'post',
    `${api}/steps/${step.id}/fasteners`,
    spec('Intake manifold bolts', 2),
  );
  await call(owner, 'post', `${api}/steps/${step.id}/checklist`, { label: 'Gasket faces clean' });
  const readings = async () =>
    (await (await owner.request.get(`${api}/fasteners/${fastener.id}/readings`)).json())
      .readings as { position: number; recordedBy: { name: string } | null }[];

  // Both are crew on the build: the server would take the entries from either of them.
  const crewContext = await browser.newContext({ viewport: phone, hasTouch: true });
  const crew = await crewContext.newPage();
  await signUpThroughPage(crew, 'Teodor Brandt', crewEmail);
  await joinByInvitation(owner, crew, { buildId: build.id, email: crewEmail, role: 'crew' });
  const other = await signUpThroughApi(baseURL!, 'Marisol Quint', 'other');
  await joinByInvitation(owner, other.api, { buildId: build.id, email: other.email, role: 'crew' });
  await other.api.dispose();

  const stepUrl = `/builds/${build.id}/install/steps/${step.id}`;
  await crew.goto(stepUrl);
  await expect(
    crew.getByRole('heading', { level: 1, name: 'Torque the intake manifold' }),
  ).toBeVisible();
  await crew.evaluate(async () => {
    await navigator.serviceWorker.ready;
  });
  await expect.poll(() => crew.evaluate(() => !!navigator.serviceWorker.controller)).toBe(true);
  await expect.poll(() => savedCacheHas(crew, 'Torque the intake manifold')).toBe(true);

  // ---- Without signal: a reading and a tick wait on the phone.
  await goOffline(crewContext);
  const card = crew.getByRole('region', { name: /Intake manifold bolts/ });
  await card.getByLabel('Torque at #1').fill('31');
  await card.getByRole('button', { name: 'Record #1' }).click();
  await expect(card.getByText('31 lbf·ft kept on this phone: waiting to send.')).toBeVisible();
  // A click, not check(): the box is ticked once the tick is kept on the phone, a moment later.
  await crew.getByRole('checkbox', { name: /Gasket faces clean/ }).click();
  await expect(crew.getByRole('checkbox', { name: /Gasket faces clean/ })).toBeChecked();
  await expect(crew.getByTestId('offline-status')).toContainText('2 entries waiting to send');

  // ---- The session ends while they wait (it expired: the cookie is gone), and the signal
  // comes back: the queue meets 401 and keeps them.
  await crewContext.clearCookies();
  await goOnline(crewContext);
  await crew.reload();
  await expect(crew.getByRole('button', { name: 'Sign in' })).toBeVisible();
  expect(await readings()).toHaveLength(0);

  // ---- Someone else signs in on the same phone: the entries are neither shown nor sent.
  await signInHere(crew, other.email);
  await expect(crew.getByTestId('signed-in-user')).toHaveText('Marisol Quint');
  await crew.goto(stepUrl);
  await expect(
    crew.getByRole('heading', { level: 1, name: 'Torque the intake manifold' }),
  ).toBeVisible();
  await expect(crew.getByTestId('offline-status')).toHaveText('');
  await expect(crew.getByRole('region', { name: 'On this phone' })).toHaveCount(0);
  await expect(crew.getByRole('checkbox', { name: /Gasket faces clean/ })).not.toBeChecked();
  await expect(card.getByText('kept on this phone')).toHaveCount(0);
  expect(await readings()).toHaveLength(0);
  // Nothing waits, so she signs out without being asked.
  await crew.getByRole('button', { name: 'Sign out' }).click();
  await expect(crew.getByText('You have signed out')).toBeVisible();
  expect(await readings()).toHaveLength(0);

  // A reload after she left opens nobody's saved data.
  await crew.reload();
  await expect(crew.getByRole('button', { name: 'Sign in' })).toBeVisible();
  await expect(crew.getByTestId('signed-in-user')).toHaveCount(0);

  // ---- The crew signs in again on the same phone: the entries go, as him, once.
  await signInHere(crew, crewEmail);
  await expect(crew.getByTestId('signed-in-user')).toHaveText('Teodor Brandt');
  await expect.poll(async () => (await readings()).length).toBe(1);
  const [sent] = await readings();
  expect(sent).toMatchObject({ position: 1, recordedBy: { name: 'Teodor Brandt' } });
  // The tick was queued after the reading, so it may still be on its way.
  const firstCheck = async () =>
    (await (await owner.request.get(`${api}/steps/${step.id}`)).json()).step.checklist[0];
  await expect.poll(firstCheck).toMatchObject({ done: true, doneBy: { name: 'Teodor Brandt' } });
  await expect(crew.getByTestId('offline-status')).toContainText(/Online.*last sent/);

  // ---- Signing out on purpose with an entry waiting: recorded without signal, and the
  // session gone again by the time the signal returns (so the entry cannot be sent). Asked
  // first, then kept; the next person on the phone is not shown it; the crew's next sign-in
  // sends it.
  await crew.goto(stepUrl);
  await expect(card.getByLabel('Torque at #2')).toBeVisible();
  await goOffline(crewContext);
  await card.getByLabel('Torque at #2').fill('29');
  await card.getByRole('button', { name: 'Record #2' }).click();
  await expect(card.getByText('29 lbf·ft kept on this phone: waiting to send.')).toBeVisible();
  await crewContext.clearCookies();
  await goOnline(crewContext);
  await expect(crew.getByTestId('offline-status')).toHaveText(/^Online · 1 entry waiting to send/);
  await crew.getByRole('button', { name: 'Sign out' }).click();
  const ask = crew.getByRole('dialog', { name: 'Sign out with entries waiting?' });
  await ask.getByRole('button', { name: 'Sign out anyway' }).click();
  await expect(crew.getByText('You have signed out')).toBeVisible();
  // Opened again, even without signal (nothing to ask the server), it shows nobody's data.
  await goOffline(crewContext);
  await crew.goto(stepUrl);
  await expect(
    crew.getByRole('heading', { name: 'No signal: sign in when you are back online' }),
  ).toBeVisible();
  await expect(crew.getByTestId('signed-in-user')).toHaveCount(0);
  await expect(crew.getByText('Torque the intake manifold')).toHaveCount(0);
  await goOnline(crewContext);
  await crew.reload();
  await expect(crew.getByRole('button', { name: 'Sign in' })).toBeVisible();
  await signInHere(crew, other.email);
  await expect(crew.getByTestId('signed-in-user')).toHaveText('Marisol Quint');
  await crew.goto(stepUrl);
  await expect(
    crew.getByRole('heading', { level: 1, name: 'Torque the intake manifold' }),
  ).toBeVisible();
  await expect(crew.getByTestId('offline-status')).toHaveText('');
  await expect(card.getByText('kept on this phone')).toHaveCount(0);
  expect(await readings()).toHaveLength(1);
  await crew.getByRole('button', { name: 'Sign out' }).click();
  await expect(crew.getByText('You have signed out')).toBeVisible();
  await signInHere(crew, crewEmail);
  await expect(crew.getByTestId('signed-in-user')).toHaveText('Teodor Brandt');
  await expect.poll(async () => (await readings()).length).toBe(2);
  expect((await readings()).map((r) => r.recordedBy?.name)).toEqual([
    'Teodor Brandt',
    'Teodor Brandt',
  ]);

  await crewContext.close();
  await ownerContext.close();
});
