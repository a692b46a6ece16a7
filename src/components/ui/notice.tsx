import type { ReactNode } from 'react';

const styles = {
  error: { box: 'border-alarm', icon: '⛔', label: 'Error' },
  success: { box: 'border-normal', icon: '✔', label: 'Done' },
  info: { box: 'border-line', icon: 'ℹ', label: 'Note' },
};

/** A message box whose meaning is carried by its icon and label as well as its colour. */
export function Notice({ kind, children }: { kind: keyof typeof styles; children: ReactNode }) {
  const style = styles[kind];
  return (
    <div role={kind === 'error' ? 'alert' : 'status'} className={`rounded-md border-2 bg-panel px-4 py-3 ${style.box}`}>
      <span aria-hidden="true">{style.icon} </span>
      <span className="sr-only">{style.label}: </span>
      {children}
    </div>
  );
}

/** The standing caution: Hotwell records and computes; it does not protect the plant. */
export function CautionNote() {
  return (
    <aside className="rounded-md border border-watch bg-panel px-4 py-2 text-sm" aria-label="Caution">
      <strong>Caution — </strong>Hotwell is a record and an aid to judgement, not an alarm or protection system.
      Plant procedures, control-room alarms, licensed practice and local codes govern every action.
    </aside>
  );
}
