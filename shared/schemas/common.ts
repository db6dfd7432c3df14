import { z } from 'zod';

/** Ids are UUIDs; anything else in a path is simply "not found". */
export const idSchema = z.uuid({ message: 'Not a valid id' });

/** Money is always an integer count of minor units (cents), never a float. */
export const centsSchema = z
  .number({ message: 'Enter an amount' })
  .int({ message: 'Money is a whole number of cents' })
  .min(0, { message: 'Money cannot be negative' })
  .max(100_000_000_00, { message: 'That amount is too large' });

/** Calendar dates Headroom accepts: wide enough for any vehicle's life, narrow enough for PostgreSQL. */
export const earliestDate = '1900-01-01';
export const latestDate = '2100-12-31';

export const isoDateSchema = z.iso
  .date({ message: 'Use a date like 2027-05-30' })
  .refine((d) => d >= earliestDate && d <= latestDate, {
    message: `Use a date between ${earliestDate} and ${latestDate}`,
  });

/** PostgreSQL refuses U+0000 in text; a NUL is never part of anything a person means to type. */
export const hasNul = (s: string) => s.includes('\u0000');
export const nulMessage = 'Remove the invisible NUL character from this text';

/** Currencies offered for a build's money; ISO 4217 codes. */
export const currencies = ['USD', 'CAD', 'AUD', 'NZD', 'EUR', 'GBP', 'MXN', 'ZAR'] as const;
export const currencySchema = z.enum(currencies, { message: 'Choose a currency from the list' });

export const trimmed = (max: number, label = 'This') =>
  z
    .string({ message: `${label} must be text` })
    .trim()
    .max(max, { message: `${label} must be at most ${max} characters` })
    .refine((s) => !hasNul(s), { message: nulMessage });

export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional(),
  }),
});
export type ApiErrorBody = z.infer<typeof apiErrorSchema>;
