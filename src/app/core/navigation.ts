import { may, type Permission } from '@shared/api/permissions';
import type { Role } from '@shared/schemas/auth';

export interface NavigationItem {
  readonly label: string;
  /** Material Symbols ligature name. */
  readonly icon: string;
  readonly path: string;
  /** Who sees the entry: a permission of the shared table (the same one the server checks). */
  readonly permission: Permission;
}

/** Every destination in the side navigation; a feature adds its line here. */
export const NAVIGATION: readonly NavigationItem[] = [
  { label: 'Home', icon: 'home', path: '/', permission: 'signedIn' },
  { label: 'Designs', icon: 'design_services', path: '/designs', permission: 'library' },
  { label: 'Materials', icon: 'science', path: '/materials', permission: 'library' },
  { label: 'Cores', icon: 'donut_large', path: '/cores', permission: 'library' },
  { label: 'Compare', icon: 'stacked_line_chart', path: '/compare', permission: 'library' },
  { label: 'Review', icon: 'rate_review', path: '/review', permission: 'review' },
  { label: 'Winding shop', icon: 'precision_manufacturing', path: '/shop', permission: 'shop' },
  { label: 'Users', icon: 'group', path: '/admin/users', permission: 'admin' },
  { label: 'Audit log', icon: 'history', path: '/admin/audit', permission: 'admin' },
  { label: 'Outbox', icon: 'outbox', path: '/admin/outbox', permission: 'admin' },
  { label: 'Settings', icon: 'settings', path: '/admin/settings', permission: 'admin' },
];

export function navigationFor(role: Role | null, items: readonly NavigationItem[] = NAVIGATION): readonly NavigationItem[] {
  if (role === null) return [];
  return items.filter((item) => may(role, item.permission));
}
