import { useState } from 'react';
import { Notice } from '../../../components/ui/notice';
import { useMe } from '../../session';
import { useCrews } from '../../../components/plant/crews';
import { useUsers } from '../api/get-users';
import { CreateUserForm } from '../components/create-user-form';
import { UserRow } from '../components/user-row';

export function UsersPage() {
  const { data: me } = useMe();
  const users = useUsers();
  const crews = useCrews();
  const [rowError, setRowError] = useState<string | null>(null);
  const crewList = crews.data ?? [];
  return (
    <section className="flex flex-col gap-6">
      <h1 className="text-2xl font-bold">People</h1>
      <CreateUserForm crews={crewList} />
      {rowError ? <Notice kind="error">{rowError}</Notice> : null}
      {users.error ? <Notice kind="error">{users.error.message}</Notice> : null}
      <div className="overflow-x-auto rounded-lg border border-line bg-panel p-4">
        <table className="stack-table w-full text-left">
          <thead>
            <tr className="text-sm text-muted">
              <th className="pb-2">Name</th>
              <th className="pb-2">E-mail</th>
              <th className="pb-2">Role</th>
              <th className="pb-2">Crew</th>
              <th className="pb-2">Status</th>
              <th className="pb-2">Access</th>
            </tr>
          </thead>
          <tbody>
            {users.data?.map((user) => (
              <UserRow key={user.id} user={user} crews={crewList} isSelf={user.id === me?.id} onError={setRowError} />
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
