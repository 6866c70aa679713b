/** Shapes of the API's answers (see docs/api.md). */

import type { DesignBases } from '../../shared/schemas/sites';
import type { BuildUp, BurnVerdict, Fittings, ItemSizing, Purpose, PurposeParameters } from '../../shared/calc/sizing/types';
import type { StoredSizingSettings } from '../../shared/calc/sizing/settings';
import type { ConductivityPoint, TableConfidence } from '../../shared/calc/library/materials';
import type { ContactMaterial } from '../../shared/calc/types';

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

// ---------------------------------------------------------------------------------------------------------
// Line lists (docs/api.md "Line lists"; DESIGN §11). SI in field names, temperatures °C.

export type {
  BuildUp,
  BurnVerdict,
  Fittings,
  ItemSizing,
  Purpose,
  PurposeOutcome,
  PurposeParameters,
} from '../../shared/calc/sizing/types';
export type { StoredSizingSettings } from '../../shared/calc/sizing/settings';

export type ItemKind = 'line' | 'vessel';

/** The sizing summary every list row carries; `null` until the item is sized. */
export interface ItemSizingSummary {
  governingPurpose: Purpose | null;
  layersM: number[];
  totalThicknessM: number;
  /** Lines: per metre at the energy basis [W/m]. */
  heatLossWPerM?: number | null;
  /** Whole item at the energy basis [W]. */
  heatLossW: number | null;
  surfaceTemperatureC: number | null;
  burnVerdict: BurnVerdict;
  annualEnergyKWh: number | null;
  failing: Purpose[];
  stale: boolean;
  sizedAt: string;
  /** The whole stored outcome (GET /lines/:id and /vessels/:id only). */
  result?: ItemSizing | { error: { code: string; field: string; message: string } } | null;
}

interface ItemBase {
  id: number;
  siteId: number;
  tag: string;
  service: string;
  lengthM: number;
  orientation: 'horizontal' | 'vertical';
  location: 'indoor' | 'outdoor';
  operatingTemperatureC: number;
  purposes: Purpose[];
  purposeParameters: PurposeParameters;
  buildUp: BuildUp | null;
  notes: string;
  version: number;
  createdAt: string;
  updatedAt: string;
  sizing: ItemSizingSummary | null;
}

export interface Line extends ItemBase {
  sizeGivenAs: 'nps' | 'dn' | 'od';
  nps: string | null;
  dn: number | null;
  outerDiameterM: number;
  heightM: number | null;
  fittings: Fittings;
  fittingsInsulated: boolean;
}

export interface Vessel extends ItemBase {
  diameterM: number;
  headType: 'flat' | 'ellipsoidal2to1' | 'hemispherical';
}

export type Item = Line | Vessel;

export type ItemOf<K extends ItemKind> = K extends 'line' ? Line : Vessel;

export type ListStatus = 'failing' | 'stale' | 'unsized' | 'sized' | 'current';

/** Sort keys of GET /sites/:siteId/lines and /vessels. */
export type ListSortKey =
  | 'tag'
  | 'service'
  | 'outerDiameterM'
  | 'lengthM'
  | 'operatingTemperatureC'
  | 'location'
  | 'governingPurpose'
  | 'totalThicknessM'
  | 'heatLoss'
  | 'surfaceTemperatureC'
  | 'annualEnergyKWh'
  | 'sizedAt';

export interface ListFilters {
  q?: string;
  purpose?: Purpose;
  location?: 'indoor' | 'outdoor';
  status?: ListStatus;
  sort?: ListSortKey;
  descending?: boolean;
}

export interface ItemPage<K extends ItemKind> {
  items: ItemOf<K>[];
  nextCursor: string | null;
}

export type JobStatus = 'queued' | 'running' | 'done' | 'failed';

export interface Job {
  id: number;
  kind?: string;
  siteId?: number | null;
  status: JobStatus;
  done: number;
  total: number;
  error: string | null;
  createdAt?: string;
  startedAt?: string | null;
  finishedAt?: string | null;
}

export type SizingSettingsPayload = StoredSizingSettings;

export interface SiteOverviewCounts {
  items: number;
  unsized: number;
  stale: number;
  failing: number;
}

export interface SiteOverview {
  siteId: number;
  counts: { line: SiteOverviewCounts; vessel: SiteOverviewCounts };
  heatLossKW: number;
  bareHeatLossKW: number;
  annualEnergyMWh: number;
  bareAnnualEnergyMWh: number;
  currency: string | null;
  /** Money as decimal text to the cent ("456554.99"), or null without an energy price. */
  annualCost: string | null;
  bareAnnualCost: string | null;
  annualCo2Tonnes: number | null;
  bareAnnualCo2Tonnes: number | null;
  basis: {
    operatingHoursPerYear: number | null;
    energyPricePerKWh: number | null;
    heatSourceEfficiency: number | null;
    co2KgPerKWh: number | null;
    co2Basis: string | null;
  };
  byService: { service: string; heatLossW: number; annualEnergyKWh: number; items: number }[];
}

export interface LibraryMaterial {
  id: string;
  name: string;
  specification: string;
  source: string;
  confidence: TableConfidence;
  maxServiceTemperatureC: number;
  minServiceTemperatureC: number;
  densityKgPerM3?: number;
  tablePoints: ConductivityPoint[];
  conductivity: number[];
  origin: 'builtIn';
}

export interface LibraryFinish {
  id: string;
  name: string;
  emissivity: number;
  emissivityRange: [number, number];
  metallic: boolean;
  source: string;
  contactMaterial?: ContactMaterial;
  origin: 'builtIn';
}

export interface TeamMaterial {
  id: number;
  /** The id build-ups use: `team-material-<id>`. */
  materialId: string;
  name: string;
  source: string;
  tablePoints: ConductivityPoint[];
  conductivity: number[];
  fitMaxErrorPct: number;
  maxServiceTemperatureC: number;
  minServiceTemperatureC: number;
  densityKgPerM3: number | null;
  notes: string;
  createdAt: string;
  updatedAt: string;
  origin: 'team';
}

export interface TeamFinish {
  id: number;
  /** The id build-ups use: `team-finish-<id>`. */
  finishId: string;
  name: string;
  source: string;
  emissivity: number;
  emissivityRange: [number, number];
  contactMaterial: ContactMaterial;
  createdAt: string;
  updatedAt: string;
  origin: 'team';
}

export interface LibraryPayload {
  materials: LibraryMaterial[];
  finishes: LibraryFinish[];
  teamMaterials: TeamMaterial[];
  teamFinishes: TeamFinish[];
}

export interface ConductivityFitView {
  conductivity: number[];
  degree: number;
  maxErrorPct: number;
  rmsErrorPct: number;
  dataRangeC: [number, number];
}
