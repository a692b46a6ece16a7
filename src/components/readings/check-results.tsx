import type { CheckKey } from '../../../shared/calc/check-catalog';
import type { Evaluation } from '../../../shared/calc/evaluate';
import { displayQuantity, type DisplayPreferences } from '../../../shared/display';
import { StatusBadge } from '../ui/status-badge';
import { Notice } from '../ui/notice';
import { OutsidePlausibleTag } from './plausibility';

const groups: { title: string; keys: CheckKey[] }[] = [
  { title: 'Measured', keys: ['backpressure', 'hotwellTemperature', 'cwInletTemperature', 'cwOutletTemperature', 'cwFlow', 'basinTemperature'] },
  {
    title: 'Condenser',
    keys: [
      'saturationTemperature', 'subcooling', 'ttd', 'itd', 'cwRise', 'lmtd', 'duty', 'overallU',
      'tubeVelocity', 'cleanU', 'cleanlinessFactor', 'expectedBackpressure', 'backpressureDeviation',
      'deviationCostPower', 'deviationCostMoney', 'dissolvedOxygen',
    ],
  },
  { title: 'Cooling tower', keys: ['wetBulb', 'towerRange', 'towerApproach', 'towerEffectiveness', 'evaporation', 'cycles', 'blowdownNeeded', 'makeupNeeded'] },
  { title: 'Water chemistry', keys: ['langelier', 'ryznar'] },
];

function plausibleBounds(range: { low: number; high: number }, quantity: Evaluation['checks'][CheckKey]['quantity'], prefs: DisplayPreferences) {
  const low = displayQuantity(range.low, quantity, prefs);
  const high = displayQuantity(range.high, quantity, prefs);
  return `${low.text}–${high.text} ${high.unit}`;
}

export function CheckResults({ evaluation, prefs }: { evaluation: Evaluation; prefs: DisplayPreferences }) {
  return (
    <div className="flex flex-col gap-4">
      {evaluation.implausible?.length ? (
        <p className="rounded-md border-2 border-watch bg-panel px-3 py-2 text-sm" data-testid="implausible-summary">
          <OutsidePlausibleTag keys={evaluation.implausible.map((i) => i.key)} /> The checks computed from{' '}
          {evaluation.implausible.length > 1 ? 'these values' : 'this value'} are withheld, not judged.
        </p>
      ) : null}
      {evaluation.notes.map((note) => (
        <p key={note} className="rounded-md border border-line bg-panel px-3 py-2 text-sm">
          ℹ {note}
        </p>
      ))}
      {evaluation.hints.length ? (
        <section aria-label="Possible causes" className="rounded-lg border-2 border-watch bg-panel p-3">
          <h3 className="font-bold">Possible causes to look into</h3>
          <ul className="mt-2 flex flex-col gap-2">
            {evaluation.hints.map((hint) => (
              <li key={hint.id}>
                <StatusBadge status={hint.severity} /> <strong>{hint.title}</strong> — {hint.detail}
                <span className="block text-xs text-muted">Basis: {hint.basis} A possibility, not a diagnosis.</span>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
      {groups.map((group) => (
        <section key={group.title} className="rounded-lg border border-line bg-panel p-3">
          <h3 className="mb-2 font-bold">{group.title}</h3>
          <table className="w-full text-left">
            <tbody>
              {group.keys.map((key) => {
                const check = evaluation.checks[key];
                const shown = check.value === null ? null : displayQuantity(check.value, check.quantity, prefs);
                return (
                  <tr key={key} className="border-t border-line align-top" data-testid={`check-${key}`}>
                    <td className="py-1.5 pr-2">
                      {check.label}
                      {check.reason ? <span className="block text-xs text-muted">{check.reason}</span> : null}
                      {check.outsidePlausible ? (
                        <span className="block text-xs font-bold text-watch">
                          ◇ outside the plausible range ({plausibleBounds(check.outsidePlausible, check.quantity, prefs)})
                        </span>
                      ) : null}
                    </td>
                    <td className="reading py-1.5 pr-2 text-right text-lg font-semibold whitespace-nowrap">
                      {shown ? (
                        <>
                          {shown.text} <span className="text-sm font-normal text-muted">{shown.unit}</span>
                        </>
                      ) : (
                        '—'
                      )}
                    </td>
                    <td className="py-1.5 text-right">
                      <StatusBadge status={check.status} />
                    </td>
                  </tr>
                );
              })}
            </tbody>
          </table>
        </section>
      ))}
    </div>
  );
}

export function EnterReadingsNotice() {
  return (
    <Notice kind="info">
      Enter the condenser pressure, the hotwell and both CW temperatures to see the checks. Add CW flow (or steam flow) for
      duty, cleanliness and expected backpressure.
    </Notice>
  );
}
