import { ROLES, type Role } from '@shared/schemas/auth';

export interface NavigationItem {
  readonly label: string;
  /** Material Symbols ligature name. */
  readonly icon: string;
  readonly path: string;
  readonly roles: readonly Role[];
}

/** Every destination in the side navigation; a feature adds its line here. */
export const NAVIGATION: readonly NavigationItem[] = [
  { label: 'Home', icon: 'home', path: '/', roles: ROLES },
  { label: 'Designs', icon: 'design_services', path: '/designs', roles: ['engineer', 'reviewer', 'admin'] },
  { label: 'Materials', icon: 'science', path: '/materials', roles: ['engineer', 'reviewer', 'admin'] },
  { label: 'Cores', icon: 'donut_large', path: '/cores', roles: ['engineer', 'reviewer', 'admin'] },
  { label: 'Compare', icon: 'stacked_line_chart', path: '/compare', roles: ['engineer', 'reviewer', 'admin'] },
  { label: 'Review', icon: 'rate_review', path: '/review', roles: ['reviewer'] },
  { label: 'Winding shop', icon: 'precision_manufacturing', path: '/shop', roles: ['winder', 'reviewer', 'engineer', 'admin'] },
  { label: 'Users', icon: 'group', path: '/admin/users', roles: ['admin'] },
  { label: 'Audit log', icon: 'history', path: '/admin/audit', roles: ['admin'] },
  { label: 'Outbox', icon: 'outbox', path: '/admin/outbox', roles: ['admin'] },
  { label: 'Settings', icon: 'settings', path: '/admin/settings', roles: ['admin'] },
];

export function navigationFor(
  role: Role | null,
  items: readonly NavigationItem[] = NAVIGATION,
): readonly NavigationItem[] {
  if (role === null) return [];
  return items.filter((item) => item.roles.includes(role));
}
