// Sockets notify, queries fetch: the server sends a small { entity, id } event to a room after the
// transaction commits (see live.ts); clients invalidate the matching queries and fetch what changed.
// With several app nodes the rooms span them through the Redis adapter: every emit and every
// disconnect here goes by room, so it reaches the person's sockets on whichever node holds them.
import type { Server as HttpServer, IncomingMessage, ServerResponse } from 'node:http';
import type { RequestHandler } from 'express';
import passport from 'passport';
import { Server, type ServerOptions, type Socket } from 'socket.io';
import { logger } from './logger';
import type { BoardPresence, LiveEvent } from '../../shared/live-events';

/** Whose live connections: a person's (optionally all but one session's), or one session's. */
export type SocketsOf = { userId?: number; exceptSessionId?: string; sessionId?: string };

export type RealtimeHub = {
  /** To the unit's watchers, one person, or everyone signed in — whichever the event names. */
  send(event: LiveEvent): void;
  /** Ends the live connections of a person, or of one session, on every node. */
  disconnect(who: SocketsOf): void;
  /** `adapter`: the Redis adapter when several nodes share the rooms. */
  attach(http: HttpServer, sessionMiddleware: RequestHandler, options?: { adapter?: ServerOptions['adapter'] }): Server;
};

type Middleware = (req: IncomingMessage, res: ServerResponse, next: (error?: unknown) => void) => void;

/** Session middleware only on the handshake request, as socket.io's passport example does. */
const onHandshake = (middleware: Middleware): Middleware => (req, res, next) => {
  const query = (req as IncomingMessage & { _query?: { sid?: string } })._query;
  if (query?.sid === undefined) middleware(req, res, next);
  else next();
};

const unitRoom = (unitId: number) => `unit:${unitId}`;
const userRoom = (userId: number) => `user:${userId}`;
const sessionRoom = (sessionId: string) => `session:${sessionId}`;
const boardRoom = (unitId: number) => `board:${unitId}`;
const isUnitId = (value: unknown): value is number => typeof value === 'number' && Number.isInteger(value) && value > 0;

export function createRealtimeHub(): RealtimeHub {
  let io: Server | null = null;

  /** Who has a unit's handover board open right now, sent to everyone on that board. */
  async function sendPresence(unitId: number) {
    if (!io) return;
    const sockets = await io.in(boardRoom(unitId)).fetchSockets();
    const people = [...new Set(sockets.map((s) => String(s.data.name)))].sort();
    const presence: BoardPresence = { unitId, people };
    io.to(boardRoom(unitId)).emit('presence', presence);
  }

  function wire(socket: Socket) {
    const user = (socket.request as IncomingMessage & { user?: { id: number; name: string } }).user!;
    socket.data.name = user.name;
    socket.data.userId = user.id;
    socket.data.sessionId = (socket.request as IncomingMessage & { sessionID?: string }).sessionID;
    void socket.join(userRoom(user.id));
    if (socket.data.sessionId) void socket.join(sessionRoom(socket.data.sessionId));
    // A tab may show several units at once (the overview); each page leaves what it joined.
    socket.on('watch-unit', (unitId: unknown) => {
      if (isUnitId(unitId)) void socket.join(unitRoom(unitId));
    });
    socket.on('unwatch-unit', (unitId: unknown) => {
      if (isUnitId(unitId)) void socket.leave(unitRoom(unitId));
    });
    // Presence counts the handover board only: a person reading the log is not "on the board".
    socket.on('open-board', (unitId: unknown) => {
      if (!isUnitId(unitId)) return;
      void socket.join(boardRoom(unitId));
      void sendPresence(unitId);
    });
    socket.on('close-board', (unitId: unknown) => {
      if (!isUnitId(unitId)) return;
      void socket.leave(boardRoom(unitId));
      void sendPresence(unitId);
    });
    socket.on('disconnecting', () => {
      const boards = [...socket.rooms].filter((room) => room.startsWith('board:')).map((room) => Number(room.slice('board:'.length)));
      setImmediate(() => boards.forEach((unitId) => void sendPresence(unitId)));
    });
  }

  return {
    send(event) {
      if (!io) return;
      if (event.unitId !== undefined) io.to(unitRoom(event.unitId)).emit('changed', event);
      else if (event.userId !== undefined) io.to(userRoom(event.userId)).emit('changed', event);
      else io.emit('changed', event);
    },
    disconnect(who) {
      if (!io) return;
      const server = io;
      if (who.sessionId !== undefined) server.in(sessionRoom(who.sessionId)).disconnectSockets(true);
      if (who.userId === undefined) return;
      if (who.exceptSessionId === undefined) {
        server.in(userRoom(who.userId)).disconnectSockets(true);
        return;
      }
      // All but one session's: the sockets are looked up on every node, then ended one by one.
      server
        .in(userRoom(who.userId))
        .fetchSockets()
        .then((sockets) => {
          for (const socket of sockets) if (socket.data.sessionId !== who.exceptSessionId) socket.disconnect(true);
        })
        .catch((error: unknown) => logger.error({ err: error, userId: who.userId }, 'could not end the sockets of a person'));
    },
    attach(http, sessionMiddleware, options = {}) {
      io = new Server(http, { serveClient: false, cors: { origin: false }, ...(options.adapter && { adapter: options.adapter }) });
      io.engine.use(onHandshake(sessionMiddleware as unknown as Middleware));
      io.engine.use(onHandshake(passport.session() as unknown as Middleware));
      // Only signed-in people get a socket: the handshake carries the same session as HTTP. A person
      // who must still replace a temporary password reaches nothing else, sockets included.
      io.engine.use(
        onHandshake((req, res, next) => {
          const user = (req as IncomingMessage & { user?: { mustChangePassword?: boolean } }).user;
          if (user && !user.mustChangePassword) next();
          else {
            res.writeHead(401);
            res.end();
          }
        }),
      );
      io.on('connection', wire);
      return io;
    },
  };
}
