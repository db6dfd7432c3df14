import fs from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import { describe, expect, it } from 'vitest';
import { loadConfig } from '@server/config';
import { defaultPhotoMaxBytes } from '@shared/schemas/photos';
import { useTestApp, type TestApp } from '../helpers/app';
import { buildWithCast } from '../helpers/factories';

const app = useTestApp();
// A second app whose photo limit is small enough to exceed in a test.
const smallLimit = useTestApp({ photoMaxBytes: 200 * 1024 });

// ---- fixtures -------------------------------------------------------------------------

/** A JPEG as a phone would send it: camera EXIF with a GPS position. */
async function gpsJpeg() {
  return sharp({ create: { width: 640, height: 480, channels: 3, background: '#5a7d9a' } })
    .jpeg()
    .withExif({
      IFD0: { Make: 'Test camera', Model: 'Fixture 1' },
      IFD3: {
        GPSLatitudeRef: 'N',
        GPSLatitude: '51/1 28/1 4000/100',
        GPSLongitudeRef: 'W',
        GPSLongitude: '0/1 0/1 500/100',
      },
    })
    .toBuffer();
}

/** 80 × 40 pixels stored sideways, with EXIF orientation 6 (turn 90° clockwise to view). */
async function sidewaysJpeg() {
  return sharp({ create: { width: 80, height: 40, channels: 3, background: '#aa3333' } })
    .jpeg()
    .withMetadata({ orientation: 6 })
    .toBuffer();
}

const png = () =>
  sharp({
    create: {
      width: 300,
      height: 200,
      channels: 4,
      background: { r: 0, g: 128, b: 0, alpha: 0.5 },
    },
  })
    .png()
    .toBuffer();
const webp = () =>
  sharp({ create: { width: 2400, height: 1800, channels: 3, background: '#333' } })
    .webp()
    .toBuffer();

/**
 * The tag ids in the GPS IFD of a JPEG's EXIF block (empty when there is none).
 * Read straight from the TIFF structure (EXIF 2.3, CIPA DC-008: tag 0x8825 in
 * IFD0 points at the GPS IFD; 0x0002 is GPSLatitude), not through sharp.
 */
function gpsTags(exif: Buffer | undefined): number[] {
  if (!exif) return [];
  const tiff = exif.subarray(exif.indexOf('Exif\0\0') + 6);
  const le = tiff.toString('latin1', 0, 2) === 'II';
  const u16 = (o: number) => (le ? tiff.readUInt16LE(o) : tiff.readUInt16BE(o));
  const u32 = (o: number) => (le ? tiff.readUInt32LE(o) : tiff.readUInt32BE(o));
  const entries = (ifd: number) => Array.from({ length: u16(ifd) }, (_, i) => ifd + 2 + i * 12);
  const gpsPointer = entries(u32(4)).find((e) => u16(e) === 0x8825);
  if (gpsPointer === undefined) return [];
  return entries(u32(gpsPointer + 8)).map((e) => u16(e));
}

function filesUnder(dir: string): string[] {
  if (!fs.existsSync(dir)) return [];
  return fs
    .readdirSync(dir, { recursive: true, withFileTypes: true })
    .filter((d) => d.isFile())
    .map((d) => path.join(d.parentPath, d.name));
}

async function castWithStep(t: TestApp = app) {
  const cast = await buildWithCast(t);
  const base = `/api/builds/${cast.build.id}`;
  const shopPart = (
    await cast.owner.agent.post(`${base}/parts`).send({
      category: 'fuel-injection',
      name: 'Injectors',
      status: 'at-shop',
      shopUserId: cast.shop.id,
    })
  ).body.part;
  const otherPart = (
    await cast.owner.agent.post(`${base}/parts`).send({ category: 'exhaust', name: 'Down-pipe' })
  ).body.part;
  const job = (await cast.owner.agent.post(`${base}/jobs`).send({ title: 'Fit the injectors' }))
    .body.job;
  const step = (
    await cast.owner.agent
      .post(`${base}/jobs/${job.id}/steps`)
      .send({ title: 'Seat the injectors', partIds: [shopPart.id] })
  ).body.step;
  const garageStep = (
    await cast.owner.agent
      .post(`${base}/jobs/${job.id}/steps`)
      .send({ title: 'Fit the down-pipe', partIds: [otherPart.id] })
  ).body.step;
  return { ...cast, base, shopPart, otherPart, job, step, garageStep };
}

// ---- tests -----------------------------------------------------------------------------

