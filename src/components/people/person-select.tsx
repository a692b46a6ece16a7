import { useQuery } from '@tanstack/react-query';
import { api } from '../../lib/api-client';

import { peopleKeys } from './people-keys';

export { peopleKeys };
export const usePeople = () =>
  useQuery({
    queryKey: peopleKeys.all,
    queryFn: async () => (await api.get<{ people: { id: number; name: string; role: string }[] }>('/api/plant/people')).people,
    staleTime: 5 * 60_000,
  });

type Props = { label: string; value: string; onChange: (id: string) => void; error?: string };

/** Pick an active person (owner of a condition, who follows up a flag). */
export function PersonSelect({ label, value, onChange, error }: Props) {
  const people = usePeople();
  return (
    <label className="flex flex-col text-sm">
      {label}
      <select className="rounded-md border border-line bg-field px-2 py-1" value={value} onChange={(e) => onChange(e.target.value)}>
        <option value="">Choose…</option>
        {people.data?.map((p) => (
          <option key={p.id} value={p.id}>
            {p.name}
          </option>
        ))}
      </select>
      {error ? <span className="text-alarm">⚠ {error}</span> : null}
    </label>
  );
}
