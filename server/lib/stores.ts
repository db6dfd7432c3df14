/** The store the settings choose: the object store with STORAGE=s3, else the local disk. */
import type { ObjectStoreSettings } from '@server/storage-config';
import { createLocalDiskStorage, type Storage } from './storage';
import { createS3Storage } from './storage-s3';

export function createStorage(settings: {
  storageDir: string;
  objectStore: ObjectStoreSettings | null;
}): Storage & { close?(): void } {
  return settings.objectStore
    ? createS3Storage(settings.objectStore)
    : createLocalDiskStorage(settings.storageDir);
}

/** A line for the start-up log: where files go, without secrets. */
export function describeStorage(settings: {
  storageDir: string;
  objectStore: ObjectStoreSettings | null;
}): string {
  const s = settings.objectStore;
  if (!s) return `files on the local disk in ${settings.storageDir}`;
  const where = s.endpoint ?? `AWS S3 (${s.region})`;
  const serving = s.presignedUrls ? 'served by signed links' : 'streamed through the app';
  return `files in the object store: bucket ${s.bucket} at ${where}, ${serving}`;
}
