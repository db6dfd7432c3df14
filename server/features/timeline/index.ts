/** The timeline feature's public surface: the weekly digest's worker, started by server/index.ts. */
export { createDigestWorker, type DigestWorker } from './digest.worker';
