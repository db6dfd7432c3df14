/** Factories: every test makes its own people and builds, with unique e-mails. */
import { randomUUID } from 'node:crypto';
import { expect } from 'vitest';
import type { Role } from '@shared/permissions';
import type { Agent, TestApp } from './app';

export const password = 'correct-horse-battery';

export function uniqueEmail(prefix = 'user') {
  return `${prefix}-${randomUUID().slice(0, 8)}@example.test`;
}

export type TestUser = { id: string; email: string; displayName: string; agent: Agent };

/** The app each signed-up user's agent talks to, so factories can reach its database. */
const appOf = new WeakMap<Agent, TestApp>();

export async function signUp(app: TestApp, prefix = 'user'): Promise<TestUser> {
  const agent = app.agent();
  const email = uniqueEmail(prefix);
  const res = await agent
    .post('/api/auth/sign-up')
    .send({ email, password, displayName: `Test ${prefix}` });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  appOf.set(agent, app);
  return { ...res.body.user, agent };
}

export const buildInput = {
  name: 'Test hauler',
  vehicleYear: 2005,
  vehicleDescription: 'Three-quarter-ton pickup',
  engineDescription: '6.6 L V8 turbodiesel',
  displacementLiters: 6.6,
  cylinders: 8,
  aspiration: 'single-turbo',
  transmission: '6-speed automatic',
  stockPowerHp: 310,
  stockPowerBasis: 'crank',
  targetPowerHp: 650,
  targetPowerBasis: 'crank',
  targetDate: '2027-06-01',
  targetEvent: 'Test dyno day',
  budgetCents: 1_500_000,
  currency: 'USD',
} as const;

export async function createBuild(owner: TestUser, overrides: Record<string, unknown> = {}) {
  const res = await owner.agent.post('/api/builds').send({ ...buildInput, ...overrides });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.build as { id: string } & Record<string, unknown>;
}

/**
 * Puts `user` on the owner's build with `role`, as an accepted invitation would (the API
 * adds people only through invitations: tests/api/invitations.test.ts walks that path).
 */
export async function addMember(owner: TestUser, buildId: string, user: TestUser, role: Role) {
  const app = appOf.get(owner.agent)!;
  const owns = await app.db
    .knex('build_members')
    .where({ build_id: buildId, user_id: owner.id, role: 'owner' })
    .first();
  expect(owns, 'addMember: the first argument owns the build').toBeTruthy();
  await app.db.knex('build_members').insert({ build_id: buildId, user_id: user.id, role });
}

/** An owner's build with one member of every other role, plus a stranger. */
export async function buildWithCast(app: TestApp) {
  const [owner, crew, shop, viewer, stranger] = await Promise.all(
    ['owner', 'crew', 'shop', 'viewer', 'stranger'].map((p) => signUp(app, p)),
  );
  const build = await createBuild(owner);
  await addMember(owner, build.id, crew, 'crew');
  await addMember(owner, build.id, shop, 'shop');
  await addMember(owner, build.id, viewer, 'viewer');
  return { owner, crew, shop, viewer, stranger, build };
}

/** Every key anywhere in a JSON value. */
export function allKeys(value: unknown, out: string[] = []): string[] {
  if (Array.isArray(value)) value.forEach((v) => allKeys(v, out));
  else if (value && typeof value === 'object')
    for (const [k, v] of Object.entries(value)) {
      out.push(k);
      allKeys(v, out);
    }
  return out;
}

export function moneyKeys(body: unknown) {
  return allKeys(body).filter((k) => k.endsWith('Cents'));
}
