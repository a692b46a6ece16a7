// Makes sure a Debian package that provides a program is installed.
// Dependency-free on purpose: it runs before `npm ci`.
import { execFileSync, spawnSync } from 'node:child_process';
import { existsSync } from 'node:fs';

export function findProgram(candidates) {
  for (const name of candidates) {
    if (name.startsWith('/')) {
      if (existsSync(name)) return name;
      continue;
    }
    const found = spawnSync('sh', ['-c', `command -v ${name}`], { encoding: 'utf8' });
    if (found.status === 0 && found.stdout.trim()) return found.stdout.trim();
    for (const dir of ['/usr/sbin', '/usr/bin', '/sbin']) {
      if (existsSync(`${dir}/${name}`)) return `${dir}/${name}`;
    }
  }
  return null;
}

/**
 * Returns the path of the first program found; installs `debPackages` with apt-get
 * when none is found and we are root; otherwise prints the exact command and exits 1.
 */
export function ensureProgram({ programs, debPackages, purpose }) {
  const existing = findProgram(programs);
  if (existing) return existing;
  const command = `apt-get update && apt-get install -y --no-install-recommends ${debPackages.join(' ')}`;
  if (process.getuid?.() !== 0) {
    console.error(`\n${purpose} needs ${programs[0]}, which is not installed.`);
    console.error(`Install it as root, then run this command again:\n\n  sudo sh -c '${command}'\n`);
    process.exit(1);
  }
  console.log(`[setup] installing ${debPackages.join(', ')} with apt-get (${purpose})…`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  execFileSync('apt-get', ['update'], { stdio: 'inherit', env });
  execFileSync('apt-get', ['install', '-y', '--no-install-recommends', ...debPackages], { stdio: 'inherit', env });
  const installed = findProgram(programs);
  if (!installed) {
    console.error(`[setup] ${debPackages.join(', ')} installed, but ${programs[0]} is still not found.`);
    process.exit(1);
  }
  return installed;
}

export function ensureMariaDb() {
  const server = ensureProgram({
    programs: ['mariadbd', '/usr/sbin/mariadbd'],
    debPackages: ['mariadb-server', 'mariadb-client'],
    purpose: 'The private database server',
  });
  return {
    server,
    installDb: findProgram(['mariadb-install-db', 'mysql_install_db']),
    client: findProgram(['mariadb', 'mysql']),
    admin: findProgram(['mariadb-admin', 'mysqladmin']),
  };
}

export function ensureChromium() {
  return ensureProgram({
    programs: ['/usr/bin/chromium'],
    debPackages: ['chromium'],
    purpose: 'The end-to-end tests',
  });
}

export function ensureHaproxy() {
  return ensureProgram({
    programs: ['haproxy', '/usr/sbin/haproxy'],
    debPackages: ['haproxy'],
    purpose: 'The load balancer in front of the app nodes (npm run start:cluster)',
  });
}
