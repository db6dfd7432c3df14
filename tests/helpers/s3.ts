/**
 * A local S3-compatible fake (s3rver) on a free loopback port, with its objects
 * in a temp folder, for the storage contract and the object-store API tests.
 * s3rver checks that a signed URL has not expired and honours the response-*
 * overrides of a signed GET, but does not verify SigV4 signatures and serves
 * unsigned GETs too: tests here prove what Headroom asks of the store, not the
 * store's own access control.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { AddressInfo } from 'node:net';
import S3rver from 's3rver';
import type { ObjectStoreSettings } from '@server/storage-config';

export type FakeS3 = {
  endpoint: string;
  bucket: string;
  /** Settings for createS3Storage / config.objectStore (path-style, the fake's keys). */
  settings: (overrides?: Partial<ObjectStoreSettings>) => ObjectStoreSettings;
  /** Takes the store down (connections refused) … */
  stop: () => Promise<void>;
  /** … and brings it back on the same port with the same objects. */
  start: () => Promise<void>;
  /** Stops it for good and removes its folder. */
  close: () => Promise<void>;
};

/** s3rver's built-in account. */
export const fakeCredentials = { accessKeyId: 'S3RVER', secretAccessKey: 'S3RVER' };

export async function startFakeS3(bucket = 'headroom-test'): Promise<FakeS3> {
  const directory = fs.mkdtempSync(path.join(os.tmpdir(), 'headroom-s3-'));
  let port = 0;
  let server: S3rver | null = null;
  const run = async () => {
    server = new S3rver({
      address: '127.0.0.1',
      port,
      silent: true,
      directory,
      configureBuckets: [{ name: bucket, configs: [] }],
    });
    const address = (await server.run()) as AddressInfo;
    port = address.port;
  };
  await run();
  const endpoint = `http://127.0.0.1:${port}`;
  const stop = async () => {
    const s = server;
    server = null;
    await s?.close();
  };
  return {
    endpoint,
    bucket,
    settings: (overrides = {}) => ({
      bucket,
      region: 'us-east-1',
      endpoint,
      publicEndpoint: null,
      forcePathStyle: true,
      presignedUrls: true,
      credentials: fakeCredentials,
      ...overrides,
    }),
    stop,
    start: async () => {
      if (!server) await run();
    },
    close: async () => {
      await stop();
      fs.rmSync(directory, { recursive: true, force: true });
    },
  };
}
