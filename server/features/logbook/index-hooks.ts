// Keeps the logbook search index current: every write to a logbook table, through any service,
// refreshes its document in the writer's own transaction (so a rolled-back write leaves no trace
// in the index either). Registered once per model init.
import type { Model, ModelStatic, Sequelize, Transaction, WhereOptions } from 'sequelize';
import { LogAmendment, LogEntry } from '../log/index';
import { StandingOrder } from '../standing-orders/index';
import { Handover, HandoverAmendment, HandoverItem, HandoverQuery } from '../handovers/index';
import { Flag } from '../flags/index';
import { ReadingAmendment, ReadingValue } from '../readings/index';
import { Condition } from '../conditions/index';
import { indexDocuments, type DocumentKind } from './documents';

type AnyModel = ModelStatic<Model>;
type Options = { transaction?: Transaction | null; where?: WhereOptions; fields?: string[] };
const HOOK = 'logbook-index';

export function registerLogbookIndexHooks(sequelize: Sequelize) {
  /** `shownFields`: when given, an update touching none of them leaves the document as it is. */
  const watch = (model: AnyModel, kind: DocumentKind, idOf: (row: Model) => number = (row) => Number(row.get('id')), shownFields?: string[]) => {
    const matters = (options: Options) => !shownFields || !options.fields || options.fields.some((f) => shownFields.includes(f));
    const refresh = (ids: number[], options: Options) => (matters(options) ? indexDocuments(sequelize, kind, [...new Set(ids)], options.transaction) : Promise.resolve());
    const add = (type: 'afterCreate' | 'afterUpdate' | 'afterBulkCreate' | 'afterBulkUpdate', fn: (...args: never[]) => Promise<void>) => {
      model.removeHook(type, HOOK);
      model.addHook(type, HOOK, fn as never);
    };
    add('afterCreate', (row: Model, options: Options) => refresh([idOf(row)], options));
    add('afterUpdate', (row: Model, options: Options) => refresh([idOf(row)], options));
    add('afterBulkCreate', (rows: Model[], options: Options) => refresh(rows.map(idOf), options));
    add('afterBulkUpdate', async (options: Options) => {
      // The services update by id (plus a version or status check that no longer matches after the update).
      const id = (options.where as { id?: unknown } | undefined)?.id;
      if (typeof id === 'number') return refresh([id], options);
      const rows = await model.findAll({ where: options.where, attributes: ['id'], transaction: options.transaction ?? undefined });
      return refresh(rows.map(idOf), options);
    });
  };
  watch(LogEntry as unknown as AnyModel, 'log_entry');
  watch(LogAmendment as unknown as AnyModel, 'log_amendment');
  watch(StandingOrder as unknown as AnyModel, 'standing_order');
  watch(Handover as unknown as AnyModel, 'handover_notes');
  watch(HandoverItem as unknown as AnyModel, 'handover_item');
  watch(HandoverQuery as unknown as AnyModel, 'handover_query');
  watch(HandoverAmendment as unknown as AnyModel, 'handover_amendment');
  // Each round refreshes its open flags (last value, last seen): that is not in the document.
  watch(Flag as unknown as AnyModel, 'flag', undefined, ['parameter', 'origin', 'severity', 'status', 'raisedAt', 'raisedBy', 'comment', 'followUp', 'clearComment', 'unitId']);
  watch(Condition as unknown as AnyModel, 'condition');
  // A round's document is about its values and amendments, written after the round row itself.
  watch(ReadingValue as unknown as AnyModel, 'round', (row) => Number(row.get('readingSetId')));
  watch(ReadingAmendment as unknown as AnyModel, 'round', (row) => Number(row.get('readingSetId')));
}
