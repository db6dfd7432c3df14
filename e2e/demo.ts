/**
 * The demo build (db/seeds/demo.ts) in the e2e database, for specs that need realistic pages:
 * a full parts ledger with money and a shop's send-outs, two install jobs with torque specs and
 * photos, and a member of each role. `npm test` migrates a fresh database without the demo, so the first spec
 * that asks seeds it through the same function `npm start` uses; later asks (and later runs
 * against the same database) find it by the demo owner's address and reuse it.
 */
import { request } from '@playwright/test';
import { randomBytes } from 'node:crypto';
import knexFactory, { type Knex } from 'knex';
import { knexConfig } from '@db/knexfile';
import { demoAccounts, demoPassword, seedDemo } from '@db/seeds/demo';
import type { Role } from '@shared/permissions';
import { createLocalDiskStorage } from '@server/lib/storage';
import { password, postJson as post, signUpThroughApi, uniqueEmail } from './helpers';
import { linkTo, waitForMail } from './mail';

export type Demo = {
  buildId: string;
  /** "Seat the injectors and torque the hold-downs": torque specs, a check, a photo, and a
   *  shop's part linked, so every role can open it. */
  stepId: string;
  /** The injector set's "As received" and "After rebuild" bench sheets (entered by the demo shop). */
  benchSheetId: string;
  laterBenchSheetId: string;
  /** The dyno day (not assigned to the demo shop). */
  dynoSessionId: string;
  /** The address token of the demo build's public page, switched on with one photo public. */
  shareToken: string;
};

const demoBuildName = 'Gravel Hauler';
const demoStepTitle = 'Seat the injectors and torque the hold-downs';

let cached: Promise<Demo> | undefined;

/** The demo's ids, seeding it first when this database has none. */
export function ensureDemo(): Promise<Demo> {
  cached ??= seedOrFind();
  return cached;
}

async function seedOrFind(): Promise<Demo> {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set: the e2e specs need the e2e database');
  const storageDir = process.env.E2E_STORAGE_DIR;
  if (!storageDir) throw new Error('E2E_STORAGE_DIR is not set (playwright.config.ts sets it)');
  const knex = knexFactory(knexConfig(url));
  try {
    const ownerEmail = demoAccounts.find((a) => a.key === 'owner')!.email;
    const find = () =>
      knex('builds as b')
        .join('build_members as m', 'm.build_id', 'b.id')
        .join('users as u', 'u.id', 'm.user_id')
        .where({ 'u.email': ownerEmail, 'm.role': 'owner', 'b.name': demoBuildName })
        .orderBy('b.created_at')
        .first<{ id: string } | undefined>('b.id');
    let build = await find();
    if (!build) {
      const seeded = await knex('users').where({ email: ownerEmail }).first('id');
      if (seeded)
        throw new Error(`${ownerEmail} exists without the demo build: use a fresh database`);
      await knex.transaction((trx) =>
        seedDemo(trx, { storage: createLocalDiskStorage(storageDir) }),
      );
      build = await find();
    }
    const step = await knex('install_steps')
      .where({ build_id: build!.id, title: demoStepTitle })
      .first<{ id: string }>('id');
    const sheets = await knex('bench_sheets')
      .where({ build_id: build!.id })
      .orderBy('tested_on')
      .select<{ id: string }[]>('id');
    const session = await knex('dyno_sessions')
      .where({ build_id: build!.id })
      .first<{ id: string }>('id');
    const shareToken = await shareDemo(knex, build!.id);
    return {
      buildId: build!.id,
      stepId: step.id,
      benchSheetId: sheets[0].id,
      laterBenchSheetId: sheets[sheets.length - 1].id,
      dynoSessionId: session.id,
      shareToken,
    };
  } finally {
    await knex.destroy();
  }
}

/**
 * Switches the demo build's public page on (every section, names hidden) with its oldest photo
 * public, as the owner would on the Share page; a page already shared keeps its address.
 */
async function shareDemo(knex: Knex, buildId: string): Promise<string> {
  await knex('build_shares')
    .insert({ build_id: buildId, token: randomBytes(32).toString('base64url'), enabled: true })
    .onConflict('build_id')
    .merge({ enabled: true });
  const photo = await knex('photos')
    .where({ build_id: buildId })
    .orderBy('created_at')
    .first<{ id: string } | undefined>('id');
  if (photo) await knex('photos').where({ id: photo.id }).update({ is_public: true });
  const share = await knex('build_shares')
    .where({ build_id: buildId })
    .first<{ token: string }>('token');
  return share.token;
}

/** Cookies of a demo member signed in through the API, for `browser.newContext({ storageState })`. */
export async function signedInState(baseURL: string, role: Role) {
  const api = await request.newContext({ baseURL });
  try {
    const email = demoAccounts.find((a) => a.key === role)!.email;
    await post(api, baseURL, '/api/auth/sign-in', { email, password: demoPassword });
    return await api.storageState();
  } finally {
    await api.dispose();
  }
}

export type MailedLinks = { invitation: string; reset: string; confirmEmail: string };

/** For pages that need no mailed link. */
export const noLinks: MailedLinks = { invitation: '', reset: '', confirmEmail: '' };

/**
 * Paths of a live invitation, a live password-reset link and a live link confirming a new
 * e-mail address, as their mails give them. A new account of their own sends them, so reruns
 * never run into the demo owner's invitation limit. (Opening a link's page does not use it.)
 */
export async function mailedLinks(baseURL: string): Promise<MailedLinks> {
  const { api, email } = await signUpThroughApi(baseURL, 'Wren Alder', 'links');
  try {
    const { build } = await post<{ build: { id: string } }>(api, baseURL, '/api/builds', {
      name: 'Borrowed Flatbed',
      cylinders: 6,
      aspiration: 'single-turbo',
      targetPowerHp: 550,
      targetPowerBasis: 'crank',
    });
    const invitee = uniqueEmail('invitee');
    await post(api, baseURL, `/api/builds/${build.id}/invitations`, {
      email: invitee,
      role: 'crew',
    });
    const movedTo = uniqueEmail('moved');
    await post(api, baseURL, '/api/me/email', { email: movedTo, currentPassword: password });
    await post(api, baseURL, '/api/auth/password-reset', { email });
    const invitation = await waitForMail(api, invitee, /invited to a build on Headroom/);
    const reset = await waitForMail(api, email, /Set a new Headroom password/);
    const confirmEmail = await waitForMail(api, movedTo, /Confirm your new Headroom e-mail/);
    return {
      invitation: linkTo(invitation, '/invite/'),
      reset: linkTo(reset, '/reset-password/'),
      confirmEmail: linkTo(confirmEmail, '/confirm-email/'),
    };
  } finally {
    await api.dispose();
  }
}
