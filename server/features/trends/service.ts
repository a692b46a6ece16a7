// Time series of computed checks with the limit bands in force over the range and flag markers.
import { QueryTypes, type Sequelize } from 'sequelize';
import type { CheckKey } from '../../../shared/calc/check-catalog';
import { flagsRaisedBetween } from '../flags/index';
import { limitVersionsUpTo, requireUnit } from '../plant/index';

type Point = { t: Date; v: number; s: string; o: number };

export function makeTrendService(sequelize: Sequelize) {
  async function trends(unitId: number, q: { parameters: CheckKey[]; from: string; to: string }) {
    await requireUnit(unitId);
    const from = new Date(q.from);
    const to = new Date(q.to);
    // The series, the limit versions and the flags are independent reads: run them together.
    const [series, versions, flags] = await Promise.all([
      Promise.all(
        q.parameters.map(async (parameter) => {
          // Index-only range scan on (unit_id, parameter, taken_at, value, status, outside_plausible).
          const rows = await sequelize.query<Point>(
            `SELECT taken_at AS t, value AS v, status AS s, outside_plausible AS o FROM reading_values
             WHERE unit_id = ? AND parameter = ? AND taken_at BETWEEN ? AND ? ORDER BY taken_at`,
            { replacements: [unitId, parameter, from, to], type: QueryTypes.SELECT },
          );
          // Times as epoch milliseconds: a third of the bytes of ISO strings, and what charts plot.
          // `o`: outside the plausible range, sent only when true (the chart keeps it off the axis).
          return { parameter, points: rows.map((r) => ({ t: new Date(r.t).getTime(), v: r.v, s: r.s, ...(Number(r.o) ? { o: true } : {}) })) };
        }),
      ),
      limitVersionsUpTo(unitId, to),
      flagsRaisedBetween(unitId, q.parameters, from, to),
    ]);
    // Limit versions: the one in force at `from` and every one that starts inside the range.
    const bands = versions
      .map((v, i) => ({ from: v.effectiveFrom, to: versions[i + 1]?.effectiveFrom ?? to, limits: v.limits }))
      .filter((b) => b.to >= from)
      .map((b) => ({
        from: (b.from < from ? from : b.from).toISOString(),
        to: b.to.toISOString(),
        bands: Object.fromEntries(q.parameters.map((p) => [p, b.limits[p] ?? null])),
      }));
    return {
      series,
      limitBands: bands,
      flags: flags.map((f) => ({ id: f.id, parameter: f.parameter, severity: f.severity, status: f.status, origin: f.origin, raisedAt: f.raisedAt.toISOString(), clearedAt: f.clearedAt?.toISOString() ?? null })),
    };
  }
  return { trends };
}
export type TrendService = ReturnType<typeof makeTrendService>;
