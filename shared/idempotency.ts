/**
 * The offline queue's write keys: the header's name and how long the server keeps a key
 * (and so how long a queued write may wait). No zod here: the client's first load takes
 * these without the schema library.
 */
export const idempotencyKeyHeader = 'Idempotency-Key';

/** How long the server keeps a key, and so how long a queued write may wait to be sent. */
export const idempotencyKeepDays = 7;
