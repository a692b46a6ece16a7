import type { Role } from '../../shared/roles';
import { can, type Action } from '../../shared/policies/permissions';

/** `action`: the permission the page is for (shared/policies/permissions.ts); none = everyone signed in. */
export type NavItem = { to: string; label: string; action?: Action };

/** Pages grouped by what a shift does with them, in the order the menu shows them. */
export type NavGroup = { id: string; title: string; items: NavItem[] };

/** What each role finds in the navigation: the same table the server authorises every route from. */
export const navigationGroups: NavGroup[] = [
  {
    id: 'shift',
    title: 'The shift',
    items: [
      { to: '/', label: 'Overview' },
      { to: '/handover', label: 'Handover' },
      { to: '/log', label: 'Shift log' },
      { to: '/orders', label: 'Standing orders' },
    ],
  },
  {
    id: 'plant',
    title: 'The plant',
    items: [
      { to: '/rounds', label: 'Rounds' },
      { to: '/flags', label: 'Flags' },
      { to: '/trends', label: 'Trends' },
      { to: '/condenser-check', label: 'Condenser check' },
      { to: '/import', label: 'Import', action: 'import.run' },
      { to: '/plant', label: 'Plant setup' },
    ],
  },
  {
    id: 'records',
    title: 'Records',
    items: [
      { to: '/logbook', label: 'Logbook history' },
      { to: '/training', label: 'Training' },
    ],
  },
  { id: 'account', title: 'You', items: [{ to: '/account/password', label: 'My password' }] },
  {
    id: 'admin',
    title: 'Admin',
    items: [
      { to: '/admin/people', label: 'People', action: 'people.manage' },
      { to: '/admin/shifts', label: 'Shifts', action: 'shifts.manage' },
      { to: '/admin/audit', label: 'Audit trail', action: 'audit.read' },
    ],
  },
];

/** Every page in menu order, ungrouped. */
export const navigation: NavItem[] = navigationGroups.flatMap((group) => group.items);

const visibleTo = (role: Role) => (item: NavItem) => !item.action || can(role, item.action);

export const navigationFor = (role: Role) => navigation.filter(visibleTo(role));

/** The groups a role sees, each with only its pages for that role; a group left empty is dropped (Admin for all but administrators). */
export const navigationGroupsFor = (role: Role): NavGroup[] =>
  navigationGroups.map((group) => ({ ...group, items: group.items.filter(visibleTo(role)) })).filter((group) => group.items.length > 0);
