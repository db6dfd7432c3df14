import { z } from 'zod';
import { canonicalTimeZone, isTimeZone } from '@shared/dates';

/**
 * An IANA time zone name ("America/Denver"); a build's "today" is counted in it. Its own
 * module, so the build schema takes it without the timeline's other schemas.
 */
export const timeZoneSchema = z
  .string({ message: 'Choose a time zone' })
  .trim()
  .refine(isTimeZone, { message: 'Choose a time zone from the list, like America/Denver' })
  .transform((name) => canonicalTimeZone(name) ?? name);
