/**
 * The offline queue's write keys: the header's name and how long the server keeps a key
 * (and so how long a queued write may wait). No zod here: the client's first load takes
 * these without the schema library.
 */
export const idempotencyKeyHeader = 'Idempotency-Key';

/**
 * The user a queued write was recorded by, sent with it: the server refuses it (401, so it
 * stays queued) when the session belongs to someone else, so an entry is never stored as
 * another user's (another tab may have signed in as someone else meanwhile).
 */
export const recordedByHeader = 'Headroom-Recorded-By';

/** How long the server keeps a key, and so how long a queued write may wait to be sent. */
export const idempotencyKeepDays = 7;
