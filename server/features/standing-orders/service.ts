// Standing orders: a shift lead issues, everyone in scope acknowledges having read it.
import { richTextToPlain, sanitizeRichText } from '../../lib/rich-text';
import { Op, QueryTypes, type Sequelize } from 'sequelize';
import { recordAudit } from '../../lib/audit';
import { jsonColumn } from '../../lib/json-column';
import { Conflict, Forbidden, NotFound, ValidationError } from '../../lib/errors';
import { publish } from '../../lib/live';
import { unitOfWork } from '../../lib/unit-of-work';
import { rolesFor } from '../../../shared/policies/permissions';
import { countCrewsOfStation, findStation, firstStation } from '../plant/index';
import { findPeople, findPerson, namesOf } from '../users/index';
import { shiftChangeAt } from '../shifts/index';
import { StandingOrder, StandingOrderAck } from './model';

const inScopeRoles = rolesFor('order.acknowledge');

export function orderInForce(order: StandingOrder, now = new Date()) {
  return order.effectiveFrom <= now && (!order.effectiveTo || order.effectiveTo > now);
}

/** The people an order asks to acknowledge it: active crew members in its crews and positions. */
export async function peopleInScope(order: StandingOrder) {
  return findPeople({
    activeOnly: true,
    roles: inScopeRoles,
    ...(order.crewIds.length ? { crewIds: order.crewIds } : {}),
    ...(order.positions.length ? { positions: order.positions } : {}),
  });
}

function inScope(order: Pick<StandingOrder, 'crewIds' | 'positions'>, user: { role: string; crewId: number | null; position?: string | null }) {
  return (
    (inScopeRoles as readonly string[]).includes(user.role) &&
    (!order.crewIds.length || (user.crewId !== null && order.crewIds.includes(user.crewId))) &&
    (!order.positions.length || (user.position != null && order.positions.includes(user.position)))
  );
}

export function makeStandingOrderService(sequelize: Sequelize) {
  async function issue(actorId: number, stationId: number, input: { title: string; bodyHtml: string; effectiveFrom: string; effectiveTo?: string | null; crewIds: number[]; positions: string[] }) {
    const bodyHtml = sanitizeRichText(input.bodyHtml);
    const bodyText = richTextToPlain(input.bodyHtml);
    if (!bodyText) throw new ValidationError({ bodyHtml: 'Write the order' });
    if (input.crewIds.length) {
      const crews = await countCrewsOfStation(stationId, input.crewIds);
      if (crews !== new Set(input.crewIds).size) throw new ValidationError({ crewIds: 'Unknown crew' });
    }
    return unitOfWork(sequelize, async (transaction) => {
      const created = await StandingOrder.create(
        {
          stationId,
          title: input.title,
          bodyHtml,
          bodyText,
          effectiveFrom: new Date(input.effectiveFrom),
          effectiveTo: input.effectiveTo ? new Date(input.effectiveTo) : null,
          crewIds: [...new Set(input.crewIds)],
          positions: [...new Set(input.positions)],
          issuedBy: actorId,
          issuedAt: new Date(),
        },
        { transaction },
      );
      await recordAudit({ actorId, action: 'standing_order.issue', entity: 'standing_order', entityId: created.id, after: { title: input.title } }, transaction);
      // Orders are station-wide: everyone signed in hears of them.
      publish(transaction, { entity: 'standing_order', id: created.id });
      return created;
    });
  }

  async function acknowledge(user: Express.User & { position?: string | null }, orderId: number) {
    const order = await StandingOrder.findByPk(orderId);
    if (!order) throw new NotFound('That standing order');
    const person = await findPerson(user.id);
    if (!person || !inScope(order, person)) throw new Forbidden('This order is not addressed to your crew or position');
    if (!orderInForce(order)) throw new Conflict('This order is not in force');
    if (await StandingOrderAck.findOne({ where: { orderId, userId: user.id } })) throw new Conflict('You have already acknowledged this order');
    return unitOfWork(sequelize, async (transaction) => {
      const ack = await StandingOrderAck.create({ orderId, userId: user.id, acknowledgedAt: new Date() }, { transaction });
      publish(transaction, { entity: 'standing_order', id: orderId });
      return ack;
    });
  }

  return { issue, acknowledge };
}
export type StandingOrderService = ReturnType<typeof makeStandingOrderService>;

/** The station asked for, or the first station when none is named. */
export async function stationIdOrFirst(stationId: number | undefined) {
  const station = stationId ? await findStation(stationId) : await firstStation();
  if (!station) throw new NotFound('That station');
  return station.id;
}

/** One order as shown, with the people it asks and who has acknowledged. */
export async function getOrder(id: number) {
  const order = await StandingOrder.findByPk(id);
  if (!order) throw new NotFound('That standing order');
  return presentOrder(order, true);
}

