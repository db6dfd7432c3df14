/**
 * Every page and dialog of the product, with who can open it, for the specs that visit them
 * all: the accessibility scan (a11y.spec.ts) scans each one as each role at both widths, and the
 * keyboard checks (keyboard.spec.ts) open each dialog from the keyboard.
 *
 * A new page or dialog is one line in `pages`. The build is the demo (e2e/demo.ts): a page
 * of a new module shows realistic content once the demo seed gives it some.
 */
import { expect, type Locator, type Page } from '@playwright/test';
import type { Role } from '@shared/permissions';
import { paths } from '@/config/paths';
import type { Demo, MailedLinks } from './demo';

/** A member of the demo build in that role, or a signed-out visitor. */
export type Who = Role | 'guest';
export type PageContext = Demo & { links: MailedLinks };

export type PageCheck = {
  /** The test's name; unique. */
  name: string;
  /** The page to open. */
  path: (c: PageContext) => string;
  /** Everyone who can open it. */
  roles: readonly Who[];
  /** A dialog on the page: the button that opens it (the first match) and the dialog's name. */
  dialog?: { button: string | RegExp; name: string | RegExp };
};

export const members: readonly Role[] = ['owner', 'crew', 'shop', 'viewer'];
const guest: readonly Who[] = ['guest'];
const owner: readonly Role[] = ['owner'];
/** Who writes the install log (install:write). */
const hands: readonly Role[] = ['owner', 'crew'];

const b = paths.builds;
const overview = (c: PageContext) => b.overview.getHref(c.buildId);
const parts = (c: PageContext) => b.parts.getHref(c.buildId);
const install = (c: PageContext) => b.install.getHref(c.buildId);
const step = (c: PageContext) => b.step.getHref(c.buildId, c.stepId);
const photos = (c: PageContext) => b.photos.getHref(c.buildId);
const timeline = (c: PageContext) => b.timeline.getHref(c.buildId);

