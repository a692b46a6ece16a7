// Liveness and readiness. `/api/health` says the process answers. `/api/ready` says this node
// should be sent work: the database answers, its schema has every migration this code expects,
// and the node is not draining for a stop. A balancer takes a node out while it answers 503.
import { QueryTypes, type Sequelize } from 'sequelize';
import { migrationNames } from '../db/migrator';

export type ReadyAnswer = { ready: true } | { ready: false; reason: string };

/** A database that does not answer within this is as good as down for a probe. */
const PROBE_TIMEOUT_MS = 2_000;

function within<T>(promise: Promise<T>, ms: number, what: string): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`${what} did not answer within ${ms} ms`)), ms);
    promise.then(
      (value) => {
        clearTimeout(timer);
        resolve(value);
      },
      (error: unknown) => {
        clearTimeout(timer);
        reject(error instanceof Error ? error : new Error(String(error)));
      },
    );
  });
}

export type Readiness = ReturnType<typeof makeReadiness>;

export function makeReadiness(sequelize: Sequelize, expectedMigrations: readonly string[] = migrationNames) {
  let draining = false;
  return {
    /** From now on the node answers 503: it is stopping and finishes only what it has. */
    startDraining() {
      draining = true;
    },
    isDraining: () => draining,
    async check(): Promise<ReadyAnswer> {
      if (draining) return { ready: false, reason: 'draining: this node is stopping' };
      let applied: { name: string }[];
      try {
        // A plain read of umzug's table (its own `executed()` would create the table if missing).
        applied = await within(sequelize.query<{ name: string }>('SELECT name FROM schema_migrations', { type: QueryTypes.SELECT }), PROBE_TIMEOUT_MS, 'the database');
      } catch (error) {
        const message = (error as Error).message;
        if (/schema_migrations.*doesn't exist/i.test(message)) return { ready: false, reason: 'migrations pending: the schema is empty (run the migrations)' };
        // The driver's message names hosts and ports: not for an unauthenticated probe's answer.
        return { ready: false, reason: 'database unreachable' };
      }
      const done = new Set(applied.map((row) => row.name));
      const pending = expectedMigrations.filter((name) => !done.has(name));
      if (pending.length) return { ready: false, reason: `migrations pending: ${pending.join(', ')}` };
      return { ready: true };
    },
  };
}
