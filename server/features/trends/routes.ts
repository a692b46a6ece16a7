import { Router } from 'express';
import { Op, QueryTypes, type Sequelize } from 'sequelize';
import { trendQuerySchema } from '../../../shared/schemas/trends';
import { signedIn } from '../../lib/auth';
import { parseId, parseInput } from '../../lib/validate';
import { Flag } from '../flags/model';
import { LimitSetVersion } from '../plant/model';
import { requireUnit } from '../plant/versions';

type Point = { t: Date; v: number; s: string; o: number };

/** Time series of computed checks with the limit bands in force over the range and flag markers. */
export function trendRoutes(sequelize: Sequelize): Router {
  const router = Router();
  router.get('/units/:unitId/trends', signedIn, async (req, res) => {
    const unitId = parseId(req.params.unitId, 'unitId');
    const q = parseInput(trendQuerySchema, req.query);
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
      LimitSetVersion.findAll({ where: { unitId, effectiveFrom: { [Op.lte]: to } }, order: [['effectiveFrom', 'ASC'], ['id', 'ASC']] }),
      Flag.findAll({
        where: { unitId, parameter: q.parameters, raisedAt: { [Op.lte]: to }, [Op.or]: [{ clearedAt: null }, { clearedAt: { [Op.gte]: from } }] },
        order: [['raisedAt', 'ASC']],
        limit: 500,
      }),
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
    res.json({
      series,
      limitBands: bands,
      flags: flags.map((f) => ({ id: f.id, parameter: f.parameter, severity: f.severity, status: f.status, origin: f.origin, raisedAt: f.raisedAt.toISOString(), clearedAt: f.clearedAt?.toISOString() ?? null })),
    });
  });
  return router;
}
