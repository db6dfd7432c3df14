/**
 * The object store: photos and attachments in an S3 bucket, or any
 * S3-compatible store (MinIO, Ceph, R2, the s3rver fake the tests run), through
 * the AWS SDK for JavaScript v3. Same keys and same behaviour as the local disk
 * (tests/api/storage-contract.test.ts runs one set of tests on both), plus
 * signed GET URLs so browsers fetch files from the store, not through the app.
 *
 * Every object Headroom writes carries its SHA-256 as user metadata
 * (x-amz-meta-sha256) and is sent with Content-MD5, so the store refuses a body
 * damaged on the way and `npm run storage:migrate` can tell a copy is whole
 * from a HEAD request.
 */
import { createHash } from 'node:crypto';
import type { Readable } from 'node:stream';
import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  ListObjectsV2Command,
  PutObjectCommand,
  S3Client,
  type S3ClientConfig,
} from '@aws-sdk/client-s3';
import { getSignedUrl } from '@aws-sdk/s3-request-presigner';
import type { ObjectStoreSettings } from '@server/storage-config';
import { assertValidKey, sha256Hex, StorageUnavailableError, type Storage } from './storage';

export type S3Storage = Storage &
  Required<Pick<Storage, 'open' | 'head' | 'list'>> & {
    bucket: string;
    /** Closes the SDK's connections (tests and scripts; the server keeps its store to the end). */
    close(): void;
  };

/** Longest a signed URL may live under SigV4. */
export const maxSignedSeconds = 7 * 24 * 3600;

/** A missing object: 404 (NoSuchKey from GET, NotFound from HEAD). */
function isNotFound(err: unknown) {
  const e = err as { name?: string; $metadata?: { httpStatusCode?: number } };
  return e?.name === 'NoSuchKey' || e?.name === 'NotFound' || e?.$metadata?.httpStatusCode === 404;
}

/** Errors that say the store is away or overloaded, not that Headroom asked wrongly. */
function isUnavailable(err: unknown) {
  const e = err as { name?: string; code?: string; $metadata?: { httpStatusCode?: number } };
  const status = e?.$metadata?.httpStatusCode;
  if (status !== undefined) return status >= 500 || status === 429;
  return (
    ['TimeoutError', 'RequestTimeout', 'AbortError'].includes(e?.name ?? '') ||
    /^(ECONNREFUSED|ECONNRESET|ETIMEDOUT|EPIPE|ENOTFOUND|EAI_AGAIN|EHOSTUNREACH|ENETUNREACH)$/.test(
      e?.code ?? '',
    )
  );
}

/**
 * The origin of the URLs the SDK signs for these settings (checked against the
 * SDK in tests/unit/storage-config.test.ts): the endpoint's, with the bucket as
 * a subdomain unless path-style; on AWS itself the regional endpoint. A bucket
 * name with dots cannot be a subdomain under TLS, so the SDK uses the path then.
 */
export function signedUrlOriginFor(s: ObjectStoreSettings): string {
  const base = new URL(s.publicEndpoint ?? s.endpoint ?? `https://s3.${s.region}.amazonaws.com`);
  const pathStyle = s.forcePathStyle || (s.bucket.includes('.') && base.protocol === 'https:');
  return pathStyle ? base.origin : `${base.protocol}//${s.bucket}.${base.host}`;
}

