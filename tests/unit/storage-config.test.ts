/**
 * The store's settings: local disk by default, S3 only with a valid bucket;
 * and the origin Headroom puts in the content security policy is the one the
 * SDK really signs URLs for (signing needs no network, so AWS itself is checked too).
 */
import { describe, expect, it } from 'vitest';
import {
  bucketNameProblem,
  objectStoreFromEnv,
  type ObjectStoreSettings,
} from '@server/storage-config';
import { createS3Storage, signedUrlOriginFor } from '@server/lib/storage-s3';
import { signingWindow, signedUrlGraceSeconds } from '@server/lib/stored-file';

describe('storage settings', () => {
  it('keeps files on the local disk unless STORAGE=s3', () => {
    expect(objectStoreFromEnv({})).toBeNull();
    expect(objectStoreFromEnv({ S3_BUCKET: 'headroom-files' })).toBeNull();
  });

  it('reads the object store from STORAGE=s3 and S3_*, with AWS_REGION as the region’s fallback', () => {
    expect(
      objectStoreFromEnv({
        STORAGE: 's3',
        S3_BUCKET: 'headroom-files',
        AWS_REGION: 'eu-west-2',
      }),
    ).toEqual({
      bucket: 'headroom-files',
      region: 'eu-west-2',
      endpoint: null,
      publicEndpoint: null,
      forcePathStyle: false,
      presignedUrls: true,
    });
    expect(
      objectStoreFromEnv({
        STORAGE: 's3',
        S3_BUCKET: 'files',
        S3_REGION: 'auto',
        AWS_REGION: 'eu-west-2',
        S3_ENDPOINT: 'http://127.0.0.1:9000',
        S3_PUBLIC_ENDPOINT: 'https://files.example.test',
        S3_FORCE_PATH_STYLE: '1',
        S3_PRESIGNED_URLS: '0',
      }),
    ).toMatchObject({
      region: 'auto',
      endpoint: 'http://127.0.0.1:9000',
      publicEndpoint: 'https://files.example.test',
      forcePathStyle: true,
      presignedUrls: false,
    });
  });

  it('refuses STORAGE=s3 without a bucket, a bucket S3 would refuse, and an endpoint that is not a URL', () => {
    expect(() => objectStoreFromEnv({ STORAGE: 's3' })).toThrow(/S3_BUCKET: STORAGE=s3 needs/);
    expect(() => objectStoreFromEnv({ STORAGE: 's3', S3_BUCKET: 'ab' })).toThrow(/3–63/);
    expect(() =>
      objectStoreFromEnv({ STORAGE: 's3', S3_BUCKET: 'x', S3_ENDPOINT: 'minio:9000' }),
    ).toThrow(/S3_ENDPOINT/);
    expect(() => objectStoreFromEnv({ STORAGE: 'ftp' })).toThrow(/STORAGE/);
    for (const bad of [
      'ab',
      'a'.repeat(64),
      'Headroom',
      'head_room',
      '-headroom',
      'head..room',
      '192.168.1.10',
    ]) {
      expect(bucketNameProblem(bad), bad).not.toBeNull();
    }
    for (const good of [
      'abc',
      'a'.repeat(63),
      'headroom-files',
      'files.headroom.example',
      '1st-bucket',
    ]) {
      expect(bucketNameProblem(good), good).toBeNull();
    }
  });
});

describe('signed URLs', () => {
  const base: ObjectStoreSettings = {
    bucket: 'headroom-files',
    region: 'eu-west-2',
    endpoint: null,
    publicEndpoint: null,
    forcePathStyle: false,
    presignedUrls: true,
    credentials: { accessKeyId: 'AKIDEXAMPLE', secretAccessKey: 'example-secret' },
  };
  const cases: [string, Partial<ObjectStoreSettings>][] = [
    ['AWS, virtual-hosted', {}],
    ['AWS, path-style', { forcePathStyle: true }],
    ['AWS, a bucket with dots', { bucket: 'files.headroom.example' }],
    ['a compatible store, path-style', { endpoint: 'http://127.0.0.1:9000', forcePathStyle: true }],
    ['a compatible store, virtual-hosted', { endpoint: 'https://s3.store.example' }],
    [
      'a compatible store reached by browsers elsewhere',
      {
        endpoint: 'http://minio:9000',
        publicEndpoint: 'https://files.example.test',
        forcePathStyle: true,
      },
    ],
  ];

  it.each(cases)('puts the origin the SDK signs for in the policy: %s', async (_, extra) => {
    const settings = { ...base, ...extra };
    const store = createS3Storage(settings);
    try {
      const url = await store.signedGetUrl!('builds/b/photos/p/web.jpg', {
        contentType: 'image/jpeg',
        contentDisposition: 'inline',
        cacheControl: 'private, max-age=3600',
        signingDate: new Date(),
        expiresInSeconds: 60,
      });
      expect(store.signedUrlOrigin).toBe(signedUrlOriginFor(settings));
      expect(new URL(url).origin).toBe(store.signedUrlOrigin);
    } finally {
      store.close();
    }
  });

  it('has no signing at all when signed links are off', () => {
    const store = createS3Storage({ ...base, presignedUrls: false });
    expect(store.signedGetUrl).toBeUndefined();
    expect(store.signedUrlOrigin).toBeUndefined();
    store.close();
  });

  it('signs at the start of the window, for the window and a grace, and lets the redirect be kept until the window ends', () => {
    const at = Date.UTC(2026, 11, 2, 10, 59, 30);
    expect(signingWindow(at, 3600)).toEqual({
      signingDate: new Date(Date.UTC(2026, 11, 2, 10, 0, 0)),
      expiresInSeconds: 3600 + signedUrlGraceSeconds,
      redirectMaxAge: 30,
    });
    // A URL handed out in the window's last second still lives for the grace.
    const last = signingWindow(Date.UTC(2026, 11, 2, 10, 59, 59, 999), 3600);
    expect(
      last.signingDate.getTime() + last.expiresInSeconds * 1000 - Date.UTC(2026, 11, 2, 11),
    ).toBe(signedUrlGraceSeconds * 1000);
    expect(signingWindow(Date.UTC(2026, 11, 2, 11), 3600).redirectMaxAge).toBe(3600);
  });
});
