import { expect, test, type Page } from '@playwright/test';
import sharp from 'sharp';
import { password, signInThroughPage, signUpThroughPage, uniqueEmail } from './helpers';
import { joinByInvitation, linkTo, waitForMail } from './mail';

const phone = { width: 390, height: 844 };
const desktop = { width: 1280, height: 900 };

/** A JSON call as the signed-in user of `page`, with the Origin the server asks for. */
async function call<T>(page: Page, method: 'post', url: string, data: unknown): Promise<T> {
  const response = await page.request[method](url, {
    data,
    headers: { Origin: new URL(page.url()).origin },
  });
  expect(response.ok(), `${method.toUpperCase()} ${url}: ${await response.text()}`).toBe(true);
  return (await response.json()) as T;
}

/** A photo of a paper sheet, as a phone takes it: a drawing, nothing real. */
function sheetPhoto() {
  return sharp({ create: { width: 900, height: 1200, channels: 3, background: '#f1ede2' } })
    .composite([
      {
        input: Buffer.from(
          '<svg xmlns="http://www.w3.org/2000/svg" width="900" height="1200">' +
            Array.from(
              { length: 6 },
              (_, i) => `<rect x="80" y="${200 + i * 120}" width="740" height="6" fill="#30343a"/>`,
            ).join('') +
            '</svg>',
        ),
      },
    ])
    .jpeg()
    .toBuffer();
}

/** Pastes text into the focused cell as a spreadsheet's copy would arrive. */
async function paste(page: Page, cell: string, text: string) {
  const target = page.getByRole('textbox', { name: cell, exact: true });
  await target.focus();
  await target.evaluate((el, data) => {
    const clipboard = new DataTransfer();
    clipboard.setData('text/plain', data);
    el.dispatchEvent(
      new ClipboardEvent('paste', { clipboardData: clipboard, bubbles: true, cancelable: true }),
    );
  }, text);
}

// As received: injector 3 returns about twice the others' leak-off and is short at full load.
const asReceived = {
  full: ['92.2', '91.9', '89.4', '92.3', '91.8', '92.1'],
  // Part load, idle, pilot, return flow: a block copied from the shop's spreadsheet.
  block: [
    ['38.2', '6.1', '1.6', '14.2'],
    ['38.0', '6.2', '1.5', '15.1'],
    ['37.6', '5.9', '1.4', '31.8'],
    ['38.3', '6.0', '1.6', '13.9'],
    ['38.1', '6.2', '1.6', '14.6'],
    ['38.2', '6.0', '1.5', '15.4'],
  ],
};
// After rebuild: matched within about half a percent at full load.
const afterRebuild = [
  ['Full load', 'Part load', 'Idle', 'Pilot', 'Return flow'],
  ['249.1', '104.2', '7.1', '1.8', '12.6'],
  ['250.3', '104.8', '7.0', '1.9', '12.9'],
  ['248.7', '103.9', '7.2', '1.8', '13.1'],
  ['251.0', '105.1', '6.9', '1.8', '12.4'],
  ['249.8', '104.5', '7.1', '1.9', '12.8'],
  ['250.6', '104.0', '7.0', '1.7', '13.0'],
];