/** A station's orders in force at some time in [start, end) (a past shift's view). */
export function ordersInForceDuring(stationId: number, start: Date, end: Date) {
  return StandingOrder.findAll({
    where: { stationId, effectiveFrom: { [Op.lt]: end }, [Op.or]: [{ effectiveTo: null }, { effectiveTo: { [Op.gte]: start } }] },
    order: [['issuedAt', 'ASC']],
  });
}

export async function listOrders(stationId: number, q: { state: 'in_force' | 'archived' | 'all'; q?: string }) {
  const now = new Date();
  const where: Record<string | symbol, unknown> = { stationId };
  if (q.state === 'in_force') Object.assign(where, { effectiveFrom: { [Op.lte]: now }, [Op.or]: [{ effectiveTo: null }, { effectiveTo: { [Op.gt]: now } }] });
  if (q.state === 'archived') where.effectiveTo = { [Op.lte]: now };
  if (q.q) {
    const like = `%${q.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    where[Op.and] = [{ [Op.or]: [{ title: { [Op.like]: like } }, { bodyText: { [Op.like]: like } }] }];
  }
  const orders = await StandingOrder.findAll({ where, order: [['effectiveFrom', 'DESC']], limit: 200 });
  return Promise.all(orders.map((o) => presentOrder(o, false)));
}

export async function presentOrder(order: StandingOrder, withPeople: boolean) {
  const [scope, acks, issuer] = await Promise.all([peopleInScope(order), StandingOrderAck.findAll({ where: { orderId: order.id } }), namesOf([order.issuedBy])]);
  const acked = new Map(acks.map((a) => [a.userId, a.acknowledgedAt]));
  const view = {
    id: order.id,
    title: order.title,
    bodyHtml: order.bodyHtml,
    effectiveFrom: order.effectiveFrom.toISOString(),
    effectiveTo: order.effectiveTo?.toISOString() ?? null,
    inForce: orderInForce(order),
    crewIds: order.crewIds,
    positions: order.positions,
    issuedBy: issuer.get(order.issuedBy) ?? `#${order.issuedBy}`,
    issuedAt: order.issuedAt.toISOString(),
    inScope: scope.length,
    acknowledged: scope.filter((p) => acked.has(p.id)).length,
  };
  if (!withPeople) return view;
  return {
    ...view,
    people: scope.map((p) => ({ id: p.id, name: p.name, role: p.role, acknowledgedAt: acked.get(p.id)?.toISOString() ?? null })),
  };
}

/**
 * Orders in force that ask this person to acknowledge and that they have not yet — prompted while
 * their crew is on shift (always, where the station has no crew rotation or they have no crew).
 */
export async function pendingFor(userId: number) {
  // One statement (the front page asks it for everyone on every visit): the orders in force, the
  // person, and whether they have read each one.
  type Row = { id: number; stationId: number; title: string; bodyHtml: string; effectiveFrom: Date; crewIds: number[] | string; positions: string[] | string; role: string; crewId: number | null; position: string | null };
  const now = new Date();
  const rows = await StandingOrder.sequelize!.query<Row>(
    `SELECT o.id, o.station_id AS stationId, o.title, o.body_html AS bodyHtml, o.effective_from AS effectiveFrom, o.crew_ids AS crewIds, o.positions,
       u.role, u.crew_id AS crewId, u.position
     FROM users u
     JOIN standing_orders o ON o.effective_from <= ? AND (o.effective_to IS NULL OR o.effective_to > ?)
     WHERE u.id = ? AND NOT EXISTS (SELECT 1 FROM standing_order_acks a WHERE a.order_id = o.id AND a.user_id = u.id)
     ORDER BY o.id`,
    { replacements: [now, now, userId], type: QueryTypes.SELECT },
  );
  if (rows.length === 0) return [];
  const person = { role: rows[0]!.role, crewId: rows[0]!.crewId, position: rows[0]!.position };
  const onShift = new Map<number, boolean>();
  for (const stationId of new Set(rows.map((o) => o.stationId))) {
    const crewNow = person.crewId === null ? null : (await shiftChangeAt(stationId, now)).outgoingCrewId;
    onShift.set(stationId, crewNow === null || crewNow === person.crewId);
  }
  return rows
    .filter((o) => inScope({ crewIds: jsonColumn<number[]>(o.crewIds) ?? [], positions: jsonColumn<string[]>(o.positions) ?? [] }, person) && onShift.get(o.stationId))
    .map((o) => ({ id: Number(o.id), title: o.title, bodyHtml: o.bodyHtml, effectiveFrom: new Date(o.effectiveFrom).toISOString() }));
}
