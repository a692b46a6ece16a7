import { Outlet } from 'react-router';
import { can, type Action } from '../../../shared/policies/permissions';
import { useMe } from '../../features/session';
import { Notice } from '../../components/ui/notice';

/** Hides pages a role cannot use. Only a convenience: the server refuses the data anyway. */
export function RequireRole({ action }: { action: Action }) {
  const { data: me } = useMe();
  if (!me || !can(me.role, action)) {
    return <Notice kind="error">This page is not available to your role.</Notice>;
  }
  return <Outlet />;
}
