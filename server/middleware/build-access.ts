import type { Knex } from 'knex';
import { can, type Role } from '@shared/permissions';
import { idSchema } from '@shared/schemas/common';
import type { BuildAccess } from '@server/lib/deps';
import { ForbiddenError, NotFoundError, UnauthorizedError } from '@server/lib/errors';

/** How the access check learns a member's role; the members feature supplies it. */
export type FindRole = (knex: Knex, buildId: string, userId: string) => Promise<Role | undefined>;

/**
 * The one access check for everything under /api/builds/:buildId.
 * Signed out → 401; not a member (or no such build) → 404, so a build's
 * existence is never disclosed; a member whose role may not → 403.
 * It also marks the response money-free for roles that may not see money.
 */
export function createBuildAccess(knex: Knex, findRole: FindRole): BuildAccess {
  return (action) => async (req, res, next) => {
    if (!req.user) throw new UnauthorizedError();
    const parsed = idSchema.safeParse(req.params.buildId);
    if (!parsed.success) throw new NotFoundError('Build not found');
    // Usually found with the session already (one statement for both); asked here otherwise.
    const known = req.sessionMembership;
    const found = known && known.buildId === parsed.data.toLowerCase();
    const role = found ? (known.role ?? undefined) : await findRole(knex, parsed.data, req.user.id);
    if (!role) throw new NotFoundError('Build not found');
    req.membership = { buildId: parsed.data, role, build: (found && known.build) || undefined };
    res.locals.hideMoney = !can(role, 'money:read');
    if (!can(role, action)) throw new ForbiddenError();
    next();
  };
}
