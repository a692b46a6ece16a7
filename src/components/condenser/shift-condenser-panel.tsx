import type { Quantity } from '../../../shared/calc/check-catalog';
import { defaultDisplayPreferences, displayEnergy, displayMoney, displayQuantity, type DisplayPreferences } from '../../../shared/display';
import type { ShiftCheckState, ShiftCondenserState } from '../../../shared/shift-condenser';
import { stationLocalLabel } from '../../../shared/shift-time';
import { StatusBadge } from '../ui/status-badge';
import { Sparkline } from './sparkline';

const local = (iso: string, timeZone: string) => stationLocalLabel(new Date(iso), timeZone);
const clock = (iso: string, timeZone: string) => local(iso, timeZone).slice(11);

function CheckRow({ check, prefs, state }: { check: ShiftCheckState; prefs: DisplayPreferences; state: ShiftCondenserState }) {
  const tz = state.timeZone;
  const show = (value: number, quantity: Quantity = check.quantity) => {
    const d = displayQuantity(value, quantity, prefs);
    return `${d.text} ${d.unit}`;
  };
  const latest = check.latest.value === null ? null : displayQuantity(check.latest.value, check.quantity, prefs);
  const start = check.start;
  const startWhen = !start ? '' : start.t === state.shiftStart ? 'at the change' : start.basis === 'previous_shift' ? `previous shift, ${clock(start.t, tz)}` : `first round, ${clock(start.t, tz)}`;
  return (
    <li className="border-t border-line py-1.5" data-testid={`shift-check-${check.key}`}>
      <div className="flex items-center gap-2">
        <span className="flex-1 text-sm font-bold">{check.label}</span>
        {latest ? (
          <span className="reading text-lg font-semibold whitespace-nowrap">
            {latest.text} <span className="text-sm font-normal text-muted">{latest.unit}</span>
          </span>
        ) : (
          <span className="text-lg text-muted">—</span>
        )}
        <StatusBadge status={check.latest.status} />
      </div>
      <div className="flex items-center gap-2">
        <p className="flex-1 text-xs text-muted">
          {latest ? '' : `${check.latest.reason ?? 'no value'}. `}
          {start ? `Start ${show(start.value)} (${startWhen})` : 'Start —'}
          {check.min && check.max ? ` · min ${show(check.min.value)} at ${clock(check.min.t, tz)} · max ${show(check.max.value)} at ${clock(check.max.t, tz)}` : ' · no values in this shift'}
        </p>
        <Sparkline points={check.series} label={check.label} width={96} height={24} />
      </div>
    </li>
  );
}

type Props = {
  state: ShiftCondenserState;
  /** Set for a handover's frozen copy: when the outgoing crew submitted it. */
  frozenAt?: string | null;
  headingLevel?: 'h2' | 'h3';
  /** Paper has no disclosure triangle: the print view shows the rules open. */
  rulesOpen?: boolean;
};

/** The condenser over a shift, from its rounds: each check now, at the start, its range and trend, and the energy lost. */
export function ShiftCondenserPanel({ state, frozenAt = null, headingLevel = 'h2', rulesOpen = false }: Props) {
  const Heading = headingLevel;
  const tz = state.timeZone;
  const prefs: DisplayPreferences = { ...defaultDisplayPreferences, currency: state.energyLost.currency };
  const measuredTower = (c: ShiftCheckState) => c.key !== 'towerApproach' || c.series.length > 0 || c.start !== null;
  const shown = state.checks.filter(measuredTower);
  const energy = state.energyLost;
  return (
    <section aria-label="Condenser over the shift" className="flex flex-col gap-2 rounded-lg border border-line bg-panel p-3" data-testid={frozenAt ? 'condenser-frozen' : 'condenser-live'}>
      <Heading className="font-bold">{frozenAt ? `Condenser over the shift — as handed over at ${local(frozenAt, tz)}` : 'Condenser over the shift'}</Heading>
      <p className="text-sm text-muted">
        {frozenAt ? 'Frozen when the handover was submitted; rounds saved or corrected later are not in it. ' : 'Live. '}
        Shift from {local(state.shiftStart, tz)} to {local(state.until, tz)}, station time ({tz}).{' '}
        {state.latestRound ? `${state.roundsInShift} ${state.roundsInShift === 1 ? 'round' : 'rounds'}; latest at ${clock(state.latestRound.takenAt, tz)}.` : 'No round in this shift yet.'}
      </p>
      <div className="rounded-md border-2 border-line p-2" data-testid="energy-lost">
        <p className="text-sm font-bold">Lost to the backpressure deviation, this shift {frozenAt ? 'until the handover' : 'so far'}</p>
        {energy.megawattHours === null ? (
          <p className="text-sm text-muted">— {energy.reason}</p>
        ) : (
          <>
            <p className="reading text-xl font-semibold">
              {displayEnergy(energy.megawattHours).text} <span className="text-sm font-normal text-muted">MWh</span>
              {' · '}
              {energy.money === null ? (
                <span className="text-sm font-normal text-muted">money: {energy.reason}</span>
              ) : (
                <>
                  {displayMoney(energy.money, energy.currency).text} <span className="text-sm font-normal text-muted">{displayMoney(energy.money, energy.currency).unit}</span>
                </>
              )}
            </p>
            <p className="text-xs text-muted">
              Rounds cover {energy.hoursCovered.toFixed(1)} h of the {energy.hoursElapsed.toFixed(1)} h {frozenAt ? 'up to the handover' : 'so far'}; a negative figure means the condenser did better than expected.
            </p>
          </>
        )}
      </div>
      <ul className="flex flex-col">
        {shown.map((check) => (
          <CheckRow key={check.key} check={check} prefs={prefs} state={state} />
        ))}
      </ul>
      {shown.length < state.checks.length ? <p className="text-xs text-muted">Cooling-tower approach: not measured in this shift.</p> : null}
      <details className="text-xs text-muted" open={rulesOpen}>
        <summary>How these are worked out</summary>
        <p>Values are SI inside and shown in the units above. Status as judged when each round was taken, by the limits then in force.</p>
        <p>{state.rules.start}</p>
        <p>{state.rules.energy}</p>
      </details>
      <p className="text-xs">
        <strong>Caution — </strong>figures come from the rounds as recorded. Control-room indications, alarms and your plant’s procedures come first.
      </p>
    </section>
  );
}
