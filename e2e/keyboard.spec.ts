/**
 * The product from the keyboard alone: the parts ledger and the step page (on a build of their
 * own, since they change things), and every dialog in e2e/pages.ts (on the demo build, opened and
 * closed without saving). Focus moves in reading order and is always visible; a dialog takes
 * focus, keeps it while Tab goes round, closes on Escape and hands focus back to its button.
 */
import { expect, test, type BrowserContext, type Locator, type Page } from '@playwright/test';
import type { Role } from '@shared/permissions';
import { ensureDemo, noLinks, signedInState, type Demo } from './demo';
import { postJson, signUpThroughApi } from './helpers';
import { joinByInvitation } from './mail';
import { opener, pages, settle } from './pages';

// Long walks through every Tab stop of a page on a busy 2-core machine.
test.describe.configure({ timeout: 120_000 });

type Stop = {
  /** Label, text or tag: what a failure message can name it by. */
  name: string;
  top: number;
  bottom: number;
  inDialog: boolean;
  /** Row and cell of a table cell it sits in. */
  row: number | null;
  cell: number | null;
  /** It, or the control drawn for it (a `peer` sibling), has an outline of 2 px or more. */
  ringed: boolean;
};

/** The focused element, or null when focus is on the page itself (or left it). */
function focused(page: Page): Promise<Stop | null> {
  return page.evaluate(() => {
    const el = document.activeElement as HTMLElement | null;
    if (!el || el === document.body || el === document.documentElement) return null;
    const box = el.getBoundingClientRect();
    const ring = (e: Element | null) => {
      if (!e) return false;
      const s = getComputedStyle(e);
      return s.outlineStyle !== 'none' && parseFloat(s.outlineWidth) >= 2;
    };
    const invisible = parseFloat(getComputedStyle(el).opacity) === 0;
    const cell = el.closest('td, th') as HTMLTableCellElement | null;
    return {
      name:
        el.getAttribute('aria-label') ??
        (el.innerText || (el as HTMLInputElement).labels?.[0]?.innerText || el.tagName)
          .trim()
          .slice(0, 60),
      top: box.top + window.scrollY,
      bottom: box.bottom + window.scrollY,
      inDialog: el.closest('dialog[open]') !== null,
      row: cell ? (cell.parentElement as HTMLTableRowElement).rowIndex : null,
      cell: cell ? cell.cellIndex : null,
      // Focus inside a native control's own parts (a date field's calendar button) leaves the
      // control itself unmatched by :focus; the browser draws that ring.
      ringed: !el.matches(':focus') || (invisible ? ring(el.nextElementSibling) : ring(el)),
    };
  });
}

/** Presses Tab from the top of the page until focus comes back round, collecting each stop. */
async function tabThroughPage(page: Page, most = 400): Promise<Stop[]> {
  await page.locator('body').focus();
  const stops: Stop[] = [];
  for (let i = 0; i < most; i++) {
    await page.keyboard.press('Tab');
    const stop = await focused(page);
    if (!stop) {
      if (stops.length > 0) return stops;
      continue;
    }
    if (stops.length > 0 && stop.name === stops[0].name && stop.top === stops[0].top) {
      return stops;
    }
    stops.push(stop);
  }
  throw new Error(`Tab did not come round to the start within ${most} presses`);
}

/** Focus follows the page down: no stop lies wholly above the one before it, and each shows. */
function expectReadingOrder(stops: Stop[]) {
  expect(stops.length).toBeGreaterThan(5);
  for (let i = 1; i < stops.length; i++) {
    const [before, stop] = [stops[i - 1], stops[i]];
    expect(
      stop.bottom,
      `Tab went up the page from “${before.name}” to “${stop.name}”`,
    ).toBeGreaterThan(before.top);
  }
  const unringed = stops.filter((s) => !s.ringed).map((s) => s.name);
  expect(unringed, 'Tab stops with no visible focus outline').toEqual([]);
}