test('the shop enters its injector sheets at phone width and at desktop; the owner compares them and hears of it', async ({
  browser,
  request,
}) => {
  // Three browsers, an upload and the mail worker: longer than the default minute.
  test.setTimeout(150_000);

  const shopEmail = uniqueEmail('shop');
  const ownerEmail = uniqueEmail('owner');
  const shopPhoneContext = await browser.newContext({ viewport: phone, hasTouch: true });
  const shopPhone = await shopPhoneContext.newPage();
  await signUpThroughPage(shopPhone, 'Basalt Bench Works', shopEmail);

  const ownerContext = await browser.newContext({ viewport: desktop });
  const owner = await ownerContext.newPage();
  await signUpThroughPage(owner, 'Imke Varga', ownerEmail);

  // The owner's set-up, through the API: a six-cylinder build, the shop, the injectors sent to it.
  const { build } = await call<{ build: { id: string } }>(owner, 'post', '/api/builds', {
    name: 'Quarry Run',
    cylinders: 6,
    aspiration: 'single-turbo',
    targetPowerHp: 600,
    targetPowerBasis: 'wheel',
  });
  const api = `/api/builds/${build.id}`;
  const shopUserId = await joinByInvitation(owner, shopPhone, {
    buildId: build.id,
    email: shopEmail,
    role: 'shop',
  });
  await call(owner, 'post', `${api}/parts`, {
    category: 'fuel-injection',
    name: 'Injector set, new nozzles (6)',
    status: 'at-shop',
    shopUserId,
    labourCents: 72_000,
  });
  await call(owner, 'post', `${api}/parts`, { category: 'exhaust', name: 'Down-pipe' });

  // ---- the shop, on its phone: the "as received" sheet, typed and pasted
  await shopPhone.goto(`/builds/${build.id}`);
  await shopPhone
    .getByRole('navigation', { name: 'Build sections' })
    .getByRole('link', { name: 'Bench' })
    .click();
  await expect(shopPhone.getByRole('heading', { level: 1, name: 'Bench results' })).toBeVisible();
  await expect(shopPhone.getByText('Down-pipe')).toHaveCount(0);
  await shopPhone.getByRole('link', { name: /Add a sheet/ }).click();
  await expect(
    shopPhone.getByRole('heading', { level: 1, name: 'Add a bench sheet' }),
  ).toBeVisible();
  await expect(shopPhone.getByLabel('Injector set')).toHaveValue(/.+/);
  await shopPhone.getByLabel('Occasion').fill('As received');
  await shopPhone.getByLabel('Tested by').fill('Bench 1');

  // Values read off the bench go down the column: Enter moves to the next injector.
  await shopPhone.getByRole('textbox', { name: 'Injector 1, Full load', exact: true }).click();
  for (const value of asReceived.full) {
    await shopPhone.keyboard.type(value);
    await shopPhone.keyboard.press('Enter');
  }
  // At the foot of a column Enter goes to the top of the next one.
  await expect(
    shopPhone.getByRole('textbox', { name: 'Injector 1, Part load', exact: true }),
  ).toBeFocused();
  await paste(
    shopPhone,
    'Injector 1, Part load',
    asReceived.block.map((row) => row.join('\t')).join('\r\n'),
  );
  await expect(shopPhone.getByText(/Pasted 6 rows × 4 columns/)).toBeVisible();
  await expect(
    shopPhone.getByRole('textbox', { name: 'Injector 3, Return flow', exact: true }),
  ).toHaveValue('31.8');
  // The page judges the values as they are typed.
  await expect(shopPhone.getByTestId('sheet-preview')).toContainText('Injector 3 is worn');

  // A slip is named by its cell, and nothing is sent until it is fixed.
  const slip = shopPhone.getByRole('textbox', { name: 'Injector 5, Idle', exact: true });
  await slip.fill('6,2x');
  await expect(shopPhone.getByText(/Injector 5, Idle: "6,2x" is not a number/)).toBeVisible();
  await slip.fill('6.2');

  await shopPhone.getByRole('button', { name: 'Save the sheet' }).click();
  await expect(shopPhone.getByRole('heading', { level: 1, name: 'As received' })).toBeVisible();
  const findings = shopPhone.getByRole('list', { name: 'Findings' });
  await expect(findings).toContainText('Injector 3 is worn (return flow 2.2 × the others');
  await expect(findings).toContainText('Injector 3 is low at full load');
  const table = shopPhone.getByRole('table', { name: /As received: each injector/ });
  await expect(table.getByRole('row', { name: /^3 / })).toContainText('Worn');

  // The shop's own sheet, photographed, attached with a progress bar.
  await shopPhone.getByLabel('Attach the original sheet').setInputFiles({
    name: 'flow-test-as-received.jpg',
    mimeType: 'image/jpeg',
    buffer: await sheetPhoto(),
  });
  await expect(shopPhone.getByText('Attached “flow-test-as-received.jpg”.')).toBeVisible();
  await expect(
    shopPhone.getByRole('img', { name: /The original sheet “As received”/ }),
  ).toBeVisible();
  await expect(
    shopPhone.getByRole('link', { name: 'Download the full-size original' }),
  ).toBeVisible();
  // Charts come with the page, loaded after the words.
  await expect(
    shopPhone.getByRole('img', { name: /Full load, one bar per injector/ }),
  ).toBeVisible();
  await shopPhoneContext.close();

  // ---- the shop at its desk: "after rebuild", the whole block pasted from a spreadsheet
  const shopDeskContext = await browser.newContext({ viewport: desktop });
  const shopDesk = await shopDeskContext.newPage();
  await signInThroughPage(shopDesk, shopEmail, password);
  await shopDesk.goto(`/builds/${build.id}/bench`);
  await shopDesk.getByRole('link', { name: /Add a sheet/ }).click();
  await shopDesk.getByLabel('Occasion').fill('After rebuild');

  // A CSV with a bad cell is refused whole, naming the cell.
  await shopDesk.getByLabel('Fill from a CSV file').setInputFiles({
    name: 'after.csv',
    mimeType: 'text/csv',
    buffer: Buffer.from(
      'Position,Full load,Part load,Idle,Pilot,Return flow\n1,249.1,104.2,7.1,1.8,12.6\n2,25O.3,104.8,7.0,1.9,12.9\n',
    ),
  });
  await expect(shopDesk.getByText(/Row 3, Full load: "25O.3" is not a number/)).toBeVisible();
  await expect(
    shopDesk.getByRole('textbox', { name: 'Injector 1, Full load', exact: true }),
  ).toHaveValue('');

  await paste(
    shopDesk,
    'Injector 1, Full load',
    afterRebuild.map((row) => row.join('\t')).join('\n'),
  );
  await expect(shopDesk.getByText(/the heading row was left out/)).toBeVisible();
  await expect(shopDesk.getByTestId('sheet-preview')).toContainText(/Matched within ±0\.\d %/);
  await shopDesk.getByRole('button', { name: 'Save the sheet' }).click();
  await expect(shopDesk.getByRole('heading', { level: 1, name: 'After rebuild' })).toBeVisible();
  await expect(shopDesk.getByText('Within tolerance').first()).toBeVisible();
  await shopDeskContext.close();

  // ---- the owner hears of it, opens the sheet from the mail and compares before and after
  const mail = await waitForMail(
    request,
    ownerEmail,
    /Bench sheet “As received” added by Basalt Bench Works/,
  );
  expect(mail.text).toContain('Injector 3 is worn');
  expect(mail.text).not.toContain('$');
  await owner.goto(linkTo(mail, `/builds/${build.id}/bench/sheets/`));
  await expect(owner.getByRole('heading', { level: 1, name: 'As received' })).toBeVisible();
  await expect(owner.getByRole('img', { name: /The original sheet/ })).toBeVisible();
  await owner.getByRole('link', { name: 'Compare' }).click();
  await expect(
    owner.getByRole('heading', { level: 1, name: 'Compare bench sheets' }),
  ).toBeVisible();
  await expect(owner.getByLabel('Before')).toHaveValue(/.+/);
  await expect(owner.getByTestId('recovered-hp')).toContainText('won back');
  const fullLoad = owner.getByRole('table', { name: 'Full load: each injector before and after' });
  await expect(fullLoad.getByRole('row', { name: /^3 / })).toContainText('248.7');
  await owner.getByText('Show the working').first().click();
  await expect(owner.getByText(/Recovered = /)).toBeVisible();
  await ownerContext.close();
});
