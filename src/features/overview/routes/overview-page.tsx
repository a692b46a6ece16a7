import { useEffect } from 'react';
import { roleLabels } from '../../../../shared/roles';
import { CautionNote, Notice } from '../../../components/ui/notice';
import { useMe } from '../../session';
import { useOverview } from '../api/get-overview';
import { useNow } from '../components/clock';
import { UnitPanel } from '../components/unit-panel';
import { WaitingOnYou } from '../components/waiting-on-you';

/** The shift's front page: what waits on you, then one panel per unit. Stacks on a phone, two across on a wide monitor. */
export function OverviewPage() {
  const { data: me } = useMe();
  const overview = useOverview();
  const now = useNow();
  const data = overview.data;
  // Ages and countdowns run on this device's clock from the server's figures at the fetch.
  const sinceFetchMs = data ? Math.max(0, now - overview.dataUpdatedAt) : 0;

  // A shift change is not an event anyone saves: fetch again just after the first one comes round.
  const { refetch, dataUpdatedAt } = overview;
  useEffect(() => {
    if (!data?.units.length) return;
    const serverNow = Date.parse(data.serverNow);
    const nextChange = Math.min(...data.units.map((u) => Date.parse(u.shift.changeAt)));
    const wait = nextChange - serverNow - (Date.now() - dataUpdatedAt) + 5_000;
    const timer = setTimeout(() => void refetch(), Math.min(Math.max(wait, 5_000), 2 ** 31 - 1));
    return () => clearTimeout(timer);
  }, [data, dataUpdatedAt, refetch]);

  return (
    <section className="flex flex-col gap-4">
      <div>
        <h1 className="text-2xl font-bold">Overview</h1>
        <p className="text-muted">
          Signed in as {me?.name} ({me ? roleLabels[me.role] : ''}). Times are station time, with the zone named.
        </p>
      </div>
      {overview.error ? <Notice kind="error">{overview.error.message}</Notice> : null}
      {overview.isPending ? <p className="text-muted">Loading…</p> : null}
      {data ? <WaitingOnYou waiting={data.waiting} zoneOf={(unitId) => data.units.find((u) => u.unit.id === unitId)?.timeZone ?? null} /> : null}
      {data && data.units.length === 0 ? <Notice kind="info">No units are set up yet. An administrator adds them under Plant setup.</Notice> : null}
      <div className="grid gap-4 xl:grid-cols-2">
        {data?.units.map((unit) => (
          <UnitPanel key={unit.unit.id} data={unit} sinceFetchMs={sinceFetchMs} />
        ))}
      </div>
      <CautionNote />
    </section>
  );
}