/**
 * Opens a dialog from the keyboard (Enter on its button), then checks it took focus, that Tab
 * (and Shift+Tab) go round inside it without reaching the page behind, and that Escape closes
 * it and gives focus back to the button.
 */
async function expectDialogKeyboard(page: Page, button: Locator, name: string | RegExp) {
  await button.focus();
  await page.keyboard.press('Enter');
  const dialog = page.getByRole('dialog', { name });
  await expect(dialog).toBeVisible();
  await expect
    .poll(async () => (await focused(page))?.inDialog, 'focus moves into the dialog')
    .toBe(true);
  const first = (await focused(page))!;
  // Tab visits every control of the dialog and comes round to the first, never reaching the
  // page behind (past the last control, focus may visit the browser's own controls).
  let round = false;
  for (let i = 0; i < 200 && !round; i++) {
    await page.keyboard.press('Tab');
    const stop = await focused(page);
    if (!stop) continue;
    expect(stop.inDialog, `Tab took focus out of the dialog, to “${stop.name}”`).toBe(true);
    expect(stop.ringed, `“${stop.name}” in the dialog shows no focus outline`).toBe(true);
    round = stop.name === first.name && stop.top === first.top;
  }
  expect(round, `Tab did not come round to “${first.name}”`).toBe(true);
  // Shift+Tab from the first control goes round to the end of the dialog, not behind it.
  let back: Stop | null = null;
  for (let i = 0; i < 3 && !back; i++) {
    await page.keyboard.press('Shift+Tab');
    back = await focused(page);
  }
  expect(back?.inDialog, `Shift+Tab from “${first.name}” left the dialog`).toBe(true);
  await page.keyboard.press('Escape');
  await expect(dialog).toBeHidden();
  await expect(button).toBeFocused();
}

type Account = Awaited<ReturnType<typeof signUpThroughApi>>;

