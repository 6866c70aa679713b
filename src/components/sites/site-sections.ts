import type { SectionIconName } from './section-icon';

/** One place of a site: its name, where it lives and what it holds. */
export interface SiteSection {
  key: string;
  label: string;
  icon: SectionIconName;
  /** The route of the section for a site. */
  href: (siteId: number | string) => string;
  /** What belongs there, in a few words. */
  description: string;
}

const site = (siteId: number | string) => `/sites/${encodeURIComponent(String(siteId))}`;

/** A site's sections, in reading order. Add a section with one line here. */
export const SITE_SECTIONS: readonly SiteSection[] = [
  { key: 'overview', label: 'Overview', icon: 'overview', href: (id) => `${site(id)}/overview`, description: 'Heat loss, energy, cost and CO₂; what fails, what is stale.' },
  { key: 'lines', label: 'Lines', icon: 'lines', href: (id) => `${site(id)}/lines`, description: 'The pipes of the line list, sized together.' },
  { key: 'vessels', label: 'Vessels', icon: 'vessels', href: (id) => `${site(id)}/vessels`, description: 'Tanks, drums and columns with their purposes.' },
  { key: 'revisions', label: 'Revisions and reports', icon: 'revisions', href: (id) => `${site(id)}/revisions`, description: 'Issued revisions with their sign-off, comparisons, schedules and take-offs.' },
  { key: 'library', label: 'Library', icon: 'library', href: (id) => `/library?site=${encodeURIComponent(String(id))}`, description: 'Materials and finishes, built in and the team’s own.' },
  { key: 'sizing', label: 'Sizing settings', icon: 'sizing', href: (id) => `${site(id)}/sizing`, description: 'Thickness series, layer rule and default build-ups.' },
];
