import { describe, expect, it } from 'vitest';
import { signUpInputSchema } from '@shared/schemas/auth';
import { createBuildInputSchema, updateBuildInputSchema } from '@shared/schemas/builds';
import { fieldsFromZod } from '@server/lib/errors';

describe('shared schemas', () => {
  it('trims and lower-cases e-mail on sign-up', () => {
    const parsed = signUpInputSchema.parse({
      email: '  Ada@Example.TEST ',
      password: 'x'.repeat(10),
      displayName: ' Ada ',
    });
    expect(parsed.email).toBe('ada@example.test');
    expect(parsed.displayName).toBe('Ada');
  });

  it('keeps money as whole cents', () => {
    const base = {
      name: 'n',
      cylinders: 8,
      aspiration: 'single-turbo',
      targetPowerHp: 600,
      targetPowerBasis: 'crank',
    };
    expect(createBuildInputSchema.safeParse({ ...base, budgetCents: 1999 }).success).toBe(true);
    expect(createBuildInputSchema.safeParse({ ...base, budgetCents: 19.99 }).success).toBe(false);
    expect(createBuildInputSchema.safeParse({ ...base, budgetCents: -1 }).success).toBe(false);
  });

  it('an edit sends only what changed and never fills defaults', () => {
    expect(updateBuildInputSchema.parse({ name: 'New' })).toEqual({ name: 'New' });
  });

  it('turns zod issues into one message per field, naming unknown keys', () => {
    const r = createBuildInputSchema.safeParse({ bogus: 1 });
    expect(r.success).toBe(false);
    if (!r.success) {
      const fields = fieldsFromZod(r.error);
      expect(fields.bogus).toBe('Unknown field');
      expect(fields.name).toBeTruthy();
    }
  });
});
