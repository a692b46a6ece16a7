import { useState } from 'react';
import { formatStationTime } from '../../../../shared/station-time';
import { fieldLabel } from '../../../../shared/schemas/field-labels';
import { Button } from '../../../components/ui/button';
import { StatusBadge } from '../../../components/ui/status-badge';
import { discard, useQueuedRecords } from '../api/offline-store';
import type { QueuedKind, QueuedRecord } from '../api/queue';

function DiscardButton({ record }: { record: QueuedRecord }) {
  const [asking, setAsking] = useState(false);
  if (!asking) {
    return (
      <Button tone="plain" size="xs" onClick={() => setAsking(true)}>
        Discard
      </Button>
    );
  }
  return (
    <span className="flex items-center gap-1">
      <span className="text-xs font-bold">Remove it from this device for good?</span>
      <Button tone="danger" size="xs" onClick={() => void discard(record.clientId)}>
        Yes, discard
      </Button>
      <Button tone="plain" size="xs" onClick={() => setAsking(false)}>
        Keep it
      </Button>
    </span>
  );
}

/**
 * The signed-in person's rounds or log entries for this unit that are kept on this device: waiting to
 * send, with the station time they were entered, or refused on arrival with the server's reason and
 * "Fix and resend" / "Discard". Nothing leaves this list without the server storing it or its author
 * discarding it.
 */
export function WaitingRecords({ kind, unitId, userId, timeZone, onFix }: { kind: QueuedKind; unitId: number; userId: number; timeZone: string; onFix: (record: QueuedRecord) => void }) {
  const records = useQueuedRecords().filter((r) => r.kind === kind && r.unitId === unitId && r.userId === userId);
  if (!records.length) return null;
  const what = kind === 'round' ? 'Rounds' : 'Log entries';
  return (
    <section aria-label={`${what} kept on this device`} className="rounded-lg border-2 border-watch bg-panel p-3 text-sm" data-testid={`waiting-${kind}`}>
      <h2 className="font-bold">{what} kept on this device</h2>
      <ol className="mt-1 flex flex-col gap-2">
        {records.map((r) => (
          <li key={r.clientId} className="border-t border-line pt-2" data-testid="waiting-record">
            <p className="flex flex-wrap items-center gap-2">
              {r.state === 'waiting' ? (
                <span className="font-bold">
                  <span aria-hidden="true">⏳ </span>waiting to send
                </span>
              ) : (
                <span className="font-bold text-alarm">
                  <span aria-hidden="true">✖ </span>refused on arrival
                </span>
              )}
              <span>entered {formatStationTime(r.enteredAt, timeZone, 'datetime-seconds')} (station time)</span>
              {r.worstStatus ? <StatusBadge status={r.worstStatus} /> : null}
            </p>
            <p className="mt-1 whitespace-pre-wrap">{r.summary}</p>
            {r.refusal ? (
              <div role="alert" className="mt-1">
                <p className="font-bold">{r.refusal.message}</p>
                {Object.keys(r.refusal.fields).length ? (
                  <ul className="list-inside list-disc">
                    {Object.entries(r.refusal.fields).map(([field, message]) => (
                      <li key={field}>
                        {fieldLabel(field)}: {message}
                      </li>
                    ))}
                  </ul>
                ) : null}
              </div>
            ) : null}
            {r.state === 'refused' ? (
              <div className="mt-1 flex flex-wrap gap-2">
                <Button size="xs" onClick={() => onFix(r)}>
                  Fix and resend
                </Button>
                <DiscardButton record={r} />
              </div>
            ) : null}
          </li>
        ))}
      </ol>
    </section>
  );
}
