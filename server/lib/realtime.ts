// Sockets notify, queries fetch: the server sends a small { entity, id } event to a room after the
// transaction commits; clients invalidate the matching queries and fetch what changed.
import type { Server as HttpServer, IncomingMessage, ServerResponse } from 'node:http';
import type { RequestHandler } from 'express';
import passport from 'passport';
import { Server } from 'socket.io';

export type RealtimeEvent = { entity: string; id: number | string; unitId?: number };

export type RealtimeHub = {
  toUnit(unitId: number, event: RealtimeEvent): void;
  toEveryone(event: RealtimeEvent): void;
  toUser(userId: number, event: RealtimeEvent): void;
  attach(http: HttpServer, sessionMiddleware: RequestHandler): Server;
};

type Middleware = (req: IncomingMessage, res: ServerResponse, next: (error?: unknown) => void) => void;

/** Session middleware only on the handshake request, as socket.io's passport example does. */
const onHandshake = (middleware: Middleware): Middleware => (req, res, next) => {
  const query = (req as IncomingMessage & { _query?: { sid?: string } })._query;
  if (query?.sid === undefined) middleware(req, res, next);
  else next();
};

export function createRealtimeHub(): RealtimeHub {
  let io: Server | null = null;
  return {
    toUnit(unitId, event) {
      io?.to(`unit:${unitId}`).emit('changed', { ...event, unitId });
    },
    toEveryone(event) {
      io?.emit('changed', event);
    },
    toUser(userId, event) {
      io?.to(`user:${userId}`).emit('changed', event);
    },
    attach(http, sessionMiddleware) {
      io = new Server(http, { serveClient: false, cors: { origin: false } });
      io.engine.use(onHandshake(sessionMiddleware as unknown as Middleware));
      io.engine.use(onHandshake(passport.session() as unknown as Middleware));
      // Only signed-in people get a socket: the handshake carries the same session as HTTP.
      io.engine.use(
        onHandshake((req, res, next) => {
          if ((req as IncomingMessage & { user?: unknown }).user) next();
          else {
            res.writeHead(401);
            res.end();
          }
        }),
      );
      // Who is looking at a unit's board right now, sent to everyone in its room.
      const sendPresence = async (room: string) => {
        const sockets = await io!.in(room).fetchSockets();
        const people = [...new Set(sockets.map((s) => String(s.data.name)))].sort();
        io!.to(room).emit('presence', { unitId: Number(room.slice('unit:'.length)), people });
      };
      io.on('connection', (socket) => {
        const user = (socket.request as IncomingMessage & { user?: { id: number; name: string } }).user!;
        socket.data.name = user.name;
        socket.join(`user:${user.id}`);
        socket.on('watch-unit', (unitId: unknown) => {
          if (typeof unitId !== 'number' || !Number.isInteger(unitId)) return;
          const left = [...socket.rooms].filter((room) => room.startsWith('unit:'));
          for (const room of left) socket.leave(room);
          socket.join(`unit:${unitId}`);
          for (const room of [...left, `unit:${unitId}`]) void sendPresence(room);
        });
        socket.on('disconnecting', () => {
          const rooms = [...socket.rooms].filter((room) => room.startsWith('unit:'));
          setImmediate(() => rooms.forEach((room) => void sendPresence(room)));
        });
      });
      return io;
    },
  };
}
