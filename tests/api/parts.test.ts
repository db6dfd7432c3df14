import { describe, expect, it } from 'vitest';
import { useTestApp } from '../helpers/app';
import { addMember, buildWithCast, moneyKeys, signUp } from '../helpers/factories';

const app = useTestApp();

/**
 * What a part costs, worked out here from the ledger's definition (product.md: price ×
 * quantity, labour, shipping, tax, and the core charge less the refund), not by the code
 * under test.
 */
function costOf(p: {
  quantity: number;
  unitPriceCents: number;
  labourCents: number;
  shippingCents: number;
  taxCents: number;
  coreChargeCents: number;
  coreRefundCents: number;
}) {
  return (
    p.unitPriceCents * p.quantity +
    p.labourCents +
    p.shippingCents +
    p.taxCents +
    p.coreChargeCents -
    p.coreRefundCents
  );
}

/** Today as the server dates a stamp: the UTC calendar day. */
const utcToday = () => new Date().toISOString().slice(0, 10);

/** A response body as raw bytes, to see exactly what a spreadsheet program would read. */
function rawBody(
  res: import('node:http').IncomingMessage,
  done: (err: Error | null, body: Buffer) => void,
) {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => done(null, Buffer.concat(chunks)));
}

const injectors = {
  category: 'fuel-injection',
  name: 'Injector set, 60 % over, matched',
  vendor: 'Test Fuel Co',
  partNumber: 'INJ-8-60',
  quantity: 8,
  status: 'ordered',
  unitPriceCents: 42_500,
  labourCents: 0,
  shippingCents: 4_000,
  taxCents: 27_200,
  coreChargeCents: 80_000,
  coreRefundCents: 0,
  orderedOn: '2026-10-01',
  expectedOn: '2026-10-20',
  ratingValue: 90,
  ratingUnit: 'mm3-per-stroke',
  ratingFor: 'per injector at 1800 bar',
};

async function castWithParts() {
  const cast = await buildWithCast(app);
  const url = `/api/builds/${cast.build.id}/parts`;
  const a = (await cast.owner.agent.post(url).send(injectors)).body.part;
  const b = (
    await cast.owner.agent.post(url).send({
      category: 'fuel-injection',
      name: 'Stock injectors for rebuild',
      quantity: 8,
      status: 'at-shop',
      shopUserId: cast.shop.id,
      turnaroundDays: 10,
      sentOutOn: '2026-01-05',
      labourCents: 96_000,
      unitPriceCents: 0,
    })
  ).body.part;
  const c = (
    await cast.owner.agent.post(url).send({
      category: 'bottom-end',
      name: 'Forged rods',
      quantity: 8,
      unitPriceCents: 31_000,
      status: 'planned',
      ratingValue: 900,
      ratingUnit: 'hp-crank',
    })
  ).body.part;
  return { ...cast, url, parts: [a, b, c] };
}

