import { z } from 'zod';
import { roles } from '@shared/permissions';
import { centsSchema, currencies, currencySchema, isoDateSchema, trimmed } from './common';
import { hasAtMostDecimals } from './precision';
import { timeZoneSchema } from './time-zone';
import { maxCalibrationMonths, minCalibrationMonths } from '@shared/install-log/wrenches';

export {
  aspirationLabels,
  aspirations,
  powerBases,
  powerBasisLabels,
} from '@shared/builds/vocabulary';
import { aspirations, powerBases } from '@shared/builds/vocabulary';

const optionalNumber = (schema: z.ZodNumber) => schema.nullable().optional();

/**
 * Power and torque are kept to tenths (numeric(8,1) columns). A figure with more decimals
 * would be stored as another number, and one under 0.05 as 0, which the estimate cannot use,
 * so such figures are refused, not silently changed.
 */
const tenths = (schema: z.ZodNumber, what: string) =>
  schema.refine((v) => hasAtMostDecimals(v, 1), {
    message: `Round to one decimal place: the build keeps ${what} to 0.1`,
  });

/** The fields an owner types in; used by the create and edit forms and by the server. */
export const buildFieldsSchema = z.object({
  name: trimmed(120, 'Name').min(1, { message: 'Give the build a name' }),
  vehicleYear: optionalNumber(
    z
      .number({ message: 'Enter a year' })
      .int({ message: 'Enter a whole year' })
      .min(1950, { message: 'Year must be 1950 or later' })
      .max(2100, { message: 'Year must be 2100 or earlier' }),
  ),
  vehicleDescription: trimmed(200, 'Vehicle').optional(),
  engineDescription: trimmed(200, 'Engine').optional(),
  displacementLiters: optionalNumber(
    z
      .number({ message: 'Enter liters, e.g. 6.7' })
      .min(0.5, { message: 'At least 0.5 L' })
      .max(20, { message: 'At most 20 L' }),
  ),
  cylinders: z
    .number({ message: 'Enter the number of cylinders' })
    .int({ message: 'Cylinders is a whole number' })
    .min(1, { message: 'At least 1 cylinder' })
    .max(16, { message: 'At most 16 cylinders' }),
  aspiration: z.enum(aspirations, { message: 'Choose an aspiration from the list' }),
  transmission: trimmed(200, 'Transmission').optional(),
  stockPowerHp: tenths(
    z
      .number({ message: 'Enter horsepower' })
      .positive({ message: 'Power must be above zero' })
      .max(5000, { message: 'At most 5000 hp' }),
    'power',
  )
    .nullable()
    .optional(),
  stockPowerBasis: z.enum(powerBases, { message: 'Choose crank or wheel' }).optional(),
  targetPowerHp: tenths(
    z
      .number({ message: 'Enter the target horsepower' })
      .positive({ message: 'Power must be above zero' })
      .max(5000, { message: 'At most 5000 hp' }),
    'power',
  ),
  targetPowerBasis: z.enum(powerBases, { message: 'Choose crank or wheel' }),
  targetTorqueLbft: tenths(
    z
      .number({ message: 'Enter torque in lbf·ft' })
      .positive({ message: 'Torque must be above zero' })
      .max(10000, { message: 'At most 10000 lbf·ft' }),
    'torque',
  )
    .nullable()
    .optional(),
  targetDate: isoDateSchema.nullable().optional(),
  targetEvent: trimmed(200, 'Event').optional(),
  budgetCents: centsSchema.optional(),
  currency: currencySchema.optional(),
  /** The IANA zone the build's days are counted in; a new build takes the owner's browser's. */
  timeZone: timeZoneSchema.optional(),
  /** Months a torque wrench's calibration holds on this build (default 12); older readings are flagged. */
  wrenchCalibrationMonths: z
    .number({ message: 'Enter months' })
    .int({ message: 'A whole number of months' })
    .min(minCalibrationMonths, { message: `At least ${minCalibrationMonths} month` })
    .max(maxCalibrationMonths, { message: `At most ${maxCalibrationMonths} months` })
    .optional(),
});

export const createBuildInputSchema = buildFieldsSchema.strict();
export type CreateBuildInput = z.infer<typeof createBuildInputSchema>;

export const updateBuildInputSchema = buildFieldsSchema
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: 'Nothing to change' });
export type UpdateBuildInput = z.infer<typeof updateBuildInputSchema>;

export const roleSchema = z.enum(roles, { message: 'Choose owner, crew, shop or viewer' });

/** A build as the API returns it. budgetCents is absent for roles that may not see money. */
export type Build = {
  name: string;
  vehicleYear: number | null;
  vehicleDescription: string;
  engineDescription: string;
  displacementLiters: number | null;
  cylinders: number;
  aspiration: (typeof aspirations)[number];
  transmission: string;
  stockPowerHp: number | null;
  stockPowerBasis: (typeof powerBases)[number];
  targetPowerHp: number;
  targetPowerBasis: (typeof powerBases)[number];
  targetTorqueLbft: number | null;
  targetDate: string | null;
  targetEvent: string;
  budgetCents?: number;
  currency: (typeof currencies)[number];
  /** Null until chosen: the timeline counts in UTC meanwhile. */
  timeZone: string | null;
  wrenchCalibrationMonths: number;
  id: string;
  myRole: (typeof roles)[number];
  memberCount: number;
  createdAt: string;
  updatedAt: string;
};

export const updateMemberInputSchema = z.object({ role: roleSchema }).strict();
export type UpdateMemberInput = z.infer<typeof updateMemberInputSchema>;

/** A member as the API returns it; email only for owners. */
export type Member = {
  userId: string;
  displayName: string;
  email?: string;
  role: (typeof roles)[number];
  joinedAt: string;
};
