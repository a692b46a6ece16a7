import { io, type Socket } from 'socket.io-client';

let socket: Socket | null = null;

/** One socket per signed-in browser tab; the handshake carries the session cookie. */
export function getSocket(): Socket {
  socket ??= io({ withCredentials: true, transports: ['websocket', 'polling'] });
  return socket;
}

export function closeSocket() {
  socket?.disconnect();
  socket = null;
}
