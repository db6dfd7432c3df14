/**
 * Every page and dialog in e2e/pages.ts scanned by axe-core for WCAG 2.1 A and AA, as each role
 * that can open it, at desktop and phone width. Any serious or critical violation fails the
 * test with its rule, impact and the selectors of the elements at fault; every violation found
 * (of any impact) is attached to the test's report.
 *
 * One browser context per role and width, signed in once through the API; each test opens its
 * page in it (a dialog on the page the test before scanned is opened without loading it again).
 */
import AxeBuilder from '@axe-core/playwright';
import { expect, test, type BrowserContext, type Page } from '@playwright/test';
import type { Role } from '@shared/permissions';
import { ensureDemo, mailedLinks, noLinks, signedInState, type MailedLinks } from './demo';
import {
  members,
  openedDialog,
  opener,
  pages,
  settle,
  type PageCheck,
  type PageContext,
} from './pages';

// The tags are pinned: a newer axe-core with WCAG 2.2 rules must not change what passes here.
const wcagTags = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'];
const blockingImpacts = new Set(['serious', 'critical']);

const widths = [
  { width: 1280, height: 900 },
  { width: 390, height: 844 },
];

// The message lists what failed; a trace of every scan would cost more than it tells.
test.use({ trace: 'off' });

type Violations = Awaited<ReturnType<AxeBuilder['analyze']>>['violations'];

/** "color-contrast (serious): <help>" and under it the selector of each element at fault. */
function describeViolations(violations: Violations): string[] {
  return violations.map(
    (v) =>
      `${v.id} (${v.impact}): ${v.help}\n` +
      v.nodes
        .map((n) => `    ${n.target.map((t) => [t].flat().join(' >>> ')).join(' ')}`)
        .join('\n'),
  );
}

async function scan(page: Page, check: PageCheck, where: string) {
  // Only violations are read, so axe details one node of each passing rule rather than all.
  let axe = new AxeBuilder({ page }).withTags(wcagTags).options({ resultTypes: ['violations'] });
  if (check.dialog) axe = axe.include('dialog[open]');
  const { violations } = await axe.analyze();
  if (violations.length > 0) {
    await test.info().attach('axe violations', {
      body: JSON.stringify(violations, null, 2),
      contentType: 'application/json',
    });
  }
  const blocking = violations.filter((v) => blockingImpacts.has(v.impact ?? ''));
  expect(describeViolations(blocking), `serious or critical violations on ${where}`).toEqual([]);
}

const signedIn = new Map<Role, ReturnType<typeof signedInState>>();
let links: Promise<MailedLinks> | undefined;

for (const viewport of widths) {
  for (const who of ['guest', ...members] as const) {
    test.describe(`${who} at ${viewport.width} px`, () => {
      let context: BrowserContext;
      let page: Page;
      let ctx: PageContext;

      test.beforeAll(async ({ browser }, testInfo) => {
        // Seeding the demo and waiting for two mails can outlast one test's minute.
        test.setTimeout(180_000);
        const baseURL = testInfo.project.use.baseURL!;
        const demo = await ensureDemo();
        // Only signed-out pages need the mailed links; one pair serves both widths.
        if (who === 'guest') links ??= mailedLinks(baseURL);
        ctx = { ...demo, links: who === 'guest' ? await links! : noLinks };
        let storageState;
        if (who !== 'guest') {
          if (!signedIn.has(who)) signedIn.set(who, signedInState(baseURL, who));
          storageState = await signedIn.get(who);
        }
        context = await browser.newContext({ viewport, storageState });
        page = await context.newPage();
      });
      test.afterAll(async () => {
        await context?.close();
      });

      for (const check of pages.filter((c) => c.roles.includes(who))) {
        test(check.name, async () => {
          const path = check.path(ctx);
          const here = page.url().startsWith('http') ? new URL(page.url()) : undefined;
          if (!check.dialog || (here && here.pathname + here.search) !== path) {
            await page.goto(path);
          }
          await settle(page);
          let where = `${path} as ${who} at ${viewport.width} px`;
          if (check.dialog) {
            await opener(page, check).click();
            await openedDialog(page, check);
            where = `the ${check.name} on ${where}`;
          }
          await scan(page, check, where);
          if (check.dialog) {
            await page.keyboard.press('Escape');
            await expect(page.locator('dialog[open]')).toHaveCount(0);
          }
        });
      }
    });
  }
}