test.describe('a build of its own', () => {
  let owner: Account;
  let crew: Account;
  let buildId: string;
  let stepId: string;

  // eslint-disable-next-line no-empty-pattern -- Playwright needs the fixtures argument.
  test.beforeAll(async ({}, testInfo) => {
    const baseURL = testInfo.project.use.baseURL!;
    owner = await signUpThroughApi(baseURL, 'Nell Ashdown', 'keys-owner');
    crew = await signUpThroughApi(baseURL, 'Ivo Pettersen', 'keys-crew');
    const post = <T>(url: string, data: unknown) => postJson<T>(owner.api, baseURL, url, data);
    ({
      build: { id: buildId },
    } = await post<{ build: { id: string } }>('/api/builds', {
      name: 'Tab Key Tanker',
      cylinders: 6,
      aspiration: 'single-turbo',
      targetPowerHp: 600,
      targetPowerBasis: 'crank',
    }));
    const api = `/api/builds/${buildId}`;
    await joinByInvitation(owner.api, crew.api, {
      buildId,
      email: crew.email,
      role: 'crew',
      origin: baseURL,
    });
    for (const part of [
      { category: 'fuel-injection', name: 'Injector set, matched', status: 'ordered' },
      { category: 'fuel-supply', name: 'Lift pump, 220 L/h', status: 'planned' },
      { category: 'turbocharger', name: 'Drop-in turbocharger', status: 'in-hand' },
    ]) {
      await post(`${api}/parts`, { ...part, unitPriceCents: 50_000 });
    }
    const { job } = await post<{ job: { id: string } }>(`${api}/jobs`, {
      title: 'Fit the injectors',
    });
    ({
      step: { id: stepId },
    } = await post<{ step: { id: string } }>(`${api}/jobs/${job.id}/steps`, {
      title: 'Torque the hold-downs',
      description: 'Each injector to its cylinder, from the bench sheet.',
    }));
    await post(`${api}/jobs/${job.id}/steps`, { title: 'Fit the lines and prime' });
    await post(`${api}/steps/${stepId}/checklist`, { label: 'New washer on each injector' });
    await post(`${api}/steps/${stepId}/fasteners`, {
      name: 'Injector hold-down bolts',
      count: 2,
      targetValue: 35,
      targetUnit: 'lbf-ft',
      toleranceType: 'percent',
      toleranceValue: 10,
      threadCondition: 'oiled',
      specSource: "Maker's service manual, fuel system section (test entry)",
    });
  });
  test.afterAll(async () => {
    await owner?.api.dispose();
    await crew?.api.dispose();
  });

  test('the owner works the parts ledger from the keyboard alone', async ({ browser }) => {
    const context = await browser.newContext({
      viewport: { width: 1280, height: 900 },
      storageState: owner.storageState,
    });
    const page = await context.newPage();
    await page.goto(`/builds/${buildId}/parts`);
    await settle(page);
    const ledger = page.getByRole('table', { name: /Parts ledger/ });
    const turbo = ledger.getByRole('rowheader', { name: 'Drop-in turbocharger' });
    await expect(turbo).toBeVisible();

    // The first Tab offers the skip link; it leads past the header into the page.
    await page.locator('body').focus();
    await page.keyboard.press('Tab');
    await expect(page.getByRole('link', { name: 'Skip to content' })).toBeFocused();
    await page.keyboard.press('Enter');
    await page.keyboard.press('Tab');
    await expect(
      page.getByRole('navigation', { name: 'Build sections' }).getByRole('link').first(),
    ).toBeFocused();

    // Every stop, top to bottom; in the table, row by row and left to right.
    const stops = await tabThroughPage(page);
    expectReadingOrder(stops);
    const cells = stops.filter((s) => s.row !== null);
    expect(cells.length).toBeGreaterThan(3);
    for (let i = 1; i < cells.length; i++) {
      const [a, z] = [cells[i - 1], cells[i]];
      expect(
        z.row! > a.row! || (z.row === a.row && z.cell! >= a.cell!),
        `in the table, Tab went back from “${a.name}” to “${z.name}”`,
      ).toBe(true);
    }

    // Search narrows the list as it is typed.
    await page.getByLabel('Search parts').focus();
    await page.keyboard.type('lift');
    await expect(page.getByText('Showing 1 of 3 parts')).toBeVisible();
    await expect(turbo).toHaveCount(0);
    await page.getByRole('button', { name: 'Clear the search' }).focus();
    await page.keyboard.press('Enter');
    await expect(turbo).toBeVisible();

    // A column sorts with Enter.
    const partHeader = ledger.getByRole('columnheader', { name: 'Part' });
    await partHeader.getByRole('button').focus();
    await page.keyboard.press('Enter');
    await expect(partHeader).toHaveAttribute('aria-sort', /ascending|descending/);

    // A status changes with the arrow keys, and is saved.
    const status = page.getByLabel('Status of Lift pump, 220 L/h');
    await status.focus();
    await page.keyboard.press('ArrowDown');
    await expect(status).toHaveValue('ordered');
    await expect(status).toBeEnabled();
    await page.reload();
    await expect(page.getByLabel('Status of Lift pump, 220 L/h')).toHaveValue('ordered');

    // A part added without the mouse. Enter in a field saves; a refused save puts focus on the
    // field to fix; once saved, focus is back on the button that opened the form.
    const add = page.getByRole('button', { name: 'Add part' }).first();
    await add.focus();
    await page.keyboard.press('Enter');
    const dialog = page.getByRole('dialog', { name: 'Add a part' });
    await expect(dialog).toBeVisible();
    const name = dialog.getByLabel('Name');
    await name.focus();
    await page.keyboard.type('Head studs, 12-point');
    await page.keyboard.press('Enter');
    await expect(dialog.getByText('Choose a category from the list')).toBeVisible();
    await expect(dialog.getByLabel('Category')).toBeFocused();
    await page.keyboard.press('ArrowDown');
    await expect(dialog.getByLabel('Category')).not.toHaveValue('');
    await name.focus();
    await page.keyboard.press('Enter');
    await expect(dialog).toBeHidden();
    await expect(ledger.getByRole('rowheader', { name: 'Head studs, 12-point' })).toBeVisible();
    await expect(add).toBeFocused();

    // The row's edit dialog.
    await expectDialogKeyboard(
      page,
      page.getByRole('button', { name: 'Edit Injector set, matched' }),
      'Edit Injector set, matched',
    );
    await context.close();
  });

  test('the crew works a step from the keyboard alone, at phone width', async ({ browser }) => {
    const context = await browser.newContext({
      viewport: { width: 390, height: 844 },
      storageState: crew.storageState,
    });
    const page = await context.newPage();
    await page.goto(`/builds/${buildId}/install/steps/${stepId}`);
    await settle(page);
    await expect(
      page.getByRole('heading', { level: 1, name: 'Torque the hold-downs' }),
    ).toBeVisible();

    expectReadingOrder(await tabThroughPage(page));

    // Start the step, tick the check with Space, record a torque with Enter.
    await page.getByRole('button', { name: 'Start this step' }).focus();
    await page.keyboard.press('Enter');
    await expect(page.getByRole('button', { name: 'Start this step' })).toHaveCount(0);
    await page.getByRole('checkbox', { name: /New washer on each injector/ }).focus();
    await page.keyboard.press('Space');
    await expect(page.getByText('Ticked by Ivo Pettersen')).toBeVisible();
    const bolts = page.getByRole('region', { name: /Injector hold-down bolts/ });
    await bolts.getByLabel('Torque at #1').focus();
    await page.keyboard.type('36');
    await page.keyboard.press('Enter');
    await expect(
      bolts.getByRole('listitem', { name: 'Position 1' }).getByText('In spec'),
    ).toBeVisible();
    // The next position takes the focus for the next reading (then the test moves on from
    // there: moving first could be undone by that focus arriving later).
    await expect(bolts.getByLabel('Torque at #2')).toBeFocused();

    // The step's dialogs: each takes focus, keeps it, closes on Escape and gives it back.
    await expectDialogKeyboard(
      page,
      page.getByRole('button', { name: 'Edit name and what to do' }),
      'Edit the step',
    );
    await expectDialogKeyboard(
      page,
      page.getByRole('button', { name: 'Add a fastener spec' }),
      'Add a fastener spec',
    );
    await expectDialogKeyboard(
      page,
      page.getByRole('button', { name: 'Edit the spec “Injector hold-down bolts”' }),
      'Edit the fastener spec',
    );
    // Nothing was saved by any of them.
    await expect(
      page.getByRole('heading', { level: 1, name: 'Torque the hold-downs' }),
    ).toBeVisible();
    await expect(page.getByRole('region', { name: /Injector hold-down bolts/ })).toHaveCount(1);
    await context.close();
  });
});

test.describe('every dialog of the demo build', () => {
  let demo: Demo;
  const contexts = new Map<Role, Promise<BrowserContext>>();

  test.beforeAll(async () => {
    demo = await ensureDemo();
  });
  test.afterAll(async () => {
    for (const context of contexts.values()) await (await context).close();
  });

  for (const check of pages.filter((c) => c.dialog)) {
    const role = check.roles[0] as Role;
    test(`the ${check.name} (${role}) takes and keeps focus, closes on Escape and gives it back`, async ({
      browser,
    }, testInfo) => {
      if (!contexts.has(role)) {
        contexts.set(
          role,
          signedInState(testInfo.project.use.baseURL!, role).then((storageState) =>
            browser.newContext({ viewport: { width: 1280, height: 900 }, storageState }),
          ),
        );
      }
      const page = await (await contexts.get(role)!).newPage();
      await page.goto(check.path({ ...demo, links: noLinks }));
      await settle(page);
      await expectDialogKeyboard(page, opener(page, check), check.dialog!.name);
      await page.close();
    });
  }
});
