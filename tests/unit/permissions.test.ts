import { describe, expect, it } from 'vitest';
import { can, roles } from '../../shared/permissions';

// The role table of product.md, "Users and roles (per build)".
describe('can()', () => {
  it('gives the owner everything', () => {
    for (const action of [
      'build:read',
      'build:update',
      'build:delete',
      'members:manage',
      'money:read',
    ] as const) {
      expect(can('owner', action)).toBe(true);
    }
  });

  it('shows money to nobody but the owner', () => {
    expect(roles.filter((r) => can(r, 'money:read'))).toEqual(['owner']);
  });

  it('lets every role read the build and nobody but the owner change members or delete', () => {
    expect(roles.every((r) => can(r, 'build:read'))).toBe(true);
    expect(roles.filter((r) => can(r, 'members:manage'))).toEqual(['owner']);
    expect(roles.filter((r) => can(r, 'build:delete'))).toEqual(['owner']);
  });
});
