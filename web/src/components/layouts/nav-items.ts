import type { CurrentUser } from '@sixtyfold/shared';
import { paths } from '@/config/paths';

export interface NavItem {
  label: string;
  href: string;
}

/** Main navigation; Admin only appears for site administrators (the route checks again). */
export function navItemsFor(user: CurrentUser): NavItem[] {
  const items: NavItem[] = [
    { label: 'Overview', href: paths.home.getHref() },
    { label: 'Scans', href: paths.scans.getHref() },
    { label: 'Models', href: paths.models.getHref() },
    { label: 'Compare', href: paths.compare.getHref() },
  ];
  if (user.siteRole === 'admin') {
    items.push(
      { label: 'Groups', href: paths.adminGroups.getHref() },
      { label: 'Mail outbox', href: paths.adminOutbox.getHref() },
      { label: 'Maintenance', href: paths.maintenance.getHref() },
      { label: 'Admin', href: paths.admin.getHref() },
    );
  }
  return items;
}
