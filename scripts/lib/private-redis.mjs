// Starts a private Redis on 127.0.0.1 with its own port and folder, like private-mariadb.mjs does
// for MariaDB. Dependency-free: Debian's redis-server, installed by apt-get when missing (as root).
// Nothing in it needs to survive a restart (live-update fan-out, sign-in form counters), so it
// keeps no snapshot.
import { spawn } from 'node:child_process';
import { existsSync, mkdirSync, openSync, readFileSync, rmSync } from 'node:fs';
import net from 'node:net';
import path from 'node:path';
import { portIsFree } from './private-mariadb.mjs';
import { ensureProgram } from './system-packages.mjs';

export function ensureRedis() {
  return ensureProgram({ programs: ['redis-server', '/usr/bin/redis-server'], debPackages: ['redis-server'], purpose: 'Redis (several app nodes, and the tests of them)' });
}

/** Resolves true when Redis on `port` answers PING. */
export function redisAnswers(port) {
  return new Promise((resolve) => {
    const socket = net.createConnection(port, '127.0.0.1');
    const done = (ok) => {
      socket.destroy();
      resolve(ok);
    };
    socket.setTimeout(1_000, () => done(false));
    socket.once('error', () => done(false));
    socket.once('connect', () => socket.write('PING\r\n'));
    socket.once('data', (reply) => done(String(reply).startsWith('+PONG')));
  });
}

const isRedisOf = (pid, dir) => {
  try {
    return readFileSync(`/proc/${pid}/cmdline`, 'utf8').includes(dir);
  } catch {
    return false;
  }
};

/**
 * @param {{ dataDir: string, port: number, label: string }} opts
 * @returns {Promise<{ url: string, stop: () => Promise<void>, process: import('node:child_process').ChildProcess }>}
 */
export async function startPrivateRedis({ dataDir, port, label }) {
  const server = ensureRedis();
  const root = path.resolve(dataDir);
  const pidFile = path.join(root, 'redis.pid');
  mkdirSync(root, { recursive: true });
  // One left running on this folder by a start that was killed: stop it first.
  if (existsSync(pidFile)) {
    const pid = Number(readFileSync(pidFile, 'utf8').trim());
    if (pid && isRedisOf(pid, root)) {
      console.log(`[redis] stopping the ${label} Redis left running by an earlier start (pid ${pid})`);
      process.kill(pid, 'SIGTERM');
      for (let waited = 0; isRedisOf(pid, root) && waited < 10_000; waited += 100) await new Promise((r) => setTimeout(r, 100));
    }
    rmSync(pidFile, { force: true });
  }
  if (!(await portIsFree(port))) {
    throw new Error(`Port ${port} on 127.0.0.1 is already in use, so the ${label} Redis cannot start. Stop what uses it or choose another port.`);
  }
  const logFd = openSync(path.join(root, 'redis.log'), 'a');
  const child = spawn(
    server,
    ['--port', String(port), '--bind', '127.0.0.1', '--dir', root, '--pidfile', pidFile, '--save', '', '--appendonly', 'no', '--daemonize', 'no', '--protected-mode', 'yes'],
    { stdio: ['ignore', logFd, logFd] },
  );
  for (let waited = 0; !(await redisAnswers(port)); waited += 100) {
    if (child.exitCode !== null || waited > 20_000) {
      child.kill('SIGKILL');
      throw new Error(`the ${label} Redis did not start; see ${path.join(root, 'redis.log')}`);
    }
    await new Promise((r) => setTimeout(r, 100));
  }
  const gone = () => child.exitCode !== null || child.signalCode !== null;
  let stopping = null;
  const stop = () =>
    (stopping ??= new Promise((resolve) => {
      if (gone()) return resolve();
      const timer = setTimeout(() => child.kill('SIGKILL'), 5_000);
      child.once('exit', () => {
        clearTimeout(timer);
        resolve();
      });
      child.kill('SIGTERM');
    }));
  return { url: `redis://127.0.0.1:${port}`, stop, process: child };
}
