import { Button } from '../../../components/ui/button';
import { useQueuedRecords } from '../api/offline-store';
import { useUpdateReady } from '../api/service-worker';
import { useOnline, useQueueSender } from '../api/use-queue-sender';

const plural = (n: number, one: string, many: string) => `${n} ${n === 1 ? one : many}`;

/**
 * The shell's line on the connection and this device's queue: online or offline, how many of the
 * person's rounds and log entries wait to be sent or were refused, and a prompt when a new version
 * is ready. Told in words and shapes, not colour alone. Also sends the waiting records.
 */
export function OfflineStatus({ userId }: { userId: number }) {
  useQueueSender(userId);
  const online = useOnline();
  const records = useQueuedRecords();
  const update = useUpdateReady();
  const mine = records.filter((r) => r.userId === userId);
  const waiting = mine.filter((r) => r.state === 'waiting').length;
  const refused = mine.length - waiting;
  const others = records.length - mine.length;
  return (
    <div className="flex flex-wrap items-center gap-2 text-sm print:hidden" data-testid="offline-status">
      <p role="status" className="font-bold">
        <span aria-hidden="true">{online ? '● ' : '○ '}</span>
        {online ? 'Online' : 'Offline'}
        {waiting ? ` · ${plural(waiting, 'record', 'records')} waiting to send` : ''}
        {refused ? ` · ${plural(refused, 'record', 'records')} refused: fix or discard` : ''}
        {others ? ` · ${plural(others, 'record', 'records')} of another person on this device` : ''}
      </p>
      {update.ready ? (
        <Button tone="plain" size="xs" onClick={update.reload}>
          New version ready: reload
        </Button>
      ) : null}
    </div>
  );
}
