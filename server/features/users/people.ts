// The lookups of people other features ask for: names for what they show, who is on a crew, whom
// a notice goes to. Nothing here writes.
import { Op, type Transaction } from 'sequelize';
import type { Role } from '../../../shared/roles';
import { User } from './model';

/** Names by id for the ids given (nulls skipped); an id with no person is simply absent. */
export async function namesOf(ids: readonly (number | null | undefined)[], transaction?: Transaction): Promise<Map<number, string>> {
  const wanted = [...new Set(ids.filter((id): id is number => typeof id === 'number'))];
  if (wanted.length === 0) return new Map();
  return new Map((await User.findAll({ where: { id: wanted }, attributes: ['id', 'name'], transaction })).map((u) => [u.id, u.name]));
}

export function findPerson(id: number, transaction?: Transaction) {
  return User.findByPk(id, { transaction });
}

/** Takes the person's row lock for the rest of the transaction (decisions about one trainee take turns). */
export async function lockPerson(id: number, transaction: Transaction) {
  await User.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
}

/** Active people, by name: id, name and role only (for pickers). */
export async function activePeople() {
  const people = await User.findAll({ where: { active: true }, attributes: ['id', 'name', 'role'], order: [['name', 'ASC']] });
  return people.map((p) => ({ id: p.id, name: p.name, role: p.role }));
}

export type PeopleFilter = {
  ids?: number[];
  crewIds?: number[];
  roles?: readonly Role[];
  positions?: string[];
  activeOnly?: boolean;
};

/** People matching every condition given, by name. */
export function findPeople(filter: PeopleFilter, transaction?: Transaction) {
  const where: Record<string | symbol, unknown> = {};
  if (filter.ids) where.id = filter.ids;
  if (filter.crewIds) where.crewId = { [Op.in]: filter.crewIds };
  if (filter.roles) where.role = [...filter.roles];
  if (filter.positions) where.position = filter.positions;
  if (filter.activeOnly) where.active = true;
  return User.findAll({ where, attributes: ['id', 'name', 'email', 'role', 'crewId', 'position', 'active'], order: [['name', 'ASC']], transaction });
}

/** Anyone who is on any of these crews or is one of these people (the overview's crews and names at once). */
export function peopleOnCrewsOrIds(crewIds: number[], ids: number[]) {
  const anyOf: Record<string, unknown>[] = [];
  if (crewIds.length) anyOf.push({ crewId: crewIds });
  if (ids.length) anyOf.push({ id: ids });
  if (!anyOf.length) return Promise.resolve([]);
  return User.findAll({ where: { [Op.or]: anyOf }, attributes: ['id', 'name', 'role', 'crewId', 'active'] });
}
