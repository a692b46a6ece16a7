import { AsyncLocalStorage } from 'node:async_hooks';
import { Sequelize, type Transaction } from 'sequelize';

/**
 * Every query made while a transaction's work runs belongs to that transaction, whether or not the
 * code passed it. Without this, a helper that forgot `{ transaction }` (the station's settings read
 * while writing a log entry, say) took a second connection from the pool while the first was held;
 * at 200 clients every connection was held by a transaction waiting for another one and the whole
 * server stood still until the pool's 60 s acquire timeout. Sequelize's own continuation-local
 * storage does this given a namespace; Node's AsyncLocalStorage provides one (the cls-hooked package
 * Sequelize's documentation names is unmaintained). The transaction is cleared from the context at
 * commit or rollback, so after-commit work (live events, the outbox) runs outside it.
 */
const context = new AsyncLocalStorage<Map<string, unknown>>();
const transactionContext = {
  run(fn: (store: Map<string, unknown>) => unknown) {
    // A context begun inside another sees the outer transaction (so the guard below can tell).
    const store = new Map<string, unknown>(context.getStore() ?? []);
    return context.run(store, () => fn(store));
  },
  bind<F extends (...args: never[]) => unknown>(fn: F): F {
    return AsyncLocalStorage.bind(fn);
  },
  get: (key: string) => context.getStore()?.get(key),
  set: (key: string, value: unknown) => context.getStore()?.set(key, value),
};
Sequelize.useCLS(transactionContext);

/** The transaction whose work is running here (null outside one, or once it has finished). */
export function openTransaction(): Transaction | null {
  const open = transactionContext.get('transaction') as (Transaction & { finished?: string }) | null | undefined;
  return open && !open.finished ? open : null;
}

const POOL_MAX = 10;

export function createSequelize(databaseUrl: string): Sequelize {
  const sequelize = new Sequelize(databaseUrl, {
    dialect: 'mariadb',
    logging: false,
    timezone: '+00:00',
    define: { underscored: true },
    pool: { max: POOL_MAX, min: 0, idle: 10_000 },
  });
  sequelize.addHook('beforePoolAcquire', refuseSecondConnection);
  return sequelize;
}

export class NestedConnectionError extends Error {}
const strict = () => Boolean(process.env.VITEST) || process.env.HOTWELL_STRICT_TRANSACTIONS === '1';

/**
 * What the context cannot cover: a query that opts out (`transaction: null`) or a second transaction
 * begun inside an open one still takes another connection. Refused under test, where the stack names
 * the code; logged with it otherwise.
 */
function refuseSecondConnection() {
  const open = transactionContext.get('transaction') as (Transaction & { finished?: string }) | null | undefined;
  if (!open || open.finished) return;
  const limit = Error.stackTraceLimit;
  Error.stackTraceLimit = 40; // deep enough to reach the service that made the query
  const error = new NestedConnectionError('a query inside an open transaction took a second connection (transaction: null, or a transaction begun inside another)');
  Error.stackTraceLimit = limit;
  if (strict()) throw error;
  console.warn(`[db] ${error.message}\n${error.stack}`);
}
