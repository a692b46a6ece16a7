// Reference data — units, stations and their settings, crews, one-off crew swaps, and the versions of
// each unit's design data, limits and plausible ranges — changes a few times a year and is read by
// nearly every request (a log entry needs its station's positions, a round the limits in force, every
// board the crew on shift). Reading it from the database each time was most of the statements a
// request made under load. It is kept here, and forgotten whenever any of it changes:
// - a write to one of those tables through its model marks its transaction and empties the cache when
//   that transaction commits (a rolled-back write changes nothing); a write outside a transaction
//   empties it at once;
// - other app nodes hear of the change through Redis when several nodes run (see `lib/redis.ts`), and
//   nothing is kept longer than a minute, so a node cut off from Redis at that moment catches up;
// - a value read while a change was committing is not kept (the generation it was read in is gone);
// - inside a transaction the cache is never used after the transaction itself wrote reference data;
//   a miss is read through the transaction (its connection, its snapshot), and kept only when no
//   change has happened since the transaction began (`unitOfWork` notes when), as otherwise its
//   snapshot may be older than the last change.
import type { Model, ModelStatic, Transaction } from 'sequelize';
import { openTransaction } from '../db/sequelize';

let generation = 0;
// `answered`: the read behind `value` has finished (see referenceRead: a transaction waits only for those).
const entries = new Map<string, { generation: number; readAt: number; value: Promise<unknown>; answered: boolean }>();
const MAX_AGE_MS = 60_000;
const fresh = (hit: { generation: number; readAt: number } | undefined): hit is { generation: number; readAt: number; value: Promise<unknown>; answered: boolean } =>
  hit !== undefined && hit.generation === generation && Date.now() - hit.readAt < MAX_AGE_MS;
// Keys built from times (crew swaps asked for by shift) keep coming; a bound keeps memory flat.
const MAX_ENTRIES = 2_000;
const wroteReference = new WeakSet<Transaction>();
const begunIn = new WeakMap<Transaction, number>();
const changeListeners = new Set<() => void>();

export async function referenceRead<T>(key: string, load: () => Promise<T>, transaction?: Transaction | null): Promise<T> {
  const tx = transaction ?? openTransaction();
  const hit = entries.get(key);
  if (tx && wroteReference.has(tx)) return load();
  // A transaction never waits for a read still running outside it: under load that read can be
  // queued for a pooled connection while every connection is held by transactions waiting for it,
  // and all of them stood still until the pool's 60 s acquire timeout (seen in bench:load). It reads
  // through its own connection instead.
  if (fresh(hit) && (!tx || hit.answered)) return hit.value as Promise<T>;
  if (tx) {
    if (begunIn.get(tx) !== generation) return load();
    // Kept once read, not shared while reading: a failure of the transaction is its own.
    const readIn = generation;
    const result = await load();
    if (generation === readIn && !fresh(entries.get(key))) entries.set(key, { generation: readIn, readAt: Date.now(), value: Promise.resolve(result), answered: true });
    return result;
  }
  const value = load();
  if (entries.size >= MAX_ENTRIES) entries.clear();
  // Stamped with the generation the read began in: a change while it runs makes it stale at once.
  const entry = { generation, readAt: Date.now(), value: value as Promise<unknown>, answered: false };
  entries.set(key, entry);
  try {
    const result = await value;
    entry.answered = true;
    return result;
  } catch (error) {
    // A failed read (the database away) is not remembered.
    if (entries.get(key)?.value === value) entries.delete(key);
    throw error;
  }
}

/** Called as a unit of work's transaction begins, before its first read (see above). */
export function noteTransactionBegun(transaction: Transaction): void {
  begunIn.set(transaction, generation);
}

/** Forgets everything (reference data changed here or on another node). */
export function forgetReferenceData(): void {
  generation += 1;
  entries.clear();
}

/** Called after a change committed on this node: a multi-node setup passes it on. */
export function onReferenceChange(listener: () => void): () => void {
  changeListeners.add(listener);
  return () => changeListeners.delete(listener);
}

function changed(transaction: Transaction | null | undefined) {
  const committed = () => {
    forgetReferenceData();
    for (const listener of changeListeners) listener();
  };
  const tx = transaction ?? openTransaction();
  if (!tx) return committed();
  wroteReference.add(tx);
  // The cache is emptied at the write too, so a reader in another request cannot keep the old value
  // past the commit; and again after the commit, for a value read between the two.
  forgetReferenceData();
  tx.afterCommit(committed);
}

const writeHooks = ['afterCreate', 'afterUpdate', 'afterDestroy', 'afterUpsert', 'afterBulkCreate', 'afterBulkUpdate', 'afterBulkDestroy'] as const;

/** Every write to these models through Sequelize empties the cache (see above). */
export function watchReferenceModels(models: ModelStatic<Model>[]): void {
  for (const model of models) {
    for (const hook of writeHooks) {
      // Instance hooks get (instance, options); bulk hooks get (options).
      model.addHook(hook, `reference-cache-${hook}`, (...args: unknown[]) => {
        const options = (args.length > 1 ? args[1] : args[0]) as { transaction?: Transaction | null } | undefined;
        changed(options?.transaction);
      });
    }
  }
}
