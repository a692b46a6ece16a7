import type { Status } from '../../../shared/calc/limits';

// Meaning carried three ways: icon shape, word and colour.
const look: Record<Status, { icon: string; word: string; className: string }> = {
  normal: { icon: '●', word: 'Normal', className: 'border-normal text-normal' },
  watch: { icon: '▲', word: 'Watch', className: 'border-watch text-watch' },
  alarm: { icon: '◆', word: 'Alarm', className: 'border-alarm text-alarm bg-field' },
  unknown: { icon: '○', word: 'No value', className: 'border-line text-muted' },
};

export function StatusBadge({ status }: { status: Status }) {
  const s = look[status];
  return (
    <span className={`inline-flex items-center gap-1 rounded-full border-2 px-2 py-0.5 text-xs font-bold ${s.className}`}>
      <span aria-hidden="true">{s.icon}</span>
      {s.word}
    </span>
  );
}
