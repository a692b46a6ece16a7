// The session store: connect-session-sequelize for writes and clean-up, with two changes on the
// path every request takes (and every acknowledgement each open board waits on):
// - reads are one raw SELECT instead of a model load, refuse rows already past `expires` (the
//   package returns them until its 15-minute clean-up runs), and bring the signed-in person's row
//   along, which passport then takes instead of asking the database again (`takeSessionPerson`);
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

export type SessionPerson = { id: number; name: string; email: string; role: string; crewId: number | null; mustChangePassword: boolean; active: boolean };
// The person read with each session, for the same request's passport step (keyed by session id).
const sessionPeople = new Map<string, SessionPerson>();

/** The person row read with this session in this request, once; undefined when there is none. */
export function takeSessionPerson(sid: string | undefined): SessionPerson | undefined {
  if (!sid) return undefined;
  const person = sessionPeople.get(sid);
  sessionPeople.delete(sid);
  return person;
}

export function createSessionStore(sequelize: Sequelize) {
  const storedExpiry = new Map<string, number>();

  class LeanSessionStore extends SequelizeStore {
    override get(sid: string, callback: (error: unknown, session?: session.SessionData | null) => void) {
      type Row = { data: string | null; expires: Date | null; personId: number | null; name: string; email: string; role: string; crewId: number | null; mustChangePassword: number; active: number };
      sequelize
        .query<Row>(
          `SELECT s.data, s.expires, u.id AS personId, u.name, u.email, u.role, u.crew_id AS crewId, u.must_change_password AS mustChangePassword, u.active
           FROM sessions s LEFT JOIN users u ON u.id = s.user_id
           WHERE s.sid = ? AND (s.expires IS NULL OR s.expires > ?)`,
          { replacements: [sid, new Date()], type: QueryTypes.SELECT },
        )
        .then(([row]) => {
          if (storedExpiry.size >= MAX_REMEMBERED) storedExpiry.clear();
          if (sessionPeople.size >= MAX_REMEMBERED) sessionPeople.clear();
          if (row?.expires) storedExpiry.set(sid, new Date(row.expires).getTime());
          if (row?.personId) {
            const { personId, name, email, role, crewId, mustChangePassword, active } = row;
            sessionPeople.set(sid, { id: personId, name, email, role, crewId, mustChangePassword: Boolean(mustChangePassword), active: Boolean(active) });
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
      sessionPeople.delete(sid);
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