describe('photo upload', () => {
  it('stores and serves a JPEG without any of its metadata, GPS included', async () => {
    const fixture = await gpsJpeg();
    // The fixture really carries GPS: latitude (0x0002) and longitude (0x0004) tags.
    const before = await sharp(fixture).metadata();
    expect(gpsTags(before.exif)).toEqual(expect.arrayContaining([0x0001, 0x0002, 0x0003, 0x0004]));

    const { crew, owner, base, step } = await castWithStep();
    const res = await crew.agent
      .post(`${base}/steps/${step.id}/photos`)
      .field('caption', 'Injector bore, cleaned')
      .attach('photos', fixture, 'IMG_0042.jpg');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.photos).toHaveLength(1);
    const photo = res.body.photos[0];
    expect(photo).toMatchObject({
      stepId: step.id,
      partId: null,
      caption: 'Injector bore, cleaned',
      original: { format: 'jpeg', width: 640, height: 480, bytes: fixture.length },
      web: { width: 640, height: 480, contentType: 'image/jpeg' },
      thumb: { width: 320, height: 240 },
      uploadedBy: { id: crew.id, name: crew.displayName },
    });

    for (const size of ['web', 'thumb'] as const) {
      const served = await owner.agent.get(photo[size].url).buffer(true);
      expect(served.status).toBe(200);
      expect(served.headers['content-type']).toBe('image/jpeg');
      expect(served.headers['cache-control']).toMatch(/private/);
      const meta = await sharp(served.body).metadata();
      expect(meta.format).toBe('jpeg');
      expect(meta.exif).toBeUndefined();
      expect(meta.xmp).toBeUndefined();
      expect(meta.iptc).toBeUndefined();
      expect(gpsTags(meta.exif)).toEqual([]);
      expect(served.body.includes(Buffer.from('Test camera'))).toBe(false);
    }
    // And on disk, too.
    const stored = filesUnder(app.storageDir).filter((f) => f.includes(photo.id));
    expect(stored).toHaveLength(2);
    for (const f of stored) expect((await sharp(f).metadata()).exif).toBeUndefined();
    expect(filesUnder(app.uploadTmpDir)).toEqual([]);
  });

  it('turns a photo upright by its EXIF orientation before stripping it', async () => {
    const fixture = await sidewaysJpeg();
    expect((await sharp(fixture).metadata()).orientation).toBe(6);
    const { crew, base, step } = await castWithStep();
    const res = await crew.agent
      .post(`${base}/steps/${step.id}/photos`)
      .attach('photos', fixture, 'sideways.jpg');
    expect(res.status).toBe(201);
    expect(res.body.photos[0].original).toMatchObject({ width: 40, height: 80 });
    expect(res.body.photos[0].web).toMatchObject({ width: 40, height: 80 });
    const served = await crew.agent.get(res.body.photos[0].web.url).buffer(true);
    const meta = await sharp(served.body).metadata();
    expect([meta.width, meta.height, meta.orientation]).toEqual([40, 80, undefined]);
  });

  it('takes several photos at once (JPEG, PNG, WebP), resizing large ones for the web', async () => {
    const { crew, base, step } = await castWithStep();
    const res = await crew.agent
      .post(`${base}/steps/${step.id}/photos`)
      .attach('photos', await gpsJpeg(), 'a.jpg')
      .attach('photos', await png(), 'b.png')
      .attach('photos', await webp(), 'c.webp');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.photos.map((p: { original: { format: string } }) => p.original.format)).toEqual(
      ['jpeg', 'png', 'webp'],
    );
    const big = res.body.photos[2];
    expect(big.original).toMatchObject({ width: 2400, height: 1800 });
    expect(big.web).toMatchObject({ width: 1600, height: 1200 });
    expect(big.thumb).toMatchObject({ width: 320, height: 240 });
    const gallery = (await crew.agent.get(`${base}/steps/${step.id}/photos`)).body.photos;
    expect(gallery.map((p: { id: string }) => p.id)).toEqual(
      res.body.photos.map((p: { id: string }) => p.id),
    );
    expect(filesUnder(app.uploadTmpDir)).toEqual([]);
  });

  it.runIf(Boolean(sharp.format.heif.input.buffer && sharp.format.heif.output.buffer))(
    'accepts a HEIF-family photo where this sharp reads HEIF',
    async () => {
      const heif = await sharp({
        create: { width: 64, height: 48, channels: 3, background: '#777' },
      })
        .heif({ compression: 'av1' })
        .toBuffer();
      const { crew, base, step } = await castWithStep();
      const res = await crew.agent
        .post(`${base}/steps/${step.id}/photos`)
        .attach('photos', heif, 'IMG_0001.heic');
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      expect(res.body.photos[0].original.format).toBe('heif');
    },
  );

  it('refuses a text file named .jpg, an SVG and a cut-short JPEG, storing nothing', async () => {
    const { crew, base, step } = await castWithStep();
    const storedBefore = filesUnder(app.storageDir).length;
    const text = await crew.agent
      .post(`${base}/steps/${step.id}/photos`)
      .attach('photos', Buffer.from('not a photo at all\n'.repeat(50)), {
        filename: 'photo.jpg',
        contentType: 'image/jpeg',
      });
    expect(text.status).toBe(400);
    expect(text.body.error).toMatchObject({ code: 'not_an_image' });
    expect(text.body.error.message).toMatch(/"photo.jpg" is not a photo/);

    const svg = Buffer.from(
      '<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10"><rect width="10" height="10"/></svg>',
    );
    const svgRes = await crew.agent
      .post(`${base}/steps/${step.id}/photos`)
      .attach('photos', svg, 'drawing.png');
    expect(svgRes.status).toBe(400);
    expect(svgRes.body.error.code).toBe('unsupported_format');

    const full = await gpsJpeg();
    const cut = await crew.agent
      .post(`${base}/steps/${step.id}/photos`)
      .attach('photos', full.subarray(0, Math.floor(full.length * 0.6)), 'cut.jpg');
    expect(cut.status).toBe(400);
    expect(cut.body.error.code).toBe('undecodable_image');

    // One bad file refuses the whole upload.
    const mixed = await crew.agent
      .post(`${base}/steps/${step.id}/photos`)
      .attach('photos', await gpsJpeg(), 'good.jpg')
      .attach('photos', Buffer.from('nope'), 'bad.jpg');
    expect(mixed.status).toBe(400);

    expect((await crew.agent.get(`${base}/steps/${step.id}/photos`)).body.photos).toEqual([]);
    expect(filesUnder(app.storageDir)).toHaveLength(storedBefore);
    expect(filesUnder(app.uploadTmpDir)).toEqual([]);
    const none = await crew.agent.post(`${base}/steps/${step.id}/photos`).send({});
    expect(none.status).toBe(400);
    expect(none.body.error.code).toBe('no_file');
  });

  it('refuses a file over the size limit, storing nothing and leaving no temporary file', async () => {
    // The default limit is 25 MiB.
    expect(loadConfig({ ...process.env, NODE_ENV: 'test' }).photoMaxBytes).toBe(25 * 1024 * 1024);
    expect(defaultPhotoMaxBytes).toBe(25 * 1024 * 1024);

    const { crew, base, step } = await castWithStep(smallLimit);
    const noise = Buffer.alloc(600 * 400 * 3);
    for (let i = 0; i < noise.length; i++) noise[i] = (i * 7919) % 251;
    const large = await sharp(noise, { raw: { width: 600, height: 400, channels: 3 } })
      .jpeg({ quality: 100 })
      .toBuffer();
    expect(large.length).toBeGreaterThan(200 * 1024);
    const res = await crew.agent
      .post(`${base}/steps/${step.id}/photos`)
      .attach('photos', large, 'big.jpg');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('file_too_large');
    expect(res.body.error.message).toMatch(/larger than 0.2 MB/);
    expect((await crew.agent.get(`${base}/steps/${step.id}/photos`)).body.photos).toEqual([]);
    expect(filesUnder(smallLimit.storageDir)).toEqual([]);
    expect(filesUnder(smallLimit.uploadTmpDir)).toEqual([]);
    // A small photo still goes through on the same app.
    expect(
      (
        await crew.agent
          .post(`${base}/steps/${step.id}/photos`)
          .attach('photos', await sidewaysJpeg(), 's.jpg')
      ).status,
    ).toBe(201);
  });
});

