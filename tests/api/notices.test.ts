import { describe, expect, it } from 'vitest';
import { noticeKindDefaults } from '@shared/schemas/notices';
import { notify } from '@server/features/notices/notices.service';
import { useTestApp } from '../helpers/app';
import { buildWithCast, addMember, signUp } from '../helpers/factories';

const app = useTestApp({}, { mail: true });

const ordered = {
  category: 'fuel-injection',
  name: 'Injector set, 60 % over',
  partNumber: 'INJ-8-60',
  quantity: 8,
  status: 'ordered',
  unitPriceCents: 42_500,
  shippingCents: 4_000,
  taxCents: 27_200,
  coreChargeCents: 80_000,
  orderedOn: '2026-10-01',
};

const atShop = {
  category: 'fuel-injection',
  name: 'Stock injectors for rebuild',
  quantity: 8,
  status: 'at-shop',
  turnaroundDays: 10,
  sentOutOn: '2026-10-05',
  labourCents: 96_000,
};

/** Who got a mail whose subject contains `subject`, after the worker ran. */
async function recipientsOf(subject: string) {
  await app.mail.deliver();
  const all = await app.mail.messages();
  return all
    .filter((m) => m.subject?.includes(subject))
    .flatMap((m) =>
      (Array.isArray(m.to) ? m.to : [m.to!]).flatMap((a) => a.value.map((v) => v.address)),
    );
}

async function cast() {
  const c = await buildWithCast(app);
  const otherShop = await signUp(app, 'othershop');
  await addMember(c.owner, c.build.id, otherShop, 'shop');
  const partsUrl = `/api/builds/${c.build.id}/parts`;
  return { ...c, otherShop, partsUrl };
}

describe('part notices', () => {
  it('tells crew and viewers, not the one who acted nor an unrelated shop, when an ordered part arrives — and shows no money', async () => {
    const { owner, crew, shop, viewer, otherShop, partsUrl, build } = await cast();
    const name = `Injector set ${build.id.slice(0, 6)}`;
    const part = (await owner.agent.post(partsUrl).send({ ...ordered, name })).body.part;
    const res = await owner.agent
      .patch(`${partsUrl}/${part.id}`)
      .send({ status: 'in-hand', receivedOn: '2026-10-18' });
    expect(res.status).toBe(200);

    const to = await recipientsOf(`${name} received`);
    expect(to.sort()).toEqual([crew.email, viewer.email].sort());
    expect(to).not.toContain(owner.email);
    expect(to).not.toContain(shop.email);
    expect(to).not.toContain(otherShop.email);

    const [mail] = await app.mail.to(crew.email);
    expect(mail.subject).toBe(`Test hauler: ${name} received`);
    expect(mail.textBody).toContain(`${owner.displayName} marked “${name}”`);
    expect(mail.textBody).toContain('on 2026-10-18');
    expect(mail.textBody).toContain(`${app.origin}/builds/${build.id}/parts`);
    // No money in any form: no currency, no amounts from the part.
    for (const m of await app.mail.to(viewer.email)) {
      // Ids and the origin's port are random digits: taken out before looking for amounts.
      const all = `${m.subject}\n${m.textBody}\n${m.html}`
        .replaceAll(app.origin, '')
        .replaceAll(build.id, '')
        .replaceAll(name, '');
      expect(all).not.toMatch(/\$|USD|425|272|800|cents|price|cost/i);
    }
  });

  it('tells the owner, viewers and the part’s own shop when a crew member brings a part back from the shop', async () => {
    const { owner, crew, shop, viewer, otherShop, partsUrl, build } = await cast();
    const name = `Stock injectors ${build.id.slice(0, 6)}`;
    const part = (await owner.agent.post(partsUrl).send({ ...atShop, name, shopUserId: shop.id }))
      .body.part;
    const res = await crew.agent
      .patch(`${partsUrl}/${part.id}`)
      .send({ status: 'in-hand', backOn: '2026-10-14' });
    expect(res.status).toBe(200);
    const to = await recipientsOf(`${name} back`);
    expect(to.sort()).toEqual([owner.email, shop.email, viewer.email].sort());
    expect(to).not.toContain(otherShop.email);
    const [mail] = (await app.mail.to(owner.email)).filter((m) => m.subject?.includes(name));
    expect(mail.subject).toBe(`Test hauler: ${name} back from ${shop.displayName}`);
    // One change, one notice: in hand and a back date together are not two events.
    expect((await app.mail.to(owner.email)).filter((m) => m.subject?.includes(name))).toHaveLength(
      1,
    );
  });

  it('counts a back date set by the shop as back from the shop, without telling the shop itself', async () => {
    const { owner, crew, shop, viewer, partsUrl, build } = await cast();
    const name = `Turbo ${build.id.slice(0, 6)}`;
    const part = (
      await owner.agent
        .post(partsUrl)
        .send({ ...atShop, category: 'turbocharger', name, shopUserId: shop.id })
    ).body.part;
    expect(
      (await shop.agent.patch(`${partsUrl}/${part.id}`).send({ backOn: '2026-10-12' })).status,
    ).toBe(200);
    expect((await recipientsOf(`${name} back`)).sort()).toEqual(
      [owner.email, crew.email, viewer.email].sort(),
    );
  });

  it('sends nothing for changes that are neither arrival nor return', async () => {
    const { owner, partsUrl, build } = await cast();
    const name = `Quiet part ${build.id.slice(0, 6)}`;
    const part = (await owner.agent.post(partsUrl).send({ ...ordered, name, status: 'planned' }))
      .body.part;
    await owner.agent.patch(`${partsUrl}/${part.id}`).send({ status: 'ordered' });
    await owner.agent
      .patch(`${partsUrl}/${part.id}`)
      .send({ notes: 'Tracking number in the mail' });
    expect(await app.db.knex('mail_outbox').where('subject', 'like', `%${name}%`)).toEqual([]);
  });

  it('leaves out a member who switched that kind off, and only them', async () => {
    const { owner, crew, viewer, partsUrl, build } = await cast();
    const off = await viewer.agent
      .put(`/api/builds/${build.id}/notice-preferences`)
      .send({ 'part-received': false });
    expect(off.status).toBe(200);
    const name = `Lift pump ${build.id.slice(0, 6)}`;
    const part = (
      await owner.agent.post(partsUrl).send({ ...ordered, category: 'fuel-supply', name })
    ).body.part;
    await owner.agent.patch(`${partsUrl}/${part.id}`).send({ status: 'in-hand' });
    expect(await recipientsOf(`${name} received`)).toEqual([crew.email]);
  });
});