describe('parts: create and read', () => {
  it('lets the owner add a part and read it back with money and its total', async () => {
    const { parts } = await castWithParts();
    const [a] = parts;
    expect(a).toMatchObject({ ...injectors });
    // Total computed here from the inputs, not read back from the server.
    expect(a.totalCents).toBe(42_500 * 8 + 4_000 + 27_200 + 80_000);
  });

  it('dates a part with the stored instant, in the ISO form of JavaScript Date', async () => {
    const cast = await buildWithCast(app);
    const url = `/api/builds/${cast.build.id}/parts`;
    const made = (await cast.owner.agent.post(url).send(injectors)).body.part;
    // A stored instant with microseconds: the answer truncates to milliseconds as Date does.
    await app.db
      .knex('parts')
      .where({ id: made.id })
      .update({
        created_at: app.db.knex.raw(`'2027-01-02T03:04:05.678901Z'::timestamptz`),
        updated_at: app.db.knex.raw(`'2027-01-02T03:04:05.000001Z'::timestamptz`),
      });
    // ECMA-262 Date.prototype.toISOString: YYYY-MM-DDTHH:mm:ss.sssZ, in UTC.
    const expected = {
      createdAt: '2027-01-02T03:04:05.678Z',
      updatedAt: '2027-01-02T03:04:05.000Z',
    };
    const listed = (await cast.owner.agent.get(url)).body.parts[0];
    const one = (await cast.owner.agent.get(`${url}/${made.id}`)).body.part;
    expect(listed).toMatchObject(expected);
    expect(one).toMatchObject(expected);
  });

  it('shows crew and viewer every part without any money key', async () => {
    const { crew, viewer, url } = await castWithParts();
    for (const m of [crew, viewer]) {
      const res = await m.agent.get(url);
      expect(res.status).toBe(200);
      expect(res.body.parts).toHaveLength(3);
      expect(moneyKeys(res.body)).toEqual([]);
    }
  });

  it('shows a shop only the parts sent to it, with its own labour quote and no other money', async () => {
    const { shop, url, parts } = await castWithParts();
    const res = await shop.agent.get(url);
    expect(res.status).toBe(200);
    expect(res.body.parts.map((p: { id: string }) => p.id)).toEqual([parts[1].id]);
    expect(moneyKeys(res.body)).toEqual(['labourCents']);
    expect(res.body.parts[0].labourCents).toBe(96_000);
    expect((await shop.agent.get(`${url}/${parts[0].id}`)).status).toBe(404);
  });

  it('never shows one shop the parts of another shop', async () => {
    const { owner, build, url, parts } = await castWithParts();
    const otherShop = await signUp(app, 'othershop');
    await addMember(owner, build.id, otherShop, 'shop');
    expect((await otherShop.agent.get(url)).body.parts).toEqual([]);
    expect((await otherShop.agent.get(`${url}/${parts[1].id}`)).status).toBe(404);
    expect(
      (await otherShop.agent.patch(`${url}/${parts[1].id}`).send({ status: 'in-hand' })).status,
    ).toBe(404);
  });

  it('answers a stranger with 404 and a signed-out caller with 401 on every parts route', async () => {
    const { stranger, url, parts } = await castWithParts();
    const one = `${url}/${parts[0].id}`;
    for (const agent of [stranger.agent, app.agent()]) {
      const expected = agent === stranger.agent ? 404 : 401;
      expect((await agent.get(url)).status).toBe(expected);
      expect((await agent.get(one)).status).toBe(expected);
      expect((await agent.post(url).send(injectors)).status).toBe(expected);
      expect((await agent.patch(one).send({ status: 'installed' })).status).toBe(expected);
      expect((await agent.delete(one)).status).toBe(expected);
      expect((await agent.get(`${url}.csv`)).status).toBe(expected);
      expect(
        (
          await agent
            .post(`${url}/import`)
            .attach('file', Buffer.from('category,name\nother,x\n'), 'p.csv')
        ).status,
      ).toBe(expected);
      expect((await agent.get(url.replace('/parts', '/budget'))).status).toBe(expected);
    }
  });

  it('lets only the owner create and delete parts', async () => {
    const { crew, shop, viewer, owner, url, parts } = await castWithParts();
    for (const m of [crew, shop, viewer]) {
      expect((await m.agent.post(url).send(injectors)).status).toBe(403);
      expect((await m.agent.delete(`${url}/${parts[1].id}`)).status).toBe(403);
    }
    expect((await owner.agent.delete(`${url}/${parts[2].id}`)).status).toBe(204);
    expect((await owner.agent.get(url)).body.parts).toHaveLength(2);
  });
});

describe('parts: who may change what', () => {
  it('lets crew and the shop change status and dates, nothing else', async () => {
    const { crew, shop, viewer, url, parts } = await castWithParts();
    const crewRes = await crew.agent
      .patch(`${url}/${parts[0].id}`)
      .send({ status: 'in-hand', receivedOn: '2026-10-18' });
    expect(crewRes.status).toBe(200);
    expect(crewRes.body.part).toMatchObject({ status: 'in-hand', receivedOn: '2026-10-18' });
    expect(moneyKeys(crewRes.body)).toEqual([]);
    expect(
      (await crew.agent.patch(`${url}/${parts[0].id}`).send({ unitPriceCents: 1 })).status,
    ).toBe(403);
    expect((await crew.agent.patch(`${url}/${parts[0].id}`).send({ name: 'renamed' })).status).toBe(
      403,
    );

    const shopRes = await shop.agent
      .patch(`${url}/${parts[1].id}`)
      .send({ status: 'in-hand', backOn: '2026-01-14' });
    expect(shopRes.status).toBe(200);
    expect(moneyKeys(shopRes.body)).toEqual(['labourCents']);
    expect((await shop.agent.patch(`${url}/${parts[1].id}`).send({ labourCents: 1 })).status).toBe(
      403,
    );

    expect(
      (await viewer.agent.patch(`${url}/${parts[0].id}`).send({ status: 'installed' })).status,
    ).toBe(403);
  });

  it('marks a send-out overdue when its promised turnaround has passed', async () => {
    const { owner, url, parts } = await castWithParts();
    const res = await owner.agent.get(`${url}/${parts[1].id}`);
    // Sent 2026-01-05 with 10 days' turnaround: due 2026-01-15, long past.
    expect(res.body.part.sendOut).toMatchObject({ dueOn: '2026-01-15', overdue: true });
    expect(res.body.part.sendOut.daysOut).toBeGreaterThan(300);
  });
});

