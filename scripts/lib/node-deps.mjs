// Runs `npm ci` when node_modules is missing or older than package-lock.json.
import { execFileSync } from 'node:child_process';
import { existsSync, lstatSync, statSync } from 'node:fs';

export function ensureNodeDependencies() {
  // A linked node_modules (a second working copy sharing one install) is managed where it lives:
  // running npm ci here would empty the other copy's install through the link.
  if (existsSync('node_modules') && lstatSync('node_modules').isSymbolicLink()) return;
  const marker = 'node_modules/.package-lock.json';
  const stale = !existsSync(marker) || statSync(marker).mtimeMs < statSync('package-lock.json').mtimeMs;
  if (!stale) return;
  console.log('[setup] installing npm dependencies (npm ci)…');
  execFileSync('npm', ['ci', '--no-audit', '--no-fund'], { stdio: 'inherit' });
}
