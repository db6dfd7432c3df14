/**
 * The header that makes a create safe to send twice: the offline queue gives each write
 * a key, and the server stores the write once per user and key, answering a repeat with
 * the first answer.
 */
import { z } from 'zod';

export { idempotencyKeepDays, idempotencyKeyHeader } from '@shared/idempotency';

export const idempotencyKeySchema = z.uuid({
  message: 'Send a UUID (a new one for each write, the same one when sending it again)',
});
