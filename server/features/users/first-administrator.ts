// The first administrator of a new installation (`npm run admin:create`): production never loads
// the demo people, so someone must be able to sign in. The password is made here, shown once by the
// command and kept only as a hash; it is a temporary one, so the first sign-in must replace it
// before anything else opens. Every later person is added by an administrator on the People page.
import { randomBytes } from 'node:crypto';
import type { Sequelize } from 'sequelize';
import { z } from 'zod';
import { recordAudit } from '../../lib/audit';
import { hashPassword } from '../../lib/auth';
import { User } from './model';

export class FirstAdministratorRefused extends Error {}

const inputSchema = z.object({
  email: z.email({ message: 'needs an e-mail address like jo.operator@plant.example' }).max(254),
  name: z.string().trim().min(1, { message: 'needs the person’s name' }).max(120),
});

export async function createFirstAdministrator(sequelize: Sequelize, input: { email?: string; name?: string }) {
  const parsed = inputSchema.safeParse({ email: input.email?.trim().toLowerCase(), name: input.name });
  if (!parsed.success) {
    throw new FirstAdministratorRefused(parsed.error.issues.map((issue) => `--${String(issue.path[0])} ${issue.message}`).join('; '));
  }
  const { email, name } = parsed.data;
  // 120 random bits, in letters a person can copy: never a dictionary word, never reused.
  const oneTimePassword = randomBytes(15).toString('base64url');
  const passwordHash = await hashPassword(oneTimePassword);
  const user = await sequelize.transaction(async (transaction) => {
    // Locks the administrators' rows, so two commands run at once make one administrator.
    const existing = await User.findOne({ where: { role: 'admin' }, transaction, lock: transaction.LOCK.UPDATE });
    if (existing) {
      throw new FirstAdministratorRefused(
        `an administrator exists already (${existing.email}); further people, administrators included, are added on the People page`,
      );
    }
    if (await User.findOne({ where: { email }, transaction })) throw new FirstAdministratorRefused(`${email} belongs to someone already`);
    const created = await User.create({ name, email, role: 'admin', crewId: null, passwordHash, mustChangePassword: true }, { transaction });
    await recordAudit(
      { actorId: null, action: 'user.create', entity: 'user', entityId: created.id, after: { name, email, role: 'admin', mustChangePassword: true, via: 'admin:create' } },
      transaction,
    );
    return created;
  });
  return { user, oneTimePassword };
}
