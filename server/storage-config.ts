/**
 * Where photos and attachments are kept: the local disk (STORAGE_DIR, the
 * default) or an S3-compatible object store (STORAGE=s3). Parsed here, apart
 * from the rest of the config, so the seed and `npm run storage:migrate` read
 * the same settings without needing the server's (mail, ports …).
 *
 * Credentials are never settings of Headroom's own: the AWS SDK reads them the
 * usual way (AWS_ACCESS_KEY_ID / AWS_SECRET_ACCESS_KEY / AWS_SESSION_TOKEN,
 * AWS_PROFILE, or the machine's role).
 */
import { z } from 'zod';

const flag = z.enum(['0', '1']);
const httpUrl = z.url({ protocol: /^https?$/, message: 'must be an http(s) URL' });

/** The environment variables of the store; spread into the server's schema. */
export const storageEnv = {
  /** local (STORAGE_DIR on this machine's disk) or s3 (an S3-compatible object store). */
  STORAGE: z.enum(['local', 's3']).default('local'),
  S3_BUCKET: z.string().optional(),
  /** The bucket's region; AWS_REGION when unset, else us-east-1 (what most S3-compatible stores expect). */
  S3_REGION: z.string().min(1).optional(),
  AWS_REGION: z.string().min(1).optional(),
  /** An S3-compatible store's URL (MinIO, Ceph, R2, a local fake); unset for AWS itself. */
  S3_ENDPOINT: httpUrl.optional(),
  /** The store's URL as browsers reach it, when it differs from S3_ENDPOINT (signed links use it). */
  S3_PUBLIC_ENDPOINT: httpUrl.optional(),
  /** 1: https://host/bucket/key (most S3-compatible stores); 0: https://bucket.host/key. */
  S3_FORCE_PATH_STYLE: flag.default('0'),
  /** 1: browsers fetch files from the store by short-lived signed links; 0: the app streams them. */
  S3_PRESIGNED_URLS: flag.default('1'),
};

const storageSchema = z.object(storageEnv);
type StorageEnv = z.infer<typeof storageSchema>;

export type ObjectStoreSettings = {
  bucket: string;
  region: string;
  /** null: AWS's own endpoint for the region. */
  endpoint: string | null;
  /** Where browsers reach the store, when not at endpoint. */
  publicEndpoint: string | null;
  forcePathStyle: boolean;
  /** Serve by redirecting to a signed URL (true) or by streaming through the app (false). */
  presignedUrls: boolean;
  /** Explicit keys (tests and the local fake); without them the SDK's default chain is used. */
  credentials?: { accessKeyId: string; secretAccessKey: string; sessionToken?: string };
};

/**
 * S3's rules for a general-purpose bucket name: 3–63 characters of lowercase
 * letters, digits, dots and hyphens, starting and ending with a letter or
 * digit, no two dots in a row, not an IP address.
 */
export function bucketNameProblem(name: string): string | null {
  if (name.length < 3 || name.length > 63) return 'must be 3–63 characters long';
  if (!/^[a-z0-9][a-z0-9.-]*[a-z0-9]$/.test(name)) {
    return 'may hold only lowercase letters, digits, dots and hyphens, and must start and end with a letter or digit';
  }
  if (name.includes('..')) return 'may not hold two dots in a row';
  if (/^\d+\.\d+\.\d+\.\d+$/.test(name)) return 'may not look like an IP address';
  return null;
}

/** A line naming what is wrong with the store's settings, or null when they hold together. */
export function checkStorageEnv(e: StorageEnv): string | null {
  if (e.STORAGE !== 's3') return null;
  if (!e.S3_BUCKET) return 'S3_BUCKET: STORAGE=s3 needs the bucket to keep files in';
  const problem = bucketNameProblem(e.S3_BUCKET);
  return problem ? `S3_BUCKET: ${JSON.stringify(e.S3_BUCKET)} ${problem}` : null;
}

export function objectStoreFrom(e: StorageEnv): ObjectStoreSettings | null {
  if (e.STORAGE !== 's3' || !e.S3_BUCKET) return null;
  return {
    bucket: e.S3_BUCKET,
    region: e.S3_REGION ?? e.AWS_REGION ?? 'us-east-1',
    endpoint: e.S3_ENDPOINT ?? null,
    publicEndpoint: e.S3_PUBLIC_ENDPOINT ?? null,
    forcePathStyle: e.S3_FORCE_PATH_STYLE === '1',
    presignedUrls: e.S3_PRESIGNED_URLS === '1',
  };
}

/**
 * The store's settings alone, for scripts (seed, storage:migrate): the object
 * store's, or null for the local disk. Throws with the setting's name when one is wrong.
 */
export function objectStoreFromEnv(env: NodeJS.ProcessEnv = process.env) {
  const parsed = storageSchema.safeParse(env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
    throw new Error(`Fix these settings: ${lines.join('; ')}`);
  }
  const problem = checkStorageEnv(parsed.data);
  if (problem) throw new Error(`Fix this setting: ${problem}`);
  return objectStoreFrom(parsed.data);
}