describe('who sees and changes photos', () => {
  it('serves photos only to members: a stranger gets 404 and a signed-out caller 401 at the photo URL', async () => {
    const { crew, viewer, stranger, base, step } = await castWithStep();
    const photo = (
      await crew.agent
        .post(`${base}/steps/${step.id}/photos`)
        .attach('photos', await gpsJpeg(), 'a.jpg')
    ).body.photos[0];
    for (const url of [
      photo.web.url,
      photo.thumb.url,
      `${base}/photos/${photo.id}`,
      `${base}/photos`,
      `${base}/steps/${step.id}/photos`,
    ]) {
      expect((await viewer.agent.get(url)).status, url).toBe(200);
      expect((await stranger.agent.get(url)).status, url).toBe(404);
      expect((await app.agent().get(url)).status, url).toBe(401);
    }
    const res = await stranger.agent.get(photo.web.url);
    expect(res.headers['content-type']).toMatch(/json/);
    expect(
      (await stranger.agent.patch(`${base}/photos/${photo.id}`).send({ caption: 'x' })).status,
    ).toBe(404);
    expect((await stranger.agent.delete(`${base}/photos/${photo.id}`)).status).toBe(404);
    expect(
      (
        await stranger.agent
          .post(`${base}/steps/${step.id}/photos`)
          .attach('photos', await gpsJpeg(), 'a.jpg')
      ).status,
    ).toBe(404);
    expect(
      (
        await app
          .agent()
          .post(`${base}/steps/${step.id}/photos`)
          .attach('photos', await gpsJpeg(), 'a.jpg')
      ).status,
    ).toBe(401);
    expect(filesUnder(app.uploadTmpDir)).toEqual([]);
  });

  it('does not let a viewer upload, caption or delete', async () => {
    const { crew, viewer, base, step, otherPart } = await castWithStep();
    const photo = (
      await crew.agent
        .post(`${base}/steps/${step.id}/photos`)
        .attach('photos', await gpsJpeg(), 'a.jpg')
    ).body.photos[0];
    expect(
      (
        await viewer.agent
          .post(`${base}/steps/${step.id}/photos`)
          .attach('photos', await gpsJpeg(), 'a.jpg')
      ).status,
    ).toBe(403);
    expect(
      (
        await viewer.agent
          .post(`${base}/parts/${otherPart.id}/photos`)
          .attach('photos', await gpsJpeg(), 'a.jpg')
      ).status,
    ).toBe(403);
    expect(
      (await viewer.agent.patch(`${base}/photos/${photo.id}`).send({ caption: 'mine now' })).status,
    ).toBe(403);
    expect((await viewer.agent.delete(`${base}/photos/${photo.id}`)).status).toBe(403);
    expect((await viewer.agent.get(`${base}/photos`)).body.photos).toHaveLength(1);
    expect(filesUnder(app.uploadTmpDir)).toEqual([]);
  });

  it('lets owner and crew caption, and only the owner delete (files removed)', async () => {
    const { crew, owner, base, step } = await castWithStep();
    const photo = (
      await crew.agent
        .post(`${base}/steps/${step.id}/photos`)
        .attach('photos', await gpsJpeg(), 'a.jpg')
    ).body.photos[0];
    const captioned = await crew.agent
      .patch(`${base}/photos/${photo.id}`)
      .send({ caption: '  Seated, washer new  ' });
    expect(captioned.status).toBe(200);
    expect(captioned.body.photo.caption).toBe('Seated, washer new');
    expect(
      (await owner.agent.patch(`${base}/photos/${photo.id}`).send({ caption: 'Step 3 done' })).body
        .photo.caption,
    ).toBe('Step 3 done');
    expect((await crew.agent.delete(`${base}/photos/${photo.id}`)).status).toBe(403);
    expect(filesUnder(app.storageDir).filter((f) => f.includes(photo.id))).toHaveLength(2);
    expect((await owner.agent.delete(`${base}/photos/${photo.id}`)).status).toBe(204);
    expect(filesUnder(app.storageDir).filter((f) => f.includes(photo.id))).toEqual([]);
    expect((await owner.agent.get(photo.web.url)).status).toBe(404);
    expect((await owner.agent.get(`${base}/photos`)).body.photos).toEqual([]);
  });

  it('removes the photo files when a step is deleted', async () => {
    const { crew, owner, base, step } = await castWithStep();
    const photo = (
      await crew.agent
        .post(`${base}/steps/${step.id}/photos`)
        .attach('photos', await gpsJpeg(), 'a.jpg')
    ).body.photos[0];
    expect(filesUnder(app.storageDir).filter((f) => f.includes(photo.id))).toHaveLength(2);
    expect((await owner.agent.delete(`${base}/steps/${step.id}`)).status).toBe(204);
    expect(filesUnder(app.storageDir).filter((f) => f.includes(photo.id))).toEqual([]);
  });

  it('removes the photo files when their part, or the whole build, is deleted', async () => {
    const { crew, owner, base, otherPart, step, build } = await castWithStep();
    const onPart = (
      await crew.agent
        .post(`${base}/parts/${otherPart.id}/photos`)
        .attach('photos', await gpsJpeg(), 'p.jpg')
    ).body.photos[0];
    const onStep = (
      await crew.agent
        .post(`${base}/steps/${step.id}/photos`)
        .attach('photos', await png(), 's.png')
    ).body.photos[0];
    const filesOf = (id: string) => filesUnder(app.storageDir).filter((f) => f.includes(id));
    expect(filesOf(onPart.id)).toHaveLength(2);
    expect((await owner.agent.delete(`${base}/parts/${otherPart.id}`)).status).toBe(204);
    expect(filesOf(onPart.id)).toEqual([]);
    expect(filesOf(onStep.id)).toHaveLength(2);
    expect((await owner.agent.delete(`/api/builds/${build.id}`)).status).toBe(204);
    expect(filesOf(onStep.id)).toEqual([]);
  });

  it('shows a shop only the photos of its parts and of steps linked to them; it adds photos only to its parts', async () => {
    const { crew, shop, base, step, garageStep, shopPart, otherPart } = await castWithStep();
    const onStep = (
      await crew.agent
        .post(`${base}/steps/${step.id}/photos`)
        .attach('photos', await gpsJpeg(), 'a.jpg')
    ).body.photos[0];
    const onGarage = (
      await crew.agent
        .post(`${base}/steps/${garageStep.id}/photos`)
        .attach('photos', await gpsJpeg(), 'b.jpg')
    ).body.photos[0];
    const onOtherPart = (
      await crew.agent
        .post(`${base}/parts/${otherPart.id}/photos`)
        .attach('photos', await gpsJpeg(), 'c.jpg')
    ).body.photos[0];
    const byShop = await shop.agent
      .post(`${base}/parts/${shopPart.id}/photos`)
      .field('caption', 'Bench sheet')
      .attach('photos', await png(), 'sheet.png');
    expect(byShop.status, JSON.stringify(byShop.body)).toBe(201);
    const shopPhoto = byShop.body.photos[0];
    expect(shopPhoto).toMatchObject({ partId: shopPart.id, caption: 'Bench sheet' });

    const seen = (await shop.agent.get(`${base}/photos`)).body.photos.map(
      (p: { id: string }) => p.id,
    );
    expect(seen.sort()).toEqual([onStep.id, shopPhoto.id].sort());
    expect((await shop.agent.get(onStep.web.url)).status).toBe(200);
    for (const hidden of [onGarage, onOtherPart]) {
      expect((await shop.agent.get(hidden.web.url)).status).toBe(404);
      expect((await shop.agent.get(`${base}/photos/${hidden.id}`)).status).toBe(404);
    }
    expect((await shop.agent.get(`${base}/steps/${garageStep.id}/photos`)).status).toBe(404);
    expect((await shop.agent.get(`${base}/parts/${otherPart.id}/photos`)).status).toBe(404);
    expect(
      (
        await shop.agent
          .post(`${base}/parts/${otherPart.id}/photos`)
          .attach('photos', await png(), 'x.png')
      ).status,
    ).toBe(404);
    expect(
      (
        await shop.agent
          .post(`${base}/steps/${step.id}/photos`)
          .attach('photos', await png(), 'x.png')
      ).status,
    ).toBe(403);
    expect(
      (await shop.agent.patch(`${base}/photos/${onStep.id}`).send({ caption: 'x' })).status,
    ).toBe(403);
    expect(
      (
        await shop.agent
          .patch(`${base}/photos/${shopPhoto.id}`)
          .send({ caption: 'Bench sheet, page 1' })
      ).status,
    ).toBe(200);
    expect((await crew.agent.get(`${base}/parts/${shopPart.id}/photos`)).body.photos).toHaveLength(
      1,
    );
    expect(filesUnder(app.uploadTmpDir)).toEqual([]);
  });

  it('keeps the build gallery newest first and counts photos on the step', async () => {
    const { crew, base, step, otherPart } = await castWithStep();
    const first = (
      await crew.agent
        .post(`${base}/steps/${step.id}/photos`)
        .attach('photos', await gpsJpeg(), 'a.jpg')
    ).body.photos[0];
    const second = (
      await crew.agent
        .post(`${base}/parts/${otherPart.id}/photos`)
        .attach('photos', await png(), 'b.png')
    ).body.photos[0];
    const gallery = (await crew.agent.get(`${base}/photos`)).body.photos.map(
      (p: { id: string }) => p.id,
    );
    expect(gallery).toEqual([second.id, first.id]);
    expect((await crew.agent.get(`${base}/steps/${step.id}`)).body.step.photoCount).toBe(1);
  });
});
