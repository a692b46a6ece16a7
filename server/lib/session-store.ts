// The session store: connect-session-sequelize for writes and clean-up, with two changes on the
// path every request takes (and every acknowledgement each open board waits on):
// - reads are one raw SELECT instead of a model load, and refuse rows already past `expires`
//   (the package returns them until its 15-minute clean-up runs);
// - the rolling expiry is written at most once a minute per session instead of on every request,
//   so a page of GETs does not turn into a page of durable writes. A session can thus end up to a
//   minute before its full 13 hours of idleness; nothing else changes.
import session from 'express-session';
import ConnectSessionSequelize from 'connect-session-sequelize';
import { QueryTypes, type Sequelize } from 'sequelize';

const SequelizeStore = ConnectSessionSequelize(session.Store);
const TOUCH_EVERY_MS = 60_000;
// Only between a request's read and its touch; bounded in case requests die in between.
const MAX_REMEMBERED = 10_000;

type Callback = (error?: unknown) => void;

export function createSessionStore(sequelize: Sequelize) {
  const storedExpiry = new Map<string, number>();

  class LeanSessionStore extends SequelizeStore {
    override get(sid: string, callback: (error: unknown, session?: session.SessionData | null) => void) {
      sequelize
        .query<{ data: string | null; expires: Date | null }>('SELECT data, expires FROM sessions WHERE sid = ? AND (expires IS NULL OR expires > ?)', {
          replacements: [sid, new Date()],
          type: QueryTypes.SELECT,
        })
        .then(([row]) => {
          if (row?.expires) {
            if (storedExpiry.size >= MAX_REMEMBERED) storedExpiry.clear();
            storedExpiry.set(sid, new Date(row.expires).getTime());
          }
          callback(null, row?.data ? (JSON.parse(row.data) as session.SessionData) : null);
        })
        .catch((error: unknown) => callback(error));
    }

    // The package types `touch` as a property, so it is replaced as one (same UPDATE it would run).
    override touch = (sid: string, data: session.SessionData, callback?: Callback) => {
      const stored = storedExpiry.get(sid);
      storedExpiry.delete(sid);
      const next = data.cookie.expires ? new Date(data.cookie.expires) : null;
      if (!next || (stored !== undefined && next.getTime() - stored < TOUCH_EVERY_MS)) {
        callback?.();
        return;
      }
      sequelize
        .query('UPDATE sessions SET expires = ?, updated_at = ? WHERE sid = ?', { replacements: [next, new Date(), sid] })
        .then(() => callback?.())
        .catch((error: unknown) => callback?.(error));
    };

    override set(sid: string, data: session.SessionData, callback?: Callback) {
      storedExpiry.delete(sid);
      super.set(sid, data, callback);
    }

    override destroy(sid: string, callback?: Callback) {
      storedExpiry.delete(sid);
      super.destroy(sid, callback);
    }
  }

  return new LeanSessionStore({
    db: sequelize,
    table: 'Session',
    extendDefaultFields: (defaults: { data: string; expires: Date }, sess: { passport?: { user?: number } }) => ({
      data: defaults.data,
      expires: defaults.expires,
      userId: sess.passport?.user ?? null,
    }),
  });
}
