import { ROLES, type Role } from './common';

const ALL: readonly Role[] = ROLES;

/**
 * Who may do what. The server enforces this table on every route; the app reads it only to hide
 * controls the server would refuse anyway.
 */
export const PERMISSIONS = {
  /** See the team's members. */
  'team.read': ALL,
  /** Invite people, change roles, remove members, revoke invitations. */
  'team.manage': ['owner'],
  /** Read sites, results and reports (contractors: only sites they are invited to). */
  'site.read': ALL,
  'site.create': ['owner', 'engineer'],
  /** Edit a site and all of its design bases. */
  'site.edit': ['owner', 'engineer'],
  /** Edit the touch-safety basis of a site (safety officers may do only this). */
  'site.editTouchBasis': ['owner', 'engineer', 'safety'],
  'site.delete': ['owner'],
  /** Invite contractors to a site. */
  'site.members': ['owner', 'engineer'],
  /** Add, edit and delete lines and vessels; size a site. */
  'lines.edit': ['owner', 'engineer'],
  /** Add and edit the team's own materials and finishes. */
  'library.edit': ['owner', 'engineer'],
  'revisions.issue': ['owner', 'engineer'],
  'schedule.import': ['owner', 'engineer', 'contractor'],
  'surfaces.create': ['owner', 'engineer', 'safety', 'contractor'],
  'surfaces.assign': ['owner', 'safety'],
  'surfaces.verify': ['owner', 'safety'],
  /** Close a surface-register entry as accepted, with a reason. */
  'surfaces.accept': ['owner', 'safety'],
  /** Read caught development mail. */
  'dev.mail': ['owner'],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

export function can(role: Role | null | undefined, permission: Permission): boolean {
  return !!role && (PERMISSIONS[permission] as readonly Role[]).includes(role);
}
