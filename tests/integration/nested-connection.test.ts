// Queries made while a transaction's work runs belong to it, passed or not: a forgotten
// `{ transaction }` no longer holds a second pooled connection (under load that stalled the server
// until the pool's acquire timeout). What still would take one is refused in tests.
import { afterAll, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { createSequelize, NestedConnectionError } from '../../server/db/sequelize';

const sequelize = createSequelize(process.env.TEST_DATABASE_URL!);
afterAll(() => sequelize.close());
const connectionId = async (options: object = {}) =>
  (await sequelize.query<{ id: number }>('SELECT CONNECTION_ID() AS id', { type: QueryTypes.SELECT, ...options }))[0]!.id;

it('runs a query that did not pass its transaction inside that transaction, on its connection', async () => {
  await sequelize.transaction(async (transaction) => {
    const own = await connectionId({ transaction });
    expect(await connectionId()).toBe(own);
    // Nested helpers and parallel reads too.
    const helper = async () => connectionId();
    expect(await Promise.all([helper(), helper()])).toEqual([own, own]);
  });
});

it('runs after-commit work outside the finished transaction', async () => {
  let afterCommit: unknown = null;
  await sequelize.transaction(async (transaction) => {
    transaction.afterCommit(async () => {
      afterCommit = await sequelize.query('SELECT 2 AS two', { type: QueryTypes.SELECT });
    });
  });
  expect(afterCommit).toEqual([{ two: 2 }]);
});

it('refuses what would still take a second connection: an explicit opt-out, or a transaction begun inside one', async () => {
  await expect(sequelize.transaction(() => sequelize.query('SELECT 1', { type: QueryTypes.SELECT, transaction: null }))).rejects.toBeInstanceOf(NestedConnectionError);
  await expect(sequelize.transaction(() => sequelize.transaction(() => sequelize.query('SELECT 1')))).rejects.toBeInstanceOf(NestedConnectionError);
});