describe('parts: a status change stamps its date, whoever makes it (issue #14)', () => {
  it('dates a status changed through the API: received, back from the shop, ordered on create', async () => {
    const { owner, crew, shop, url, parts } = await castWithParts();
    const day = utcToday();
    // The injectors were ordered; crew marks them in the garage without a date.
    const received = await crew.agent.patch(`${url}/${parts[0].id}`).send({ status: 'in-hand' });
    expect(received.status).toBe(200);
    expect(received.body.part).toMatchObject({ status: 'in-hand', receivedOn: day });
    // The shop hands back what it had: received and back on the same day.
    const back = await shop.agent.patch(`${url}/${parts[1].id}`).send({ status: 'in-hand' });
    expect(back.status).toBe(200);
    expect(back.body.part).toMatchObject({ backOn: day, receivedOn: day });
    // A part created as ordered is ordered today; a date given is kept.
    const created = await owner.agent
      .post(url)
      .send({ category: 'exhaust', name: 'Down-pipe', status: 'ordered' });
    expect(created.body.part.orderedOn).toBe(day);
    const given = await owner.agent
      .patch(`${url}/${parts[2].id}`)
      .send({ status: 'ordered', orderedOn: '2026-01-02' });
    expect(given.body.part.orderedOn).toBe('2026-01-02');
  });

  it('changes the status without a date rather than refuse, when today would be out of order', async () => {
    const { owner, url, parts } = await castWithParts();
    await owner.agent
      .patch(`${url}/${parts[2].id}`)
      .send({ status: 'ordered', orderedOn: '2099-01-01' });
    const res = await owner.agent.patch(`${url}/${parts[2].id}`).send({ status: 'in-hand' });
    expect(res.status).toBe(200);
    expect(res.body.part).toMatchObject({ status: 'in-hand', receivedOn: null });
  });

  it('dates the parts a CSV import adds with a status', async () => {
    const { owner, url } = await castWithParts();
    const csv =
      'category,name,status,installedOn\nexhaust,Down-pipe,ordered,\ncooling,Radiator,installed,2026-03-04\n';
    const res = await owner.agent.post(`${url}/import`).attach('file', Buffer.from(csv), 'p.csv');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const list = (await owner.agent.get(url)).body.parts;
    expect(list.find((p: { name: string }) => p.name === 'Down-pipe').orderedOn).toBe(utcToday());
    expect(list.find((p: { name: string }) => p.name === 'Radiator').installedOn).toBe(
      '2026-03-04',
    );
  });
});

