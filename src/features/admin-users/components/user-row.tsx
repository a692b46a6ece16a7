import type { PublicUser } from '../../../../shared/schemas/auth';
import { roleLabels, roles, type Role } from '../../../../shared/roles';
import type { CrewSummary } from '../../../components/plant/crews';
import { Button } from '../../../components/ui/button';
import { useChangeUser } from '../api/change-user';

type Props = { user: PublicUser; crews: CrewSummary[]; isSelf: boolean; onError: (message: string) => void };

export function UserRow({ user, crews, isSelf, onError }: Props) {
  const change = useChangeUser();
  const report = { onError: (error: Error) => onError(`${user.name}: ${error.message}`) };
  const label = `${user.name}`;
  return (
    <tr className="border-t border-line" data-testid={`user-row-${user.email}`}>
      <td data-label="Name" className="py-2 pr-3 font-bold">{user.name}</td>
      <td data-label="E-mail" className="py-2 pr-3">{user.email}</td>
      <td data-label="Role" className="py-2 pr-3">
        <select
          aria-label={`Role of ${label}`}
          className="rounded-md border border-line bg-field px-2 py-1"
          value={user.role}
          disabled={isSelf || change.isPending}
          onChange={(e) =>
            change.mutate({ kind: 'update', id: user.id, input: { role: e.target.value as Role, version: user.version } }, report)
          }
        >
          {roles.map((role) => (
            <option key={role} value={role}>
              {roleLabels[role]}
            </option>
          ))}
        </select>
      </td>
      <td data-label="Crew" className="py-2 pr-3">
        <select
          aria-label={`Crew of ${label}`}
          className="rounded-md border border-line bg-field px-2 py-1"
          value={user.crewId ?? ''}
          disabled={change.isPending}
          onChange={(e) =>
            change.mutate(
              { kind: 'update', id: user.id, input: { crewId: e.target.value ? Number(e.target.value) : null, version: user.version } },
              report,
            )
          }
        >
          <option value="">—</option>
          {crews.map((crew) => (
            <option key={crew.id} value={crew.id}>
              Crew {crew.name}
            </option>
          ))}
        </select>
      </td>
      <td data-label="Status" className="py-2 pr-3">
        {user.active ? '● Active' : '○ Deactivated'}
        {user.mustChangePassword ? <span className="block text-xs text-muted">temporary password</span> : null}
      </td>
      <td data-label="Access" className="py-2">
        {isSelf ? (
          <span className="text-sm text-muted">you</span>
        ) : (
          <Button
            tone={user.active ? 'danger' : 'plain'}
            size="xs"
            className="text-sm"
            disabled={change.isPending}
            onClick={() =>
              change.mutate({ kind: user.active ? 'deactivate' : 'reactivate', id: user.id, version: user.version }, report)
            }
          >
            {user.active ? 'Deactivate' : 'Reactivate'}
          </Button>
        )}
      </td>
    </tr>
  );
}
