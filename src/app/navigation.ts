import type { Role } from '../../shared/roles';

export type NavItem = { to: string; label: string; roles: readonly Role[] | 'all' };

/** What each role finds in the navigation. The server enforces the same rules on every route. */
export const navigation: NavItem[] = [
  { to: '/', label: 'Overview', roles: 'all' },
  { to: '/handover', label: 'Handover', roles: 'all' },
  { to: '/log', label: 'Shift log', roles: 'all' },
  { to: '/orders', label: 'Standing orders', roles: 'all' },
  { to: '/rounds', label: 'Rounds', roles: 'all' },
  { to: '/flags', label: 'Flags', roles: 'all' },
  { to: '/trends', label: 'Trends', roles: 'all' },
  { to: '/condenser-check', label: 'Condenser check', roles: 'all' },
  { to: '/logbook', label: 'Logbook history', roles: 'all' },
  { to: '/training', label: 'Training', roles: 'all' },
  { to: '/import', label: 'Import', roles: ['operator', 'shift_lead', 'admin'] },
  { to: '/plant', label: 'Plant setup', roles: 'all' },
  { to: '/admin/people', label: 'People', roles: ['admin'] },
  { to: '/admin/shifts', label: 'Shifts', roles: ['admin'] },
  { to: '/admin/audit', label: 'Audit trail', roles: ['admin'] },
  { to: '/account/password', label: 'My password', roles: 'all' },
];

export const navigationFor = (role: Role) => navigation.filter((item) => item.roles === 'all' || item.roles.includes(role));
