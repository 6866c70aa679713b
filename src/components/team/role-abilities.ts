import { PERMISSIONS, can, type Permission } from '../../../shared/schemas/permissions';
import type { Role } from '../../api/types';

/** What each permission lets a person do, in plain words (contractors' site-bound forms are separate). */
const PERMISSION_WORDS: Record<Permission, string> = {
  'team.read': 'see who is on the team',
  'team.manage': 'invite people, change roles (their own too) and remove members',
  'site.read': 'read every site, its results and reports',
  'site.create': 'create sites',
  'site.edit': 'edit sites and all their design bases',
  'site.editTouchBasis': 'edit the touch-safety basis of a site',
  'site.delete': 'delete sites',
  'site.members': 'add contractors to sites and take them off',
  'lines.edit': 'edit line lists and size insulation',
  'library.edit': "add and edit the team's own materials and finishes",
  'revisions.issue': 'issue revisions',
  'schedule.import': 'import schedules from CSV',
  'surfaces.create': 'record surfaces in the hot-surface register',
  'surfaces.assign': 'assign actions in the register',
  'surfaces.verify': 'verify and close register items',
  'surfaces.accept': 'accept a register item as it is, with a reason',
  'dev.mail': 'read mail caught in development',
};

const CONTRACTOR_WORDS: Partial<Record<Permission, string>> = {
  'site.read': 'read only the sites they are added to',
  'schedule.import': 'import schedules into those sites, for an engineer to accept',
};

/** Permissions that say nothing a person would weigh when giving a role. */
const UNREMARKABLE: readonly Permission[] = ['team.read', 'dev.mail'];

/**
 * What a role may do, read from the permission table the server enforces (shared/schemas/permissions.ts), in the
 * order of that table. A permission another one already covers (editing the touch basis, when all bases may be
 * edited) is left out.
 */
export function roleAbilities(role: Role): string[] {
  const out: string[] = [];
  for (const p of Object.keys(PERMISSIONS) as Permission[]) {
    if (UNREMARKABLE.includes(p) || !can(role, p)) continue;
    if (p === 'site.editTouchBasis' && can(role, 'site.edit')) continue;
    out.push((role === 'contractor' ? CONTRACTOR_WORDS[p] : undefined) ?? PERMISSION_WORDS[p]);
  }
  return out;
}

/** What a role may not do that the others may, for the confirmation of a lower role. */
export function roleLimits(role: Role): string[] {
  const out: string[] = [];
  for (const p of ['team.manage', 'site.create', 'site.edit', 'lines.edit', 'site.delete'] as Permission[]) {
    if (!can(role, p)) out.push(PERMISSION_WORDS[p]);
  }
  return out;
}
