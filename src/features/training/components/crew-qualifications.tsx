import { useState } from 'react';
import { useCrews } from '../../../components/plant/crews';
import { FilterSelect } from '../../../components/ui/filter-select';
import { formatStationTime } from '../../../../shared/station-time';
import { useCrewQualifications } from '../api/training';
import { useTrainingZone } from '../lib/use-training-zone';

/** Per crew: who is signed off for which task. */
export function CrewQualifications({ defaultCrewId }: { defaultCrewId: number | null }) {
  const crews = useCrews();
  const [chosen, setChosen] = useState<number | null>(null);
  const crewId = chosen ?? defaultCrewId ?? crews.data?.[0]?.id ?? null;
  const data = useCrewQualifications(crewId);
  const zone = useTrainingZone();
  return (
    <section aria-label="Crew qualifications" className="flex flex-col gap-2">
      <div className="flex flex-wrap items-end gap-3">
        <h2 className="text-lg font-bold">Who is qualified</h2>
        <FilterSelect label="Crew" value={crewId ?? undefined} options={(crews.data ?? []).map((c) => ({ value: c.id, label: `Crew ${c.name}` }))} onChange={(v) => setChosen(v ? Number(v) : null)} />
      </div>
      {data.data ? (
        <div className="overflow-x-auto rounded-lg border border-line bg-panel">
          <table className="text-left text-sm">
            <thead>
              <tr>
                <th className="p-2">Person</th>
                {data.data.tasks.map((t) => (
                  <th key={t.taskKey} className="p-2" title={t.title}>
                    {t.taskKey}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {data.data.people.map((p) => (
                <tr key={p.id} className="border-t border-line">
                  <td className="p-2 whitespace-nowrap">
                    {p.name} <span className="text-xs text-muted">{p.role.replace('_', ' ')}</span>
                  </td>
                  {data.data.tasks.map((t) => {
                    const signed = p.signedOff.find((s) => s.taskKey === t.taskKey);
                    return (
                      <td key={t.taskKey} className="p-2 text-center">
                        {signed ? <span title={`signed off ${zone ? formatStationTime(signed.at, zone.timeZone, 'date') : ''}`}>✔<span className="sr-only"> qualified</span></span> : <span className="text-muted">–<span className="sr-only"> not signed off</span></span>}
                      </td>
                    );
                  })}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
    </section>
  );
}
