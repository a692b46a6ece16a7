import type { ImportRowReport } from '../../../../shared/schemas/imports';
import { formatStationTime } from '../../../../shared/station-time';

export function ProblemRows({ rows, timeZone }: { rows: ImportRowReport[]; timeZone: string }) {
  const problems = rows.filter((r) => r.status !== 'valid');
  if (!problems.length) return null;
  return (
    <div className="max-h-80 overflow-auto rounded-lg border border-line bg-panel p-3">
      <h3 className="mb-2 font-bold">Rows that will not be imported</h3>
      <table className="w-full text-left text-sm">
        <thead>
          <tr className="text-muted">
            <th>Line</th>
            <th>Time (station time, {timeZone})</th>
            <th>Why</th>
          </tr>
        </thead>
        <tbody>
          {problems.map((r) => (
            <tr key={r.row} className="border-t border-line align-top">
              <td className="reading pr-2">{r.row}</td>
              <td className="reading pr-2">{r.takenAt ? formatStationTime(r.takenAt, timeZone, 'datetime-seconds') : '—'}</td>
              <td>
                {r.status === 'duplicate' ? '⧉ ' : '⚠ '}
                {Object.entries(r.errors)
                  .map(([field, message]) => `${field}: ${message}`)
                  .join('; ')}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
