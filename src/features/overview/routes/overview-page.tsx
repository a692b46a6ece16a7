import { Link } from 'react-router';
import { roleLabels } from '../../../../shared/roles';
import { CautionNote, Notice } from '../../../components/ui/notice';
import { useMe } from '../../session/api/get-me';
import { useUnitList } from '../../../components/readings/unit-picker';

export function OverviewPage() {
  const { data: me } = useMe();
  const units = useUnitList();
  return (
    <section className="flex flex-col gap-6">
      <div>
        <h1 className="text-2xl font-bold">Overview</h1>
        <p className="text-muted">
          Signed in as {me?.name} ({me ? roleLabels[me.role] : ''}).
        </p>
      </div>
      {units.error ? <Notice kind="error">{units.error.message}</Notice> : null}
      <div className="grid gap-4 sm:grid-cols-2">
        {units.data?.map((unit) => (
          <article key={unit.id} className="rounded-lg border border-line bg-panel p-4">
            <h2 className="text-lg font-bold">
              {unit.name} <span className="text-sm font-normal text-muted">· {unit.station}</span>
            </h2>
            <Link to={`/condenser-check?unit=${unit.id}`} className="mt-2 inline-block font-bold text-accent underline">
              Check the condenser
            </Link>
          </article>
        ))}
      </div>
      <CautionNote />
    </section>
  );
}