// prettier-ignore
export const pages: readonly PageCheck[] = [
  { name: 'landing and its calculator', path: () => paths.home.getHref(), roles: guest },
  { name: 'sign-in', path: () => paths.auth.signIn.getHref(), roles: guest },
  { name: 'sign-up', path: () => paths.auth.signUp.getHref(), roles: guest },
  { name: 'forgot password', path: () => paths.auth.forgotPassword.getHref(), roles: guest },
  { name: 'reset password', path: (c) => c.links.reset, roles: guest },
  { name: 'invitation', path: (c) => c.links.invitation, roles: guest },
  { name: 'confirm e-mail', path: (c) => c.links.confirmEmail, roles: guest },
  { name: 'page not found', path: () => '/no-such-page', roles: guest },
  { name: 'public build page', path: (c) => paths.shared.page.getHref(c.shareToken), roles: guest },
  { name: 'public build sheet', path: (c) => paths.shared.sheet.getHref(c.shareToken), roles: guest },
  { name: 'build not shared', path: () => paths.shared.page.getHref('x'.repeat(43)), roles: guest },

  { name: 'builds list', path: () => b.list.getHref(), roles: members },
  { name: 'account', path: () => paths.account.getHref(), roles: members },
  { name: 'new build', path: () => b.new.getHref(), roles: members },
  { name: 'overview and members', path: overview, roles: members },
  { name: 'invite dialog', path: overview, roles: owner, dialog: { button: 'Invite someone', name: 'Invite someone' } },
  { name: 'remove-member dialog', path: overview, roles: owner, dialog: { button: /^Remove /, name: /^Remove / } },
  { name: 'delete-build dialog', path: overview, roles: owner, dialog: { button: 'Delete build', name: /^Delete “/ } },
  { name: 'edit build', path: (c) => b.edit.getHref(c.buildId), roles: owner },
  { name: 'notices', path: (c) => b.notices.getHref(c.buildId), roles: members },
  { name: 'timeline', path: timeline, roles: members },
  { name: 'edit-milestone dialog', path: timeline, roles: owner, dialog: { button: /^Change “/, name: 'Change the milestone' } },
  { name: 'remove-milestone dialog', path: timeline, roles: owner, dialog: { button: /^Remove “/, name: 'Remove this milestone?' } },

  { name: 'parts ledger', path: parts, roles: members },
  { name: 'add-part dialog', path: parts, roles: owner, dialog: { button: 'Add part', name: 'Add a part' } },
  { name: 'part dialog', path: parts, roles: ['owner', 'crew', 'shop'], dialog: { button: /^Edit /, name: /^(Edit|Status and dates)/ } },
  { name: 'import dialog', path: parts, roles: owner, dialog: { button: 'Import CSV', name: 'Import parts from a CSV file' } },
  { name: 'send-outs', path: (c) => b.sendOuts.getHref(c.buildId), roles: members },
  // Crew get the page's owner-only state.
  { name: 'budget', path: (c) => b.budget.getHref(c.buildId), roles: ['owner', 'crew'] },
  { name: 'power estimate', path: (c) => b.estimate.getHref(c.buildId), roles: members },

  { name: 'install log', path: install, roles: members },
  { name: 'new-job dialog', path: install, roles: hands, dialog: { button: 'New job', name: 'New job' } },
  { name: 'step', path: step, roles: members },
  { name: 'add-fastener dialog', path: step, roles: hands, dialog: { button: 'Add a fastener spec', name: 'Add a fastener spec' } },
  { name: 'edit-fastener dialog', path: step, roles: hands, dialog: { button: /^Edit the spec “/, name: 'Edit the fastener spec' } },
  { name: 'edit-step dialog', path: step, roles: hands, dialog: { button: 'Edit name and what to do', name: 'Edit the step' } },
  { name: 'delete-step dialog', path: step, roles: owner, dialog: { button: 'Delete this step', name: 'Delete this step?' } },
  { name: 'step photo viewer', path: step, roles: members, dialog: { button: /^Open “/, name: /^Photo 1 of / } },
  { name: 'photos', path: photos, roles: members },
  { name: 'photo viewer', path: photos, roles: members, dialog: { button: /^Open “/, name: /^Photo 1 of / } },

  { name: 'bench results', path: (c) => b.bench.getHref(c.buildId), roles: members },
  { name: 'bench sheet', path: (c) => b.benchSheet.getHref(c.buildId, c.benchSheetId), roles: members },
  { name: 'bench sheet entry', path: (c) => b.benchEdit.getHref(c.buildId, c.benchSheetId), roles: ['owner', 'shop'] },
  { name: 'bench comparison', path: (c) => b.benchCompare.getHref(c.buildId, c.benchSheetId, c.laterBenchSheetId), roles: members },
  { name: 'dyno days', path: (c) => b.dyno.getHref(c.buildId), roles: members },
  { name: 'new-dyno-session dialog', path: (c) => b.dyno.getHref(c.buildId), roles: hands, dialog: { button: 'New dyno session', name: 'New dyno session' } },
  // The demo's dyno day is not assigned to the demo shop, which therefore cannot open it.
  { name: 'dyno session', path: (c) => b.dynoSession.getHref(c.buildId, c.dynoSessionId), roles: ['owner', 'crew', 'viewer'] },
  { name: 'build sheet', path: (c) => b.sheet.getHref(c.buildId), roles: ['owner', 'crew', 'viewer'] },
  { name: 'build sheet with money', path: (c) => b.sheet.getHref(c.buildId, true), roles: owner },
  { name: 'share settings', path: (c) => b.share.getHref(c.buildId), roles: owner },
  { name: 'new-address dialog', path: (c) => b.share.getHref(c.buildId), roles: owner, dialog: { button: 'New address', name: 'Give the page a new address?' } },
  { name: 'edit-dyno-session dialog', path: (c) => b.dynoSession.getHref(c.buildId, c.dynoSessionId), roles: hands, dialog: { button: 'Edit session', name: 'Edit the dyno session' } },
];

/** Waits until the page shows its data: its heading, and no loading spinner left in it. */
export async function settle(page: Page) {
  await expect(page.locator('main h1').first()).toBeVisible();
  await expect(page.locator('main .animate-spin')).toHaveCount(0);
}

/** The button that opens the check's dialog. */
export function opener(page: Page, check: PageCheck): Locator {
  return page.getByRole('button', { name: check.dialog!.button }).first();
}

/** The check's dialog, once open and done loading. */
export async function openedDialog(page: Page, check: PageCheck): Promise<Locator> {
  const dialog = page.getByRole('dialog', { name: check.dialog!.name });
  await expect(dialog).toBeVisible();
  await expect(dialog.locator('.animate-spin')).toHaveCount(0);
  return dialog;
}
