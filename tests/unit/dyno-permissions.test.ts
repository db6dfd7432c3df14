import { describe, expect, it } from 'vitest';
import { can, roles } from '@shared/permissions';

// Issue #10, "Who may": owner and crew record and assign, a shop records at its own dyno
// (the service limits it to its sessions), a viewer reads, only the owner deletes.
describe('dyno permissions', () => {
  it('lets every member read dyno days', () => {
    expect(roles.filter((r) => can(r, 'dyno:read'))).toEqual(['owner', 'crew', 'shop', 'viewer']);
  });

  it('lets owner, crew and shop record; only owner and crew assign; only the owner deletes', () => {
    expect(roles.filter((r) => can(r, 'dyno:write'))).toEqual(['owner', 'crew', 'shop']);
    expect(roles.filter((r) => can(r, 'dyno:assign'))).toEqual(['owner', 'crew']);
    expect(roles.filter((r) => can(r, 'dyno:delete'))).toEqual(['owner']);
  });
});
