import type { ReactNode } from 'react';
import { Link } from 'react-router';
import type { WaitingOnYou as Waiting } from '../../../../shared/schemas/overview';
import { stationLocalLabel } from '../../../../shared/shift-time';
import { stationTime } from './clock';

function Group({ title, count, children }: { title: string; count: number; children: ReactNode }) {
  if (count === 0) return null;
  return (
    <div className="flex flex-col gap-1">
      <h3 className="font-bold">
        {title} <span className="reading">({count})</span>
      </h3>
      <ul className="flex flex-col gap-1 text-sm">{children}</ul>
    </div>
  );
}

/** What the signed-in person still has to do, first on the page. */
export function WaitingOnYou({ waiting, zoneOf }: { waiting: Waiting; zoneOf: (unitId: number | null) => string | null }) {
  const total = waiting.handoverItems.length + waiting.handoverQuestions.length + waiting.handoversToAccept.length + waiting.traineeRounds.length + waiting.trainingEntries.length + waiting.standingOrders.length + waiting.reviewComments.length;
  return (
    <section aria-label="Waiting on you" className={`flex flex-col gap-3 rounded-lg border-2 bg-panel p-4 ${total ? 'border-watch' : 'border-line'}`}>
      <h2 className="text-lg font-bold">{total ? `▲ Waiting on you (${total})` : '● Nothing is waiting on you'}</h2>
      <Group title="Handover items to acknowledge" count={waiting.handoverItems.length}>
        {waiting.handoverItems.map((i) => (
          <li key={i.itemId}>
            <Link className="underline" to={`/handover?unit=${i.unitId}`}>
              {i.unitName}: “{i.title}”
            </Link>
            {i.priority === 'high' ? <strong> · high priority</strong> : null}
          </li>
        ))}
      </Group>
      <Group title="Handover questions to answer" count={waiting.handoverQuestions.length}>
        {waiting.handoverQuestions.map((q) => (
          <li key={q.queryId}>
            <Link className="underline" to={`/handover?unit=${q.unitId}`}>
              {q.unitName}: “{q.question}” on “{q.itemTitle}”
            </Link>
          </li>
        ))}
      </Group>
      <Group title="Handovers ready for you to accept" count={waiting.handoversToAccept.length}>
        {waiting.handoversToAccept.map((h) => (
          <li key={h.handoverId}>
            <Link className="underline" to={`/handover?unit=${h.unitId}`}>
              {h.unitName}: every item acknowledged, no question open
            </Link>
          </li>
        ))}
      </Group>
      <Group title="Trainee rounds to countersign" count={waiting.traineeRounds.length}>
        {waiting.traineeRounds.map((r) => (
          <li key={r.id}>
            <Link className="underline" to={`/rounds/${r.id}?unit=${r.unitId}`}>
              {r.unitName}: round taken {stationTime(r.takenAt, r.timeZone)} by {r.recordedBy}
            </Link>
          </li>
        ))}
      </Group>
      <Group title="Training entries to countersign" count={waiting.trainingEntries.length}>
        {waiting.trainingEntries.map((e) => (
          <li key={e.id}>
            <Link className="underline" to="/training">
              {e.trainee}: {e.taskTitle} ({e.level}, {e.performedOn})
            </Link>
          </li>
        ))}
      </Group>
      <Group title="Standing orders to read and acknowledge" count={waiting.standingOrders.length}>
        {waiting.standingOrders.map((o) => (
          <li key={o.id}>
            <Link className="underline" to="/orders">
              {o.title}
            </Link>
          </li>
        ))}
      </Group>
      <Group title="Review comments on your records (last 7 days)" count={waiting.reviewComments.length}>
        {waiting.reviewComments.map((c) => {
          const timeZone = zoneOf(c.unitId);
          return (
            <li key={c.id}>
              <span className="text-muted">
                {c.author}
                {timeZone ? `, ${stationLocalLabel(new Date(c.createdAt), timeZone)} (${timeZone})` : ''}, on “{c.about}”:{' '}
              </span>
              {c.body}{' '}
              {c.unitId && c.shiftStart ? (
                <Link className="underline" to={`/logbook/units/${c.unitId}/shifts/${encodeURIComponent(c.shiftStart)}#record-${c.documentId}`}>
                  Open that shift
                </Link>
              ) : null}
            </li>
          );
        })}
      </Group>
    </section>
  );
}
