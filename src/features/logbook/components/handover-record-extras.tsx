import { ShiftCondenserPanel } from '../../../components/condenser/shift-condenser-panel';
import type { PastShift } from '../api/logbook';

type Board = NonNullable<PastShift['handoverGiven']>;

/** An item's files, as links that open them. */
export function ItemAttachments({ item }: { item: Board['items'][number] }) {
  if (!item.attachments.length) return null;
  return (
    <ul className="flex flex-wrap gap-2 text-sm" aria-label={`Attachments of ${item.title}`}>
      {item.attachments.map((a) => (
        <li key={a.id}>
          <a className="text-accent underline" href={`/api/attachments/${a.id}`} target="_blank" rel="noreferrer">
            {a.mime === 'application/pdf' ? 'PDF' : 'Photo'}: {a.fileName} ({Math.ceil(a.size / 1024)} kB)
          </a>
        </li>
      ))}
    </ul>
  );
}

/** The condenser state the outgoing crew handed over, frozen at submit. */
export function HandedOverCondenser({ board }: { board: Board }) {
  const snapshot = board.handover.condenserSnapshot;
  if (!snapshot) return <p className="text-sm text-muted">No condenser state was stored with this handover{board.handover.status === 'draft' ? ' (not submitted)' : ''}.</p>;
  return <ShiftCondenserPanel state={snapshot.state} frozenAt={snapshot.frozenAt} headingLevel="h3" />;
}
