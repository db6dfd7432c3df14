/**
 * Who may do what on a build. One table, read by the server's access middleware
 * (the authority) and by the client only to hide controls a role cannot use.
 * Roles are per build: the same person can own one build and crew on another.
 */
export const roles = ['owner', 'crew', 'shop', 'viewer'] as const;
export type Role = (typeof roles)[number];

export const roleLabels: Record<Role, string> = {
  owner: 'Owner',
  crew: 'Crew',
  shop: 'Shop',
  viewer: 'Viewer',
};

export const roleDescriptions: Record<Role, string> = {
  owner: 'Everything, including money, members and deleting the build',
  crew: 'Works on the truck: parts without money, install steps, torque, photos',
  shop: 'A specialist shop: only the parts sent to it and its own quote',
  viewer: 'Follows along: reads everything except money, changes nothing',
};

const everyone: readonly Role[] = roles;
const ownerOnly: readonly Role[] = ['owner'];

export const permissions = {
  'build:read': everyone,
  'build:update': ownerOnly,
  'build:delete': ownerOnly,
  // Recent activity on the overview. A shop sees only its parts' events; none carries money.
  'activity:read': everyone,
  'members:read': everyone,
  'members:manage': ownerOnly,
  'money:read': ownerOnly,
  // A shop reads only the parts sent to it; the parts service applies that filter.
  'parts:read': everyone,
  'parts:create': ownerOnly,
  // Crew and shops change only a part's status and dates (partProgressFields).
  'parts:update': ['owner', 'crew', 'shop'],
  'parts:delete': ownerOnly,
  'parts:import': ownerOnly,
  'budget:read': ownerOnly,
  // The estimate holds no money: every member reads it; only the owner edits its assumptions.
  'estimate:read': everyone,
  'assumptions:update': ownerOnly,
  // Install log. A shop reads only the steps linked to its parts; the install-log service applies that.
  'install:read': everyone,
  'install:write': ['owner', 'crew'],
  'install:delete': ownerOnly,
  // Sign off over blockers (with a reason), and reopen a signed-off step.
  'install:override': ownerOnly,
  // Photo log. A shop sees and adds photos only for its parts (and the steps linked to them).
  'photos:read': everyone,
  'photos:upload': ['owner', 'crew', 'shop'],
  'photos:update': ['owner', 'crew', 'shop'],
  'photos:delete': ownerOnly,
  // Bench results (injector flow sheets). A shop reads and writes only its own sheets of the
  // parts sent to it, and crew never changes a shop's sheet: see canChangeBenchSheet.
  'bench:read': everyone,
  'bench:write': ['owner', 'crew', 'shop'],
  'bench:delete': ['owner', 'shop'],
  // Dyno days. A shop records sessions at its own dyno and sees only the sessions assigned to it;
  // the dyno service applies that. Owner and crew assign a session to a shop.
  'dyno:read': everyone,
  'dyno:write': ['owner', 'crew', 'shop'],
  'dyno:assign': ['owner', 'crew'],
  'dyno:delete': ownerOnly,
  // Timeline. Every member reads it (a shop: the target and the parts sent to it); the owner
  // sets its buffer, pace and time zone, and keeps the milestones, which shops do not see.
  'timeline:read': everyone,
  'timeline:settings': ownerOnly,
  'milestones:read': ['owner', 'crew', 'viewer'],
  'milestones:write': ownerOnly,
  // Each member makes, replaces and stops their own calendar feed.
  'calendar:own-feed': everyone,
  // Invite by e-mail, list, resend and revoke invitations.
  'invitations:manage': ownerOnly,
  // Each member chooses, for themself only, which notices they receive.
  'notices:own-preferences': everyone,
  // The public page: switched on and off, its address renewed, what it shows and which photos.
  'share:manage': ownerOnly,
  // The printable build sheet of the whole build. Not a shop: it sees only the parts sent to it.
  'sheet:read': ['owner', 'crew', 'viewer'],
} as const satisfies Record<string, readonly Role[]>;

export type Action = keyof typeof permissions;

export function can(role: Role, action: Action): boolean {
  return (permissions[action] as readonly Role[]).includes(role);
}

/**
 * What a member may do, named after what it allows, for pages that show or hide controls (the
 * server checks the actions themselves). Each name reads one action of the table above.
 */
const capabilityActions = {
  canEditBuild: 'build:update',
  canDeleteBuild: 'build:delete',
  canSeeMoney: 'money:read',
  canSeeBudget: 'budget:read',
  canAddParts: 'parts:create',
  /** Every field of a part, its money and its ratings; others change only status and dates. */
  canEditPartFully: 'parts:create',
  canUpdatePartProgress: 'parts:update',
  canDeleteParts: 'parts:delete',
  canImportParts: 'parts:import',
  canEditAssumptions: 'assumptions:update',
  canWorkOnSteps: 'install:write',
  canDeleteSteps: 'install:delete',
  /** Sign off over blockers with a reason, and reopen a signed-off step. */
  canOverrideSignOff: 'install:override',
  canDeletePhotos: 'photos:delete',
  canEditMilestones: 'milestones:write',
  canInviteMembers: 'invitations:manage',
  canChangeTimelineSettings: 'timeline:settings',
} as const satisfies Record<string, Action>;

export type Capabilities = Record<keyof typeof capabilityActions, boolean>;

/** The named capabilities of a role: `capabilities(role).canOverrideSignOff`. */
export function capabilities(role: Role): Capabilities {
  const out = {} as Capabilities;
  for (const [name, action] of Object.entries(capabilityActions)) {
    out[name as keyof Capabilities] = can(role, action);
  }
  return out;
}

/** Who entered a bench sheet: the shop member, or null when the owner or crew typed it in. */
type BenchSheetAuthor = { shopUserId: string | null };

/**
 * Whether a member may edit a bench sheet (its values, its original): the owner any sheet;
 * crew the sheets no shop entered (a shop's sheet is the shop's own statement of its work);
 * a shop only the sheets it entered. The server also checks that a shop's part was sent to it.
 */
export function canChangeBenchSheet(role: Role, userId: string, sheet: BenchSheetAuthor): boolean {
  if (!can(role, 'bench:write')) return false;
  if (role === 'owner') return true;
  if (role === 'shop') return sheet.shopUserId === userId;
  return sheet.shopUserId === null;
}

/** Whether a member may delete a bench sheet or its original: the owner any, a shop its own. */
export function canDeleteBenchSheet(role: Role, userId: string, sheet: BenchSheetAuthor): boolean {
  if (!can(role, 'bench:delete')) return false;
  return role === 'owner' || sheet.shopUserId === userId;
}

/** Who uploaded a photo (null for photos whose uploader has left). */
type PhotoAuthor = { uploadedBy?: { id: string } | null };

/** Photo caption rule: owner and crew caption any photo; a shop only the photos it uploaded. */
export function canCaptionPhoto(role: Role, userId: string, photo: PhotoAuthor): boolean {
  if (!can(role, 'photos:update')) return false;
  return role !== 'shop' || photo.uploadedBy?.id === userId;
}

/**
 * Where a member adds photos: owner and crew to install steps and parts; a shop only to the
 * parts sent to it, never to an install step. (The server also checks the part was sent to it.)
 */
export function canAddPhotosTo(role: Role, subject: 'step' | 'part'): boolean {
  if (!can(role, 'photos:upload')) return false;
  return subject === 'part' || role !== 'shop';
}
