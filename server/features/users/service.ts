import type { Sequelize } from 'sequelize';
import { UniqueConstraintError } from 'sequelize';
import argon2 from 'argon2';
import type { ChangePasswordInput, CreateUserInput, PublicUser, UpdateUserInput } from '../../../shared/schemas/auth';
import { recordAudit } from '../../lib/audit';
import { endSocketsOf, publish } from '../../lib/live';
import { hashPassword } from '../../lib/auth';
import { Conflict, Forbidden, NotFound, ValidationError, type FieldErrors } from '../../lib/errors';
import { passwordProblem } from '../../lib/password-policy';
import { crewNamesOf, findCrew } from '../plant/index';
import { endSessionsOf } from '../session/index';
import { User } from './model';

const crewNames = () => crewNamesOf();

export function presentUser(user: User, crews: Map<number, string>): PublicUser {
  return {
    id: user.id,
    name: user.name,
    email: user.email,
    role: user.role,
    crewId: user.crewId,
    crewName: user.crewId ? (crews.get(user.crewId) ?? null) : null,
    position: user.position ?? null,
    active: user.active,
    mustChangePassword: user.mustChangePassword,
    version: user.version,
  };
}

/** What the audit trail keeps of a user: never the password hash. */
const auditView = (user: User) => ({
  name: user.name,
  email: user.email,
  role: user.role,
  crewId: user.crewId,
  position: user.position ?? null,
  active: user.active,
  mustChangePassword: user.mustChangePassword,
});

export async function getPublicUser(id: number): Promise<PublicUser> {
  const user = await User.findByPk(id);
  if (!user) throw new NotFound('That person');
  return presentUser(user, await crewNames());
}

export async function listUsers(): Promise<PublicUser[]> {
  const [users, crews] = await Promise.all([User.findAll({ order: [['name', 'ASC']] }), crewNames()]);
  return users.map((u) => presentUser(u, crews));
}

async function assertCrewExists(crewId: number | null | undefined) {
  if (crewId == null) return;
  if (!(await findCrew(crewId))) throw new ValidationError({ crewId: 'No such crew' });
}

export function makeUserService(sequelize: Sequelize) {
  async function addPerson(actorId: number, input: CreateUserInput): Promise<PublicUser> {
    const problem = passwordProblem(input.temporaryPassword, input);
    if (problem) throw new ValidationError({ temporaryPassword: problem });
    await assertCrewExists(input.crewId);
    const passwordHash = await hashPassword(input.temporaryPassword);
    try {
      const user = await sequelize.transaction(async (transaction) => {
        const created = await User.create(
          { name: input.name, email: input.email, role: input.role, crewId: input.crewId, passwordHash, mustChangePassword: true },
          { transaction },
        );
        await recordAudit(
          { actorId, action: 'user.create', entity: 'user', entityId: created.id, after: auditView(created) },
          transaction,
        );
        publish(transaction, { entity: 'people', id: created.id });
        return created;
      });
      return presentUser(user, await crewNames());
    } catch (error) {
      if (error instanceof UniqueConstraintError) throw new ValidationError({ email: 'Someone already has this e-mail address' });
      throw error;
    }
  }

  /**
   * Applies a change to one user under a version check, with its audit row, in one transaction.
   * `alsoInTransaction` runs inside that transaction, before it commits, so what it writes stands or
   * falls with the change.
   */
  async function change(
    actorId: number,
    id: number,
    expectedVersion: number,
    action: string,
    mutate: (user: User) => void,
    alsoInTransaction?: (transaction: import('sequelize').Transaction) => Promise<unknown>,
  ): Promise<PublicUser> {
    const user = await sequelize.transaction(async (transaction) => {
      const found = await User.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      if (!found) throw new NotFound('That person');
      if (found.version !== expectedVersion) {
        throw new Conflict('Someone else changed this person since you opened the page; reload and try again');
      }
      const before = auditView(found);
      mutate(found);
      found.version = found.version + 1;
      await found.save({ transaction });
      await recordAudit({ actorId, action, entity: 'user', entityId: id, before, after: auditView(found) }, transaction);
      publish(transaction, { entity: 'people', id });
      if (alsoInTransaction) await alsoInTransaction(transaction);
      return found;
    });
    return presentUser(user, await crewNames());
  }

  async function changePerson(actorId: number, id: number, input: UpdateUserInput) {
    if (id === actorId && input.role && input.role !== 'admin') {
      throw new Forbidden('You cannot remove your own administrator role');
    }
    await assertCrewExists(input.crewId);
    return change(actorId, id, input.version, 'user.update', (user) => {
      if (input.role !== undefined) user.role = input.role;
      if (input.crewId !== undefined) user.crewId = input.crewId;
      if (input.position !== undefined) user.position = input.position;
    });
  }

  async function setActive(actorId: number, id: number, version: number, active: boolean) {
    if (id === actorId && !active) throw new Forbidden('You cannot deactivate your own account');
    return change(
      actorId,
      id,
      version,
      active ? 'user.reactivate' : 'user.deactivate',
      (user) => {
        user.active = active;
      },
      // A deactivated person's open sessions end with the same commit, and their live connections with it.
      active
        ? undefined
        : async (transaction) => {
            await endSessionsOf(id, transaction);
            endSocketsOf(transaction, { userId: id });
          },
    );
  }

  /**
   * Changes the person's own password. Whoever knew the old one may be signed in elsewhere: every
   * other session of theirs ends with the same commit, and its live connections with it; the
   * session the change was made in (`keepSessionId`) carries on.
   */
  async function changeOwnPassword(userId: number, input: ChangePasswordInput, keepSessionId: string) {
    const user = await User.findByPk(userId);
    if (!user) throw new NotFound('Your account');
    const fields: FieldErrors = {};
    const ok = await argon2.verify(user.passwordHash, input.currentPassword).catch(() => false);
    if (!ok) fields.currentPassword = 'This is not your current password';
    const problem = passwordProblem(input.newPassword, user);
    if (problem) fields.newPassword = problem;
    if (Object.keys(fields).length) throw new ValidationError(fields);
    const passwordHash = await hashPassword(input.newPassword);
    await sequelize.transaction(async (transaction) => {
      await user.update({ passwordHash, mustChangePassword: false, version: user.version + 1 }, { transaction });
      const ended = await endSessionsOf(userId, transaction, keepSessionId);
      await recordAudit(
        { actorId: userId, action: 'user.password_change', entity: 'user', entityId: userId, after: { mustChangePassword: false, otherSessionsEnded: ended } },
        transaction,
      );
      endSocketsOf(transaction, { userId, exceptSessionId: keepSessionId });
      publish(transaction, { entity: 'people', id: userId });
    });
  }

  return { addPerson, changePerson, setActive, changeOwnPassword };
}
export type UserService = ReturnType<typeof makeUserService>;
