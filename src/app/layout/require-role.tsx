import { Outlet } from 'react-router';
import type { Role } from '../../../shared/roles';
import { useMe } from '../../features/session/api/get-me';
import { Notice } from '../../components/ui/notice';

/** Hides pages a role cannot use. Only a convenience: the server refuses the data anyway. */
export function RequireRole({ roles }: { roles: readonly Role[] }) {
  const { data: me } = useMe();
  if (!me || !roles.includes(me.role)) {
    return <Notice kind="error">This page is not available to your role.</Notice>;
  }
  return <Outlet />;
}
