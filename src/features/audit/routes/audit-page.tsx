import { formatStationTime } from '../../../../shared/station-time';
import { useHomeZone } from '../../../components/station-time/use-station-zone';
import { ZoneNote } from '../../../components/station-time/zone-note';
import { Button } from '../../../components/ui/button';
import { Notice } from '../../../components/ui/notice';
import { useAuditEvents } from '../api/get-audit-events';
import { useMe } from '../../session';

const show = (value: unknown) => (value == null ? '—' : JSON.stringify(value));

export function AuditPage() {
  const events = useAuditEvents();
  const rows = events.data?.pages.flat() ?? [];
  // The trail spans the whole installation; its times are read on the person's station's clock.
  const zone = useHomeZone(useMe().data?.crewId);
  return (
    <section className="flex flex-col gap-4">
      <h1 className="text-2xl font-bold">Audit trail</h1>
      <p className="text-muted">Every change to people and settings, newest first. Nothing here can be edited.</p>
      <ZoneNote zone={zone} basis={zone?.basis} />
      {events.error ? <Notice kind="error">{events.error.message}</Notice> : null}
      <div className="overflow-x-auto rounded-lg border border-line bg-panel p-4">
        <table className="stack-table w-full text-left text-sm">
          <thead>
            <tr className="text-muted">
              <th className="pb-2">When (station time)</th>
              <th className="pb-2">Who</th>
              <th className="pb-2">What</th>
              <th className="pb-2">Record</th>
              <th className="pb-2">Before</th>
              <th className="pb-2">After</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((e) => (
              <tr key={e.id} className="border-t border-line align-top">
                <td data-label="When" className="py-1 pr-3 reading whitespace-nowrap">{zone ? formatStationTime(e.at, zone.timeZone, 'datetime-seconds') : '…'}</td>
                <td data-label="Who" className="py-1 pr-3">{e.actor}</td>
                <td data-label="What" className="py-1 pr-3 font-bold">{e.action}</td>
                <td data-label="Record" className="py-1 pr-3">
                  {e.entity} #{e.entityId}
                </td>
                <td data-label="Before" className="py-1 pr-3 break-all">{show(e.before)}</td>
                <td data-label="After" className="py-1 break-all">{show(e.after)}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {events.hasNextPage ? (
        <Button tone="plain" onClick={() => void events.fetchNextPage()} disabled={events.isFetchingNextPage}>
          Show older
        </Button>
      ) : null}
    </section>
  );
}
