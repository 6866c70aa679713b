import type { IconName } from '../ui';

export interface Destination {
  href: '/sites' | '/register' | '/quick-sizing' | '/team' | '/settings';
  label: string;
  icon: IconName;
}

/** At most five; the phone's bottom bar shows all of them. */
export const destinations: readonly Destination[] = [
  { href: '/sites', label: 'Sites', icon: 'sites' },
  { href: '/register', label: 'Register', icon: 'caution' },
  { href: '/quick-sizing', label: 'Quick sizing', icon: 'quick' },
  { href: '/team', label: 'Team', icon: 'team' },
  { href: '/settings', label: 'Settings', icon: 'settings' },
];

export function isActive(pathname: string, href: string): boolean {
  return pathname === href || pathname.startsWith(`${href}/`);
}
