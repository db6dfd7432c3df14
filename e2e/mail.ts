/**
 * Reading caught mail in Playwright specs: the e2e server runs without SMTP
 * settings, so its catcher keeps every message and /dev/mail lists them.
 */
import { expect, type APIRequestContext, type Page } from '@playwright/test';

export type CaughtMail = {
  file: string;
  to: string;
  subject: string;
  text: string;
  links: string[];
};

/**
 * Waits (the server's worker polls every 200 ms here) for the newest mail to `to` whose subject
 * matches. A ceiling, not a speed check: one CI run's first mail, sent while the demo was being
 * seeded at the start of the run, took longer than 15 s to arrive.
 */
export async function waitForMail(
  request: APIRequestContext,
  to: string,
  subject: RegExp,
): Promise<CaughtMail> {
  let found: CaughtMail | undefined;
  await expect
    .poll(
      async () => {
        const res = await request.get('/dev/mail?format=json');
        const { messages } = (await res.json()) as { messages: CaughtMail[] };
        found = messages.find(
          (m) => m.to.toLowerCase().includes(to.toLowerCase()) && subject.test(m.subject),
        );
        return Boolean(found);
      },
      { message: `a mail to ${to} with subject ${subject}`, timeout: 45_000 },
    )
    .toBe(true);
  return found!;
}

/** The first link in a mail that leads to `clientPath` (e.g. '/invite/'), as a path for page.goto(). */
export function linkTo(mail: CaughtMail, clientPath: string): string {
  const link = mail.links.find((l) => new URL(l).pathname.startsWith(clientPath));
  if (!link) throw new Error(`no ${clientPath} link in mail "${mail.subject}"`);
  const url = new URL(link);
  return url.pathname + url.search;
}

/**
 * Puts the person signed in on `member` onto the build with `role` the only way there is:
 * the owner (signed in on `owner`) invites their address, and they accept from the mail's
 * link. Returns their user id.
 */
export async function joinByInvitation(
  owner: Page | APIRequestContext,
  member: Page | APIRequestContext,
  p: {
    buildId: string;
    email: string;
    role: 'crew' | 'shop' | 'viewer' | 'owner';
    /** The app's origin; needed when `owner` is an API context rather than a page. */
    origin?: string;
  },
): Promise<string> {
  const ownerRequest = 'request' in owner ? owner.request : owner;
  const memberRequest = 'request' in member ? member.request : member;
  const origin = p.origin ?? new URL((owner as Page).url()).origin;
  const sent = await ownerRequest.post(`/api/builds/${p.buildId}/invitations`, {
    data: { email: p.email, role: p.role },
    headers: { Origin: origin },
  });
  expect(sent.ok(), await sent.text()).toBe(true);
  const mail = await waitForMail(ownerRequest, p.email, /invited to a build on Headroom/);
  const token = linkTo(mail, '/invite/').split('/').pop()!;
  const accepted = await memberRequest.post(`/api/invitations/${token}/accept`, {
    data: {},
    headers: { Origin: origin },
  });
  expect(accepted.ok(), await accepted.text()).toBe(true);
  return ((await accepted.json()) as { user: { id: string } }).user.id;
}
