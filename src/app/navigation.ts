import type { Role } from '../../shared/roles';
import { can, type Action } from '../../shared/policies/permissions';

/** `action`: the permission the page is for (shared/policies/permissions.ts); none = everyone signed in. */
export type NavItem = { to: string; label: string; action?: Action };

/** What each role finds in the navigation: the same table the server authorises every route from. */
export const navigation: NavItem[] = [
  { to: '/', label: 'Overview' },
  { to: '/handover', label: 'Handover' },
  { to: '/log', label: 'Shift log' },
  { to: '/orders', label: 'Standing orders' },
  { to: '/rounds', label: 'Rounds' },
  { to: '/flags', label: 'Flags' },
  { to: '/trends', label: 'Trends' },
  { to: '/condenser-check', label: 'Condenser check' },
  { to: '/logbook', label: 'Logbook history' },
  { to: '/training', label: 'Training' },
  { to: '/import', label: 'Import', action: 'import.run' },
  { to: '/plant', label: 'Plant setup' },
  { to: '/admin/people', label: 'People', action: 'people.manage' },
  { to: '/admin/shifts', label: 'Shifts', action: 'shifts.manage' },
  { to: '/admin/audit', label: 'Audit trail', action: 'audit.read' },
  { to: '/account/password', label: 'My password' },
];

export const navigationFor = (role: Role) => navigation.filter((item) => !item.action || can(role, item.action));
