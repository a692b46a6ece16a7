// The one publish point: a service that changes a record calls `publish(transaction, event)` beside
// its audit write, and the event leaves only when that transaction commits. A rolled-back write, or
// one retried after a deadlock, tells nobody anything.
import type { Sequelize, Transaction } from 'sequelize';
import type { LiveEvent } from '../../shared/live-events';
import type { RealtimeHub, SocketsOf } from './realtime';

// Keyed by the database connection, so services need nothing but their transaction to publish;
// a process that builds several apps on one connection (tests) reaches every hub.
const hubs = new WeakMap<Sequelize, Set<RealtimeHub>>();

export function connectLiveUpdates(sequelize: Sequelize, hub: RealtimeHub): () => void {
  const set = hubs.get(sequelize) ?? new Set<RealtimeHub>();
  set.add(hub);
  hubs.set(sequelize, set);
  return () => set.delete(hub);
}

/** Test hook: every event published on this connection, as it is sent. */
const listeners = new WeakMap<Sequelize, Set<(event: LiveEvent) => void>>();
export function onPublished(sequelize: Sequelize, listener: (event: LiveEvent) => void): () => void {
  const set = listeners.get(sequelize) ?? new Set();
  set.add(listener);
  listeners.set(sequelize, set);
  return () => set.delete(listener);
}

function send(sequelize: Sequelize, event: LiveEvent) {
  // Listeners first: a benchmark timing from the publish point starts its clock before the emit.
  for (const listener of listeners.get(sequelize) ?? []) listener(event);
  for (const hub of hubs.get(sequelize) ?? []) hub.send(event);
}

export function publish(transaction: Transaction, event: LiveEvent): void {
  // Sequelize sets `sequelize` on every transaction; its typings leave it out.
  const sequelize = (transaction as Transaction & { sequelize: Sequelize }).sequelize;
  transaction.afterCommit(() => send(sequelize, event));
}

/**
 * For a write that was one statement outside a transaction (it committed when it returned): the
 * acknowledgement, which every open board waits on, is kept to a single round trip.
 */
export function publishCommitted(sequelize: Sequelize, event: LiveEvent): void {
  send(sequelize, event);
}

/**
 * After the commit, closes the live connections of a person (deactivated; or all but one session's,
 * after a password change) or of one session (signed out).
 */
export function endSocketsOf(transaction: Transaction, who: SocketsOf): void {
  const sequelize = (transaction as Transaction & { sequelize: Sequelize }).sequelize;
  transaction.afterCommit(() => {
    for (const hub of hubs.get(sequelize) ?? []) hub.disconnect(who);
  });
}

/** The same, for a change that is not a database write (signing out destroys a session row on its own). */
export function endSocketsNow(sequelize: Sequelize, who: SocketsOf): void {
  for (const hub of hubs.get(sequelize) ?? []) hub.disconnect(who);
}