describe('notify() for other features (install log)', () => {
  it('queues in the caller’s transaction: nothing when it rolls back, one mail per member when it commits', async () => {
    const { owner, crew, shop, viewer, build } = await cast();
    const notice = {
      subject: 'Step 4 signed off',
      text: 'Head studs torqued to spec.',
      link: `/builds/${build.id}/install`,
    };
    await expect(
      app.db.knex.transaction(async (trx) => {
        await notify(trx, build.id, 'step-signed-off', notice, { actorUserId: crew.id });
        throw new Error('the sign-off failed');
      }),
    ).rejects.toThrow('the sign-off failed');
    expect(
      await app.db.knex('mail_outbox').where({ subject: 'Test hauler: Step 4 signed off' }),
    ).toEqual([]);

    const n = await app.db.knex.transaction((trx) =>
      notify(trx, build.id, 'step-signed-off', notice, { actorUserId: crew.id }),
    );
    expect(n).toBe(2);
    // Crew acted; a shop hears of the install log only when the caller names it.
    expect((await recipientsOf('Step 4 signed off')).sort()).toEqual(
      [owner.email, viewer.email].sort(),
    );
    expect(await app.mail.to(shop.email)).toEqual([]);

    const torque = {
      subject: 'Torque out of spec on main cap 3',
      text: 'Read 180 N·m against 200 ± 5.',
      link: `/builds/${build.id}/install`,
    };
    await app.db.knex.transaction((trx) =>
      notify(trx, build.id, 'torque-out-of-spec', torque, {
        actorUserId: owner.id,
        shopUserId: shop.id,
      }),
    );
    expect((await recipientsOf('main cap 3')).sort()).toEqual(
      [crew.email, shop.email, viewer.email].sort(),
    );
  });
});

describe('notice preferences', () => {
  it('start all on but the weekly digest, and each member changes only their own', async () => {
    const { owner, crew, shop, viewer, build } = await cast();
    const url = `/api/builds/${build.id}/notice-preferences`;
    for (const m of [owner, crew, shop, viewer]) {
      const res = await m.agent.get(url);
      expect(res.status).toBe(200);
      expect(res.body.preferences).toEqual(noticeKindDefaults);
      expect(res.body.preferences['timeline-digest']).toBe(false);
    }
    const put = await crew.agent
      .put(url)
      .send({ 'step-signed-off': false, 'torque-out-of-spec': true });
    expect(put.status).toBe(200);
    expect(put.body.preferences).toEqual({
      'part-received': true,
      'part-back-from-shop': true,
      'part-overdue-at-shop': true,
      'step-signed-off': false,
      'torque-out-of-spec': true,
      'bench-sheet-from-shop': true,
      'timeline-digest': false,
    });
    expect((await crew.agent.get(url)).body.preferences['step-signed-off']).toBe(false);
    expect((await viewer.agent.get(url)).body.preferences['step-signed-off']).toBe(true);
    // PUT is the whole set: what is left out goes back to its default.
    const on = await crew.agent.put(url).send({ 'timeline-digest': true });
    expect(on.body.preferences['timeline-digest']).toBe(true);
    expect(on.body.preferences['step-signed-off']).toBe(true);
    expect((await crew.agent.put(url).send({})).body.preferences['timeline-digest']).toBe(false);
  });

  it('refuses unknown kinds and values that are not on/off', async () => {
    const { crew, build } = await cast();
    const url = `/api/builds/${build.id}/notice-preferences`;
    const unknown = await crew.agent.put(url).send({ 'dyno-day': false });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields['dyno-day']).toBeTruthy();
    const notBool = await crew.agent.put(url).send({ 'part-received': 'no' });
    expect(notBool.status).toBe(400);
    expect(notBool.body.error.fields['part-received']).toBeTruthy();
  });

  it('answers a stranger with 404 and a signed-out caller with 401', async () => {
    const { stranger, build } = await cast();
    const url = `/api/builds/${build.id}/notice-preferences`;
    expect((await stranger.agent.get(url)).status).toBe(404);
    expect((await stranger.agent.put(url).send({ 'part-received': false })).status).toBe(404);
    expect((await app.agent().get(url)).status).toBe(401);
    expect((await app.agent().put(url).send({})).status).toBe(401);
  });

  it('are removed with the membership', async () => {
    const { owner, crew, build } = await cast();
    await crew.agent
      .put(`/api/builds/${build.id}/notice-preferences`)
      .send({ 'part-received': false });
    await owner.agent.delete(`/api/builds/${build.id}/members/${crew.id}`);
    expect(
      await app.db.knex('notice_preferences').where({ build_id: build.id, user_id: crew.id }),
    ).toEqual([]);
  });
});
