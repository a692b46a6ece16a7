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

/** The client bundle is rebuilt only when a client input is newer than dist/index.html. */
export function clientBuildIsStale() {
  const built = existsSync('dist/index.html') ? statSync('dist/index.html').mtimeMs : 0;
  const inputs = ['src', 'shared', 'fonts', 'index.html', 'vite.config.ts', 'package-lock.json'];
  return inputs.some((input) => newestMtime(input) > built);
}

export function spawnLocal(name, args, env = {}) {
  return spawn(bin(name), args, { stdio: 'inherit', env: { ...process.env, ...env } });
}
