// The lookups of people other features ask for: names for what they show, who is on a crew, whom
// a notice goes to. Nothing here writes.
import { Op, type Transaction } from 'sequelize';
import type { Role } from '../../../shared/roles';
import { referenceRead } from '../../lib/reference-cache';
import { User } from './model';

type DirectoryEntry = { id: number; name: string; role: Role; crewId: number | null; active: boolean };

/**
 * Everyone's name, role, crew and whether they are active: asked by nearly every page (the names
 * beside log entries, rounds and comments; the crew on shift), changed when an administrator edits
 * a person. Kept as reference data (lib/reference-cache.ts): any write to users through the model
 * forgets it, other nodes hear of it, and nothing is kept longer than a minute.
 */
function directory(transaction?: Transaction): Promise<{ list: DirectoryEntry[]; byId: Map<number, DirectoryEntry> }> {
  return referenceRead(
    'people-directory',
    async () => {
      const rows = await User.findAll({ attributes: ['id', 'name', 'role', 'crewId', 'active'], order: [['id', 'ASC']], transaction });
      const list = rows.map((u) => ({ id: u.id, name: u.name, role: u.role, crewId: u.crewId, active: Boolean(u.active) }));
      return { list, byId: new Map(list.map((p) => [p.id, p])) };
    },
    transaction,
  );
}

/** Names by id for the ids given (nulls skipped); an id with no person is simply absent. */
export async function namesOf(ids: readonly (number | null | undefined)[], transaction?: Transaction): Promise<Map<number, string>> {
  const wanted = [...new Set(ids.filter((id): id is number => typeof id === 'number'))];
  if (wanted.length === 0) return new Map();
  const { byId } = await directory(transaction);
  return new Map(wanted.flatMap((id) => (byId.has(id) ? [[id, byId.get(id)!.name] as const] : [])));
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
export async function peopleOnCrewsOrIds(crewIds: number[], ids: number[]): Promise<DirectoryEntry[]> {
  if (!crewIds.length && !ids.length) return [];
  const { list } = await directory();
  return list.filter((p) => (p.crewId !== null && crewIds.includes(p.crewId)) || ids.includes(p.id));
}
