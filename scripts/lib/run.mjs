// Small helpers for running project commands from the bootstrap scripts.
import { spawn } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';

const bin = (name) => path.resolve('node_modules/.bin', name);

/** Runs a local (node_modules/.bin) command; resolves with its exit code. */
export function runLocal(name, args, env = {}) {
  return new Promise((resolve) => {
    const child = spawn(bin(name), args, { stdio: 'inherit', env: { ...process.env, ...env } });
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
  });
}

export async function runLocalOrExit(name, args, env = {}) {
  const code = await runLocal(name, args, env);
  if (code !== 0) throw new Error(`${name} ${args.join(' ')} failed with exit code ${code}`);
}

function newestMtime(entry) {
  if (!existsSync(entry)) return 0;
  const stats = statSync(entry);
  if (!stats.isDirectory()) return stats.mtimeMs;
  let newest = stats.mtimeMs;
  for (const child of readdirSync(entry)) newest = Math.max(newest, newestMtime(path.join(entry, child)));
  return newest;
}

const staleAgainst = (output, inputs) => {
  const built = existsSync(output) ? statSync(output).mtimeMs : 0;
  return inputs.some((input) => newestMtime(input) > built);
};

/** The client bundle is rebuilt only when a client input is newer than dist/index.html. */
export function clientBuildIsStale() {
  return staleAgainst('dist/index.html', ['src', 'shared', 'fonts', 'index.html', 'vite.config.ts', 'package-lock.json']);
}

/** The compiled server (dist-server/) is rebuilt only when a server input is newer than it. */
export function serverBuildIsStale() {
  return staleAgainst('dist-server/index.js', ['server', 'shared', 'package-lock.json', 'scripts/build-server.mjs']);
}

/** Runs a script with this Node (no TypeScript runner); resolves with its exit code. */
export function runNode(args, env = {}) {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, ['--enable-source-maps', ...args], { stdio: 'inherit', env: { ...process.env, ...env } });
    child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
  });
}

export async function runNodeOrExit(args, env = {}) {
  const code = await runNode(args, env);
  if (code !== 0) throw new Error(`node ${args.join(' ')} failed with exit code ${code}`);
}

/** Starts a compiled server (or other script) with this Node, output shared with ours. */
export function spawnNode(args, env = {}) {
  return spawn(process.execPath, ['--enable-source-maps', ...args], { stdio: 'inherit', env: { ...process.env, ...env } });
}

export function spawnLocal(name, args, env = {}) {
  return spawn(bin(name), args, { stdio: 'inherit', env: { ...process.env, ...env } });
}
