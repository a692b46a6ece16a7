import { useLayoutEffect, useRef } from 'react';
import type { Evaluation, CheckResult } from '../../../shared/calc/evaluate';
import { displayQuantity, type DisplayPreferences } from '../../../shared/display';
import { StatusBadge } from '../ui/status-badge';
import { Button } from '../ui/button';

type Props = {
  evaluation: Evaluation | null;
  prefs: DisplayPreferences;
  /** The id of the full checks panel the button takes the person to. */
  panelId: string;
};

const severity = { alarm: 0, watch: 1 } as const;

/** The checks to name in the summary (alarm before watch), and how many of the rest are normal or not computed. */
export function summariseChecks(evaluation: Evaluation) {
  const checks = Object.values(evaluation.checks);
  const raised = checks
    .filter((c): c is CheckResult & { status: 'alarm' | 'watch' } => c.status === 'alarm' || c.status === 'watch')
    .sort((a, b) => severity[a.status] - severity[b.status]);
  return {
    raised,
    normal: checks.filter((c) => c.status === 'normal').length,
    notComputed: checks.filter((c) => c.status === 'unknown').length,
  };
}

/**
 * The checks in a few lines that stay in view while a round is typed on a tablet or phone (below lg the full
 * panel is under the form, far down the page): every check not Normal with its value, unit and status (shape and
 * word, not colour alone), a count of the rest, and a button to the full panel. Sticky at the top of the form,
 * so a phone's keyboard never covers it. Not a live region: the full panel already announces, and a second
 * voice on every keystroke would only be noise.
 */
export function ChecksSummary({ evaluation, prefs, panelId }: Props) {
  const box = useRef<HTMLElement>(null);
  // The form's fields scroll into view below the bar, not under it (styles.css: --checks-summary-height).
  useLayoutEffect(() => {
    const bar = box.current;
    const form = bar?.parentElement;
    if (!bar || !form || typeof ResizeObserver === 'undefined') return;
    const observer = new ResizeObserver(() => form.style.setProperty('--checks-summary-height', `${bar.offsetHeight}px`));
    observer.observe(bar);
    return () => observer.disconnect();
  }, []);
  const toPanel = () => {
    const panel = document.getElementById(panelId);
    panel?.scrollIntoView({ block: 'start' });
    panel?.focus({ preventScroll: true });
  };
  const summary = evaluation ? summariseChecks(evaluation) : null;
  return (
    <section
      ref={box}
      aria-label="Checks so far"
      data-testid="checks-summary"
      className="sticky top-0 z-20 -mx-4 -mt-4 flex max-h-[40vh] flex-col gap-1 overflow-y-auto rounded-t-lg border-b-2 border-line bg-panel px-4 py-2 shadow-md lg:hidden"
    >
      {summary ? (
        <>
          {summary.raised.length ? (
            <ul className="flex flex-col gap-0.5">
              {summary.raised.map((check) => {
                const shown = check.value === null ? null : displayQuantity(check.value, check.quantity, prefs);
                return (
                  <li key={check.key} className="flex flex-wrap items-center gap-x-2 text-xs leading-tight sm:text-sm" data-testid={`summary-${check.key}`}>
                    <StatusBadge status={check.status} />
                    <span className="font-bold">{check.label}</span>
                    <span className="reading">{shown ? `${shown.text} ${shown.unit}` : '—'}</span>
                  </li>
                );
              })}
            </ul>
          ) : (
            <p className="text-sm font-bold">● No check on watch or alarm.</p>
          )}
          <div className="flex flex-wrap items-center justify-between gap-2 text-sm">
            <span className="text-muted">
              {summary.raised.length ? `${summary.normal} more normal` : `${summary.normal} normal`}
              {summary.notComputed ? ` · ${summary.notComputed} not computed yet` : ''}
            </span>
            <Button tone="plain" size="sm" onClick={toPanel}>
              All checks ↓
            </Button>
          </div>
        </>
      ) : (
        <p className="text-sm text-muted">Checks appear here as you type the pressure, hotwell and both CW temperatures.</p>
      )}
    </section>
  );
}
