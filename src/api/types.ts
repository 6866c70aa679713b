/** Shapes of the API's answers (see docs/api.md). */

import type { DesignBases } from '../../shared/schemas/sites';

export type { DesignBases };

export type Role = 'owner' | 'engineer' | 'safety' | 'contractor' | 'viewer';

export const ROLES: readonly Role[] = ['owner', 'engineer', 'safety', 'contractor', 'viewer'];

export const roleLabels: Record<Role, string> = {
  owner: 'Owner',
  engineer: 'Engineer',
  safety: 'Safety officer',
  contractor: 'Contractor',
  viewer: 'Viewer',
};

export const roleDescriptions: Record<Role, string> = {
  owner: 'Manages the team, invitations and roles; everything an engineer can do.',
  engineer: 'Creates sites, edits line lists, sizes insulation and issues revisions.',
  safety: 'Keeps the surface register and the touch-safety basis.',
  contractor: 'Imports schedules and reads the sites they are invited to.',
  viewer: 'Reads sites, results and reports.',
};

export type UnitSystem = 'SI' | 'US';

export interface User {
  id: number | string;
  name: string;
  email: string;
}

export interface TeamRef {
  id: number | string;
  name: string;
}

export interface UserSettings {
  unitSystem: UnitSystem;
}

export interface SessionPayload {
  user: User | null;
  team: TeamRef | null;
  role: Role | null;
  settings: UserSettings | null;
  csrfToken: string;
}

export interface Member {
  userId: number | string;
  name: string;
  email: string;
  role: Role;
  joinedAt: string;
}

export interface Invitation {
  id: number | string;
  email: string;
  role: Role;
  expiresAt: string;
}

export interface TeamPayload {
  team: TeamRef;
  members: Member[];
  invitations: Invitation[];
}

export interface InvitationPreview {
  teamName: string;
  email: string;
  role: Role;
  invitedBy: string;
}

export interface Site {
  id: number | string;
  name: string;
  description?: string | null;
  createdAt?: string;
  updatedAt?: string;
}

/** A person added to a site (contractors see only the sites they are added to). */
export interface SiteMember {
  userId: number | string;
  name: string;
  email: string;
}

/** One site as GET /sites/:id answers it; owners and engineers also get who was invited to it. */
export interface SiteDetail extends Site {
  designBases: DesignBases;
  members?: SiteMember[];
}

export interface CaughtMail {
  id: number | string;
  to: string;
  subject: string;
  text: string;
  receivedAt: string;
}
