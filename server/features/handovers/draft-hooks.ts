// Keeps the handover being written in step with the plant: a flag raised or escalated, a condition
// opened, a log entry marked for handover or a standing order issued reaches the unit's draft in
// the writer's own transaction (and its live event), whichever service made the change. A read of
// the board never writes; these writes do.
import { Op, type Model, type ModelStatic, type Transaction } from 'sequelize';
import { publish } from '../../lib/live';
import { Condition } from '../conditions/index';
import { Flag } from '../flags/index';
import { LogEntry } from '../log/index';
import { unitIdsOfStation } from '../plant/index';
import { StandingOrder } from '../standing-orders/index';
import { syncAutomaticItems } from './auto-items';
import { Handover } from './model';

type Options = { transaction?: Transaction | null; fields?: string[] };
const HOOK = 'handover-draft-items';
/** A draft older than this is abandoned, not "being written". */
const DRAFT_HORIZON_MS = 24 * 3_600_000;

async function syncDraftsOf(unitIds: number[], transaction: Transaction | null | undefined) {
  if (!transaction || unitIds.length === 0) return;
  const now = Date.now();
  const drafts = await Handover.findAll({
    where: { unitId: unitIds, status: 'draft', shiftStart: { [Op.lte]: new Date(now) }, handoverAt: { [Op.gt]: new Date(now - DRAFT_HORIZON_MS) } },
    transaction,
  });
  for (const draft of drafts) {
    if (await syncAutomaticItems(draft, transaction)) publish(transaction, { entity: 'handover', id: draft.id, unitId: draft.unitId });
  }
}

export function registerHandoverDraftHooks() {
  const watch = <M extends Model>(model: ModelStatic<M>, unitsOf: (row: M, transaction: Transaction | null | undefined) => Promise<number[]> | number[], fieldsThatMatter?: string[]) => {
    const matters = (options: Options) => !fieldsThatMatter || !options.fields || options.fields.some((f) => fieldsThatMatter.includes(f));
    const run = async (row: M, options: Options) => {
      if (matters(options) && options.transaction) await syncDraftsOf(await unitsOf(row, options.transaction), options.transaction);
    };
    for (const type of ['afterCreate', 'afterUpdate'] as const) {
      model.removeHook(type, HOOK);
      model.addHook(type, HOOK, run as never);
    }
  };
  // A round refreshes its open flags' last value on every save; only a change of what the item shows matters.
  watch(Flag, (f) => [f.unitId], ['severity', 'status']);
  watch(Condition, (c) => [c.unitId], ['title', 'requiredAction', 'closedAt']);
  watch(LogEntry, (e) => (e.carryToHandover ? [e.unitId] : []));
  watch(StandingOrder, (o, transaction) => unitIdsOfStation(o.stationId, transaction ?? undefined));
}