export function createS3Storage(settings: ObjectStoreSettings): S3Storage {
  const { bucket } = settings;
  const clientConfig = (endpoint: string | null): S3ClientConfig => ({
    region: settings.region,
    ...(endpoint ? { endpoint } : {}),
    forcePathStyle: settings.forcePathStyle,
    ...(settings.credentials ? { credentials: settings.credentials } : {}),
    // Checksums only where S3 requires them: several S3-compatible stores (and the
    // fake) do not know the newer CRC headers; Content-MD5 covers uploads instead.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
    // A store that does not answer fails the request in seconds, not minutes;
    // the SDK retries twice more with backoff before giving up.
    requestHandler: { connectionTimeout: 3000, requestTimeout: 60_000 },
    maxAttempts: 3,
  });
  const s3 = new S3Client(clientConfig(settings.endpoint));
  // Every call: an outage becomes StorageUnavailableError (503), anything else is left as it is.
  const client = {
    send: (async (command: Parameters<S3Client['send']>[0]) => {
      try {
        return await s3.send(command);
      } catch (err) {
        throw isUnavailable(err) ? new StorageUnavailableError(err) : err;
      }
    }) as S3Client['send'],
  };
  // Signing needs no network: a second client only to put the public host in the URL.
  const signer =
    settings.publicEndpoint && settings.publicEndpoint !== settings.endpoint
      ? new S3Client(clientConfig(settings.publicEndpoint))
      : s3;

  const store: S3Storage = {
    bucket,

    async put(key, body, contentType) {
      assertValidKey(key);
      await client.send(
        new PutObjectCommand({
          Bucket: bucket,
          Key: key,
          Body: body,
          ContentType: contentType,
          ContentLength: body.length,
          ContentMD5: createHash('md5').update(body).digest('base64'),
          Metadata: { sha256: sha256Hex(body) },
        }),
      );
    },

    async get(key) {
      assertValidKey(key);
      try {
        const res = await client.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
        return Buffer.from(await res.Body!.transformToByteArray());
      } catch (err) {
        if (isNotFound(err)) return null;
        throw err;
      }
    },

    async open(key) {
      assertValidKey(key);
      try {
        const res = await client.send(new GetObjectCommand({ Bucket: bucket, Key: key }));
        return {
          body: res.Body as Readable,
          size: Number(res.ContentLength ?? 0),
          ...(res.ETag ? { etag: res.ETag } : {}),
        };
      } catch (err) {
        if (isNotFound(err)) return null;
        throw err;
      }
    },

    async head(key) {
      assertValidKey(key);
      try {
        const res = await client.send(new HeadObjectCommand({ Bucket: bucket, Key: key }));
        const sha256 = res.Metadata?.sha256;
        return { size: Number(res.ContentLength ?? 0), ...(sha256 ? { sha256 } : {}) };
      } catch (err) {
        if (isNotFound(err)) return null;
        throw err;
      }
    },

    async *list(prefix = '') {
      const folder = prefix.replace(/\/+$/, '');
      if (folder) assertValidKey(folder);
      let token: string | undefined;
      do {
        const page = await client.send(
          new ListObjectsV2Command({
            Bucket: bucket,
            ...(folder ? { Prefix: `${folder}/` } : {}),
            ...(token ? { ContinuationToken: token } : {}),
          }),
        );
        for (const o of page.Contents ?? []) if (o.Key) yield o.Key;
        token = page.IsTruncated ? page.NextContinuationToken : undefined;
      } while (token);
    },

    async delete(key) {
      assertValidKey(key);
      // S3 answers 204 for a key that is not there, which is what the interface asks.
      await client.send(new DeleteObjectCommand({ Bucket: bucket, Key: key }));
    },

    close() {
      s3.destroy();
      if (signer !== s3) signer.destroy();
    },
  };

  if (!settings.presignedUrls) return store;
  return Object.assign(store, {
    signedUrlOrigin: signedUrlOriginFor(settings),
    async signedGetUrl(key: string, o: Parameters<NonNullable<Storage['signedGetUrl']>>[1]) {
      assertValidKey(key);
      if (!(o.expiresInSeconds > 0 && o.expiresInSeconds <= maxSignedSeconds)) {
        throw new Error(`A signed URL lives 1 s to 7 days, not ${o.expiresInSeconds} s`);
      }
      return getSignedUrl(
        signer,
        new GetObjectCommand({
          Bucket: bucket,
          Key: key,
          ResponseContentType: o.contentType,
          ResponseContentDisposition: o.contentDisposition,
          ResponseCacheControl: o.cacheControl,
        }),
        { expiresIn: o.expiresInSeconds, signingDate: o.signingDate },
      );
    },
  });
}