describe('parts: bad input', () => {
  it('refuses negative quantities and money, unknown category, status and unit', async () => {
    const { owner, url } = await castWithParts();
    const res = await owner.agent.post(url).send({
      ...injectors,
      quantity: -1,
      unitPriceCents: -5,
      category: 'flux-capacitor',
      status: 'lost',
      ratingUnit: 'furlongs',
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual([
      'category',
      'quantity',
      'ratingUnit',
      'status',
      'unitPriceCents',
    ]);
    expect((await owner.agent.get(url)).body.parts).toHaveLength(3);
  });

  it('refuses dates in impossible order, on create and when an edit would make them so', async () => {
    const { owner, url, parts } = await castWithParts();
    const create = await owner.agent
      .post(url)
      .send({ category: 'other', name: 'x', receivedOn: '2026-03-01', installedOn: '2026-02-01' });
    expect(create.status).toBe(400);
    expect(create.body.error.fields.installedOn).toMatch(/before/);
    const edit = await owner.agent.patch(`${url}/${parts[1].id}`).send({ backOn: '2026-01-01' });
    expect(edit.status).toBe(400);
    expect(edit.body.error.fields.backOn).toMatch(/before it was sent/);
  });

  it('refuses a shop that is not a shop member of the build', async () => {
    const { owner, crew, url } = await castWithParts();
    const res = await owner.agent
      .post(url)
      .send({ category: 'transmission', name: 'Trans', status: 'at-shop', shopUserId: crew.id });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.shopUserId).toBeTruthy();
  });
});

describe('budget', () => {
  it('is for the owner only', async () => {
    const { crew, shop, viewer, build } = await castWithParts();
    for (const m of [crew, shop, viewer])
      expect((await m.agent.get(`/api/builds/${build.id}/budget`)).status).toBe(403);
  });

  it('adds up planned, committed and spent per category from the rows the test created', async () => {
    const { owner, build, url } = await castWithParts();
    // Move one along and add a returned part, which must not count.
    await owner.agent.post(url).send({
      category: 'turbocharger',
      name: 'Returned turbo',
      status: 'returned',
      unitPriceCents: 250_000,
    });
    const { body } = await owner.agent.get(url);
    const res = await owner.agent.get(`/api/builds/${build.id}/budget`);
    expect(res.status).toBe(200);
    const budget = res.body.budget;
    const live = body.parts.filter((p: { status: string }) => p.status !== 'returned');
    const sum = (pred: (p: { status: string }) => boolean) =>
      live.filter(pred).reduce((s: number, p: Parameters<typeof costOf>[0]) => s + costOf(p), 0);
    expect(budget.totals.plannedCents).toBe(sum(() => true));
    expect(budget.totals.committedCents).toBe(sum((p) => p.status !== 'planned'));
    expect(budget.totals.spentCents).toBe(
      sum((p) => ['in-hand', 'at-shop', 'installed'].includes(p.status)),
    );
    expect(budget.totals.coreOwedCents).toBe(80_000);
    const fuel = budget.categories.find(
      (c: { category: string }) => c.category === 'fuel-injection',
    );
    expect(fuel.plannedCents).toBe(42_500 * 8 + 4_000 + 27_200 + 80_000 + 96_000);
    expect(budget.categories.some((c: { category: string }) => c.category === 'turbocharger')).toBe(
      false,
    );
    expect(budget.remainingAfterPlannedCents).toBe(1_500_000 - budget.totals.plannedCents);
  });

  it('names the part that takes the total over budget', async () => {
    const { owner, build, url } = await castWithParts();
    await owner.agent.patch(`/api/builds/${build.id}`).send({ budgetCents: 700_000 });
    const res = await owner.agent.get(`/api/builds/${build.id}/budget`);
    expect(res.body.budget.overBudget).toBe(true);
    // Spent (at-shop rebuild, 960.00) first, then committed injectors (4512.00), then planned rods (2480.00):
    // 960 + 4512 = 5472 ≤ 7000; + 2480 = 7952 > 7000 → the rods tip it.
    expect(res.body.budget.tippingPart.name).toBe('Forged rods');
    expect(res.body.budget.tippingPart.overByCents).toBe(795_200 - 700_000);
    void url;
  });
});

describe('budget and shared page agree', () => {
  it('names the same tipping part on ties, whatever order the parts were stored in', async () => {
    const cast = await buildWithCast(app);
    const base = `/api/builds/${cast.build.id}`;
    await cast.owner.agent.patch(base).send({ budgetCents: 150_000 });
    // Two planned parts of 1,000.00 with one created_at (as a CSV import stores them), added
    // in the reverse of the ledger's order (category, then name): the budget walks them in the
    // ledger's order, so the second of that order tips it, as the shared page's budget says.
    const ids: string[] = [];
    for (const [category, name] of [
      ['turbocharger', 'C turbo'],
      ['fuel-injection', 'A lines'],
    ])
      ids.push(
        (
          await cast.owner.agent
            .post(`${base}/parts`)
            .send({ category, name, unitPriceCents: 100_000 })
        ).body.part.id,
      );
    await app.db
      .knex('parts')
      .whereIn('id', ids)
      .update({ created_at: app.db.knex.raw(`'2027-02-01T10:00:00Z'::timestamptz`) });
    const budget = (await cast.owner.agent.get(`${base}/budget`)).body.budget;
    // The ledger's order: fuel-injection "A lines", then turbocharger "C turbo";
    // 1,000 + 1,000 > 1,500 → "C turbo" (product.md: the part that crosses the budget line).
    expect(budget.tippingPart).toMatchObject({ name: 'C turbo', overByCents: 50_000 });
  });
});

describe('CSV export and import', () => {
  it('names the file after the build and the day, and starts it with a UTF-8 byte-order mark (issue #14)', async () => {
    const { owner, url } = await castWithParts();
    // A rating note with °, — and ³, which a spreadsheet program misreads without the mark.
    await owner.agent.post(url).send({
      category: 'fuel-injection',
      name: 'Nozzles — 150 mm³ at 40 °C',
      ratingValue: 150,
      ratingUnit: 'mm3-per-stroke',
    });
    // (superagent types its Node parser loosely; rawBody reads the IncomingMessage it is given.)
    const res = await owner.agent
      .get(`${url}.csv`)
      .buffer(true)
      .parse(rawBody as never);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/text\/csv; charset=utf-8/);
    // The factory build is "Test hauler".
    // (RFC 6266: the name needs no quotes when it is a plain token.)
    expect(res.headers['content-disposition']).toMatch(
      new RegExp(`^attachment; filename="?test-hauler-parts-${utcToday()}\\.csv"?$`),
    );
    const bytes = res.body as Buffer;
    expect([...bytes.subarray(0, 3)]).toEqual([0xef, 0xbb, 0xbf]); // U+FEFF in UTF-8
    expect(bytes.subarray(3).toString('utf8')).toMatch(/^category,name,/);
    expect(bytes.toString('utf8')).toContain('Nozzles — 150 mm³ at 40 °C');
  });

  it('names a build with letters outside ASCII in the UTF-8 form of the header', async () => {
    const { owner, build, url } = await castWithParts();
    await owner.agent
      .patch(`/api/builds/${build.id}`)
      .send({ name: 'Nacht Fracht: Ölwanne & Co.' });
    const res = await owner.agent.get(`${url}.csv`);
    expect(res.headers['content-disposition']).toContain(
      `filename*=UTF-8''nacht-fracht-%C3%B6lwanne-co-parts-${utcToday()}.csv`,
    );
  });

  it('round-trips: export then import into another build gives the same parts', async () => {
    const { owner, url } = await castWithParts();
    const csv = await owner.agent.get(`${url}.csv`);
    expect(csv.status).toBe(200);
    expect(csv.headers['content-type']).toMatch(/text\/csv/);
    const other = (
      await owner.agent.post('/api/builds').send({
        name: 'Second',
        cylinders: 8,
        aspiration: 'single-turbo',
        targetPowerHp: 500,
        targetPowerBasis: 'crank',
      })
    ).body.build;
    // The shop is not on the second build: drop the shop column value for that row.
    const text = csv.text.replace(/shop-[^,]*@example\.test/g, '');
    const imp = await owner.agent
      .post(`/api/builds/${other.id}/parts/import`)
      .attach('file', Buffer.from(text), 'parts.csv');
    expect(imp.status, JSON.stringify(imp.body)).toBe(201);
    expect(imp.body.saved).toBe(3);
    const strip = (p: Record<string, unknown>) => {
      const {
        id: _i,
        buildId: _b,
        createdAt: _c,
        updatedAt: _u,
        shopUserId: _s,
        shopName: _n,
        sendOut: _o,
        ...rest
      } = p;
      return rest;
    };
    // Rows imported together share a creation time, so compare in a fixed order.
    const byName = (a: { name: string }, b: { name: string }) => a.name.localeCompare(b.name);
    const before = (await owner.agent.get(url)).body.parts.map(strip).sort(byName);
    const after = (await owner.agent.get(`/api/builds/${other.id}/parts`)).body.parts
      .map(strip)
      .sort(byName);
    expect(after).toEqual(before);
  });

  it('exports without money columns for crew', async () => {
    const { crew, url } = await castWithParts();
    const csv = await crew.agent.get(`${url}.csv`);
    expect(csv.status).toBe(200);
    expect(csv.text.split('\r\n')[0]).not.toMatch(/unitPrice|labour|tax|core/);
  });

  it('previews with dryRun and saves nothing', async () => {
    const { owner, url } = await castWithParts();
    const res = await owner.agent
      .post(`${url}/import?dryRun=1`)
      .attach('file', Buffer.from('category,name,quantity\nExhaust,Down-pipe,1\n'), 'p.csv');
    expect(res.status).toBe(200);
    expect(res.body.rows).toEqual([{ category: 'exhaust', name: 'Down-pipe', quantity: 1 }]);
    expect((await owner.agent.get(url)).body.parts).toHaveLength(3);
  });

  it('saves no row when any row fails, and names the failing rows', async () => {
    const { owner, url } = await castWithParts();
    const csv =
      'category,name,quantity,unitPrice\nexhaust,Good,1,10.00\nexhaust,Bad qty,-2,5\nwarp-drive,Bad cat,1,abc\n';
    const res = await owner.agent.post(`${url}/import`).attach('file', Buffer.from(csv), 'p.csv');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_rows');
    expect(res.body.error.rows.map((r: { row: number }) => r.row)).toEqual([3, 4]);
    expect(res.body.error.message).toBe('2 rows of 3 need fixing; nothing was saved');
    expect(res.body.error.rows[1].fields).toHaveProperty('unitPriceCents');
    // The bad category is echoed, and the allowed ones listed.
    const category = res.body.error.rows[1].fields.category;
    expect(category).toMatch(/^"warp-drive" is not a category\. Use one of: fuel-injection, /);
    expect(category).toContain('bottom-end');
    expect(category).toContain('other');
    expect((await owner.agent.get(url)).body.parts).toHaveLength(3);
  });

  it('says "1 row", and echoes a bad status and rating unit with the allowed ones (issue #14)', async () => {
    const { owner, url } = await castWithParts();
    const one = await owner.agent
      .post(`${url}/import`)
      .attach(
        'file',
        Buffer.from('category,name,status,ratingValue,ratingUnit\nexhaust,Pipe,lost,5,furlongs\n'),
        'p.csv',
      );
    expect(one.status).toBe(400);
    expect(one.body.error.message).toBe('1 row of 1 needs fixing; nothing was saved');
    const fields = one.body.error.rows[0].fields;
    expect(fields.status).toMatch(/^"lost" is not a status\. Use one of: planned, ordered, /);
    expect(fields.ratingUnit).toMatch(/^"furlongs" is not a rating unit\. Use one of: hp-crank, /);
    const empty = await owner.agent
      .post(`${url}/import`)
      .attach('file', Buffer.from('category,name\n,Pipe\n'), 'p.csv');
    expect(empty.body.error.rows[0].fields.category).toMatch(
      /^The category is empty\. Use one of:/,
    );
  });

  it('refuses wrong columns, a 20 MB file and text that is not UTF-8', async () => {
    const { owner, url } = await castWithParts();
    const wrong = await owner.agent
      .post(`${url}/import`)
      .attach('file', Buffer.from('colour,size\nred,9\n'), 'p.csv');
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.message).toMatch(/Unknown columns: colour, size/);
    const big = await owner.agent
      .post(`${url}/import`)
      .attach('file', Buffer.alloc(20 * 1024 * 1024, 'a'), 'big.csv');
    expect(big.status).toBe(400);
    expect(big.body.error.code).toBe('file_too_large');
    const latin1 = Buffer.from([...Buffer.from('category,name\nother,Caf'), 0xe9, 0x0a]);
    const enc = await owner.agent.post(`${url}/import`).attach('file', latin1, 'p.csv');
    expect(enc.status).toBe(400);
    expect(enc.body.error.code).toBe('not_utf8');
    expect((await owner.agent.get(url)).body.parts).toHaveLength(3);
  });

  it('lets only the owner import', async () => {
    const { crew, viewer, shop, url } = await castWithParts();
    for (const m of [crew, viewer, shop]) {
      expect(
        (
          await m.agent
            .post(`${url}/import`)
            .attach('file', Buffer.from('category,name\nother,x\n'), 'p.csv')
        ).status,
      ).toBe(403);
    }
  });
});
