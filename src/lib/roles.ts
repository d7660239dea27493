// What each role may open: its home page and the navigation links. The route guards in
// router.tsx and the navigation read this same table, so a link is shown only where the
// page behind it lets the person in.
import type { Role } from '@shared/schemas/common';

export const ROLE_LABELS: Record<Role, string> = {
  contractor: 'Lift planner',
  reviewer: 'Lift coordinator',
  engineer: 'Engineer of record',
  admin: 'Desk administrator',
};

export type NavItem = {
  to: string;
  label: string;
  description: string;
  roles: readonly Role[];
  /** Highlighted only on this exact path, not on the pages below it. */
  end?: boolean;
};

export const NAV_ITEMS: readonly NavItem[] = [
  {
    to: '/packages',
    label: 'Lift packages',
    description: "Your organisation's lift packages and what each is waiting on",
    roles: ['contractor'],
  },
  {
    to: '/library',
    label: 'Fleet library',
    description: 'Your cranes, their configurations and load charts, entered once for every package',
    roles: ['contractor'],
  },
  {
    to: '/queue',
    label: 'Site queue',
    description: 'Every package for your sites, by planned lift date',
    roles: ['reviewer', 'admin'],
  },
  {
    to: '/assigned',
    label: 'Assigned to me',
    description: 'Packages waiting for your review and decision',
    roles: ['engineer'],
  },
  {
    to: '/admin',
    label: 'Desk administration',
    description: 'The state of the desk, every package, and the admin pages',
    roles: ['admin'],
    end: true,
  },
  {
    to: '/admin/organisations',
    label: 'Organisations',
    description: 'Contractors and site owners on the desk',
    roles: ['admin'],
  },
  {
    to: '/admin/sites',
    label: 'Sites and policies',
    description: "Sites, their lift coordinators and each site's review policy",
    roles: ['admin'],
  },
  {
    to: '/admin/people',
    label: 'People',
    description: 'Invite people, change roles, deactivate accounts',
    roles: ['admin'],
  },
  {
    to: '/admin/mail',
    label: 'Mail outbox',
    description: 'Every message the desk sent, failures first to fix',
    roles: ['admin'],
  },
  {
    to: '/profile',
    label: 'Profile',
    description: 'Your name, units, reminders and password',
    roles: ['contractor', 'reviewer', 'engineer', 'admin'],
  },
];

export const ROLE_HOME: Record<Role, string> = {
  contractor: '/packages',
  reviewer: '/queue',
  engineer: '/assigned',
  admin: '/admin',
};

export function navItemsFor(role: Role): NavItem[] {
  return NAV_ITEMS.filter((item) => item.roles.includes(role));
}

export function rolesFor(path: string): readonly Role[] {
  const item = NAV_ITEMS.find((entry) => entry.to === path);
  if (!item) throw new Error(`No navigation entry for ${path}`);
  return item.roles;
}
