/**
 * A person's torque wrenches and when each was last calibrated: offered when they record a
 * reading, so the reading keeps which wrench it was taken with and whether that wrench was
 * due for calibration (shared/install-log/wrenches).
 */
import { z } from 'zod';
import { isoDateSchema, trimmed } from './common';

const wrenchFields = {
  /** How the person tells it apart: a name, a serial number, an asset tag. */
  name: trimmed(120, 'Name').min(1, {
    message: 'Name the wrench, e.g. “3/8 in. click, 10–80 lbf·ft” or its serial number',
  }),
  /** When it was last calibrated (YYYY-MM-DD); null when not known. */
  calibratedOn: isoDateSchema.nullable().optional(),
};

export const createWrenchInputSchema = z.object(wrenchFields).strict();
export type CreateWrenchInput = z.infer<typeof createWrenchInputSchema>;

export const updateWrenchInputSchema = z
  .object(wrenchFields)
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type UpdateWrenchInput = z.infer<typeof updateWrenchInputSchema>;

/** A wrench as the API returns it (only ever to its owner). */
export type Wrench = {
  id: string;
  name: string;
  calibratedOn: string | null;
  createdAt: string;
  updatedAt: string;
};
