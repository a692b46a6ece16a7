import { Link } from 'react-router';
import { formatRemaining } from '../../../../shared/conditions';
import { defaultDisplayPreferences, displayQuantity } from '../../../../shared/display';
import { roleLabels, type Role } from '../../../../shared/roles';
import type { OverviewHandover, OverviewUnit } from '../../../../shared/schemas/overview';
import { StatusBadge } from '../../../components/ui/status-badge';
import { useWatchUnit } from '../../../app/use-live-updates';
import { RoundSection } from './round-section';
import { stationTime } from './clock';

const conditionBadge = { running: 'normal', due_soon: 'watch', overdue: 'alarm', closed: 'unknown' } as const;

function handoverWords(h: OverviewHandover): string {
  switch (h.state) {
    case 'none':
      return '○ Not started yet';
    case 'draft':
      return '✎ Draft — the outgoing crew is writing it';
    case 'submitted':
      return `⇢ Submitted — ${h.acknowledgementsOutstanding} acknowledgement${h.acknowledgementsOutstanding === 1 ? '' : 's'} outstanding${h.openQuestions ? `, ${h.openQuestions} open question${h.openQuestions === 1 ? '' : 's'}` : ''}`;
    case 'accepted':
      return h.acknowledgementsOutstanding
        ? `✔ Accepted — amended since: ${h.acknowledgementsOutstanding} acknowledgement${h.acknowledgementsOutstanding === 1 ? '' : 's'} outstanding`
        : '✔ Accepted — turnover done';
  }
}

/** One unit of the front page: shift, handover, latest round, flags, conditions, and the way into each page. */
export function UnitPanel({ data, sinceFetchMs }: { data: OverviewUnit; sinceFetchMs: number }) {
  const { unit, shift, timeZone } = data;
  useWatchUnit(unit.id);
  const links: [string, string][] = [
    ['Rounds', '/rounds'],
    ['Flags', '/flags'],
    ['Shift log', '/log'],
    ['Handover', '/handover'],
    ['Trends', '/trends'],
    ['Condenser check', '/condenser-check'],
  ];
  return (
    <article aria-label={`${unit.name} overview`} data-testid={`overview-unit-${unit.id}`} className="@container flex flex-col gap-4 rounded-lg border border-line bg-panel p-4">
      <header className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
        <h2 className="text-xl font-bold">{unit.name}</h2>
        <span className="text-sm text-muted">{unit.station}</span>
        <nav aria-label={`${unit.name} pages`} className="flex w-full flex-wrap gap-2 text-sm">
          {links.map(([label, path]) => (
            <Link key={path} to={`${path}?unit=${unit.id}`} className="touch-target inline-flex items-center rounded-md border border-line px-2 py-1 font-bold hover:bg-field">
              {label}
            </Link>
          ))}
        </nav>
      </header>

      <section aria-label="Shift" className="flex flex-col gap-1">
        <h3 className="font-bold">Shift</h3>
        <p data-testid="crew-on-shift">
          {shift.crewOnShift ? <strong>On shift: Crew {shift.crewOnShift.name}</strong> : <strong>No crew rotation set for this station</strong>}
          {shift.people.length ? ` — ${shift.people.map((p) => `${p.name} (${roleLabels[p.role as Role] ?? p.role})`).join(', ')}` : ''}
        </p>
        <p className="text-sm">
          Next change {stationTime(shift.changeAt, timeZone)}
          {shift.incomingCrew ? `, Crew ${shift.incomingCrew.name} coming in` : ''}.
        </p>
        <p className="text-sm" data-testid="handover-state">
          Handover: <strong>{handoverWords(data.handover)}</strong>
        </p>
      </section>

      <RoundSection unitId={unit.id} round={data.round} timeZone={timeZone} intervalMinutes={data.roundIntervalMinutes} sinceFetchMs={sinceFetchMs} />

      <section aria-label="Open flags" className="flex flex-col gap-1">
        <h3 className="flex flex-wrap items-center gap-2 font-bold">
          Open flags
          <span className="inline-flex items-center gap-1 text-sm font-normal" data-testid="flag-count-alarm">
            <StatusBadge status="alarm" /> <span className="reading">{data.flags.open.alarm}</span> open
          </span>
          <span className="inline-flex items-center gap-1 text-sm font-normal" data-testid="flag-count-watch">
            <StatusBadge status="watch" /> <span className="reading">{data.flags.open.watch}</span> open
          </span>
        </h3>
        {data.flags.top.length === 0 ? <p className="text-sm text-muted">None open.</p> : null}
        <ul className="flex flex-col gap-1 text-sm">
          {data.flags.top.map((f) => {
            const value = f.lastValue !== null && f.quantity ? displayQuantity(f.lastValue, f.quantity, defaultDisplayPreferences) : null;
            return (
              <li key={f.id} className="flex flex-wrap items-center gap-2">
                <StatusBadge status={f.severity} />
                <span>{f.parameterLabel}</span>
                {value ? <span className="reading">{value.text} {value.unit}</span> : null}
                <span className="text-muted">
                  {f.origin === 'manual' ? 'raised by hand' : 'from limits'} {stationTime(f.raisedAt, timeZone)}
                </span>
              </li>
            );
          })}
        </ul>
      </section>

      <section aria-label="Open conditions" className="flex flex-col gap-1">
        <h3 className="font-bold">Time-limited conditions</h3>
        {data.conditions.length === 0 ? <p className="text-sm text-muted">None open.</p> : null}
        <ul className="flex flex-col gap-1 text-sm">
          {data.conditions.map((c) => {
            const left = c.remainingMs - sinceFetchMs;
            return (
              <li key={c.id} className="flex flex-wrap items-center gap-2">
                <StatusBadge status={left <= 0 ? 'alarm' : conditionBadge[c.state]} />
                <strong>{c.title}</strong>
                <span className={`reading ${left <= 0 ? 'font-bold text-alarm' : ''}`}>{left <= 0 ? formatRemaining(left) : `${formatRemaining(left)} left`}</span>
                <span className="text-muted">deadline {c.limitLocal} ({timeZone})</span>
              </li>
            );
          })}
        </ul>
      </section>
    </article>
  );
}
