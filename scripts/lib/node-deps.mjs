// Runs `npm ci` when node_modules is missing or older than package-lock.json.
import { execFileSync } from 'node:child_process';
import { existsSync, statSync } from 'node:fs';

export function ensureNodeDependencies() {
  const marker = 'node_modules/.package-lock.json';
  const stale = !existsSync(marker) || statSync(marker).mtimeMs < statSync('package-lock.json').mtimeMs;
  if (!stale) return;
  console.log('[setup] installing npm dependencies (npm ci)…');
  execFileSync('npm', ['ci', '--no-audit', '--no-fund'], { stdio: 'inherit' });
}
