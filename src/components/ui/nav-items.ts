/** The product areas in the top navigation (names from PRODUCT.md). */
import type { Role } from '~/lib/schemas/account.ts';

export interface NavItem {
  href: string;
  label: string;
  /** Roles that see the item; undefined = everyone, including visitors. */
  roles?: readonly Role[];
}

export const NAV_ITEMS: readonly NavItem[] = [
  { href: '/boards', label: 'Boards', roles: ['owner', 'builder'] },
  { href: '/layout', label: 'Layout' },
  { href: '/templates', label: 'Template shelf', roles: ['owner', 'builder'] },
  { href: '/fret-wire', label: 'Fret wire', roles: ['owner', 'builder'] },
  { href: '/shared', label: 'Shared with me', roles: ['client'] },
  { href: '/members', label: 'Members', roles: ['owner'] },
  { href: '/safety', label: 'Safety' },
];
