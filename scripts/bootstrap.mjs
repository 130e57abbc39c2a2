#!/usr/bin/env node
// Plain Node, no dependencies: this runs on a fresh clone before `npm ci` has happened.
// It makes sure node_modules matches the lock file and that the Debian packages the
// chosen task needs are present, then hands over to the TypeScript task runner.
import { spawn, spawnSync, execFileSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join, dirname } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const task = process.argv[2]; // 'start' | 'test' | 'bench' | 'cluster'
const rest = process.argv.slice(3);

/** Debian packages each task needs, keyed by a binary that proves the package is there. */
const needs = {
  start: { '/usr/sbin/mariadbd': 'mariadb-server' },
  // galera-4 and rsync come with mariadb-server; named here so a server installed without them is noticed.
  test: {
    '/usr/sbin/mariadbd': 'mariadb-server',
    '/usr/lib/galera/libgalera_smm.so': 'galera-4',
    '/usr/bin/rsync': 'rsync',
    '/usr/bin/chromium': 'chromium',
    '/usr/bin/pdftoppm': 'poppler-utils',
  },
  // The bench drives the editor in Debian's Chromium.
  bench: { '/usr/sbin/mariadbd': 'mariadb-server', '/usr/lib/galera/libgalera_smm.so': 'galera-4', '/usr/bin/rsync': 'rsync', '/usr/bin/chromium': 'chromium' },
  cluster: { '/usr/sbin/mariadbd': 'mariadb-server', '/usr/lib/galera/libgalera_smm.so': 'galera-4', '/usr/bin/rsync': 'rsync' },
};

function run(cmd, args, opts = {}) {
  const r = spawnSync(cmd, args, { stdio: 'inherit', cwd: root, ...opts });
  if (r.status !== 0) {
    console.error(`waymark: '${cmd} ${args.join(' ')}' failed (exit ${r.status ?? r.signal}).`);
    process.exit(r.status || 1);
  }
}

function ensureNodeModules() {
  const lock = readFileSync(join(root, 'package-lock.json'));
  const hash = createHash('sha256').update(lock).digest('hex');
  const stamp = join(root, 'node_modules', '.waymark-lock-hash');
  if (existsSync(stamp) && readFileSync(stamp, 'utf8') === hash) return;
  console.log('waymark: installing npm dependencies (npm ci)…');
  run('npm', ['ci', '--no-audit', '--no-fund']);
  writeFileSync(stamp, hash);
}

function hasMariadb() {
  if (existsSync('/usr/sbin/mariadbd')) return true;
  try {
    execFileSync('which', ['mariadbd'], { stdio: 'ignore' });
    return true;
  } catch {
    return false;
  }
}

function ensureDebianPackages() {
  // An external database needs no local server.
  const wanted = Object.entries(needs[task] ?? {})
    .filter(([, pkg]) => !(pkg === 'mariadb-server' && (process.env.DATABASE_URL || hasMariadb())))
    .filter(([bin]) => !existsSync(bin))
    .map(([, pkg]) => pkg);
  if (wanted.length === 0) return;
  if (process.getuid && process.getuid() !== 0) {
    console.error(`waymark: missing Debian packages: ${wanted.join(' ')}. Install them as root (apt-get install -y ${wanted.join(' ')}) and run again.`);
    process.exit(1);
  }
  console.log(`waymark: installing Debian packages: ${wanted.join(' ')}…`);
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  run('apt-get', ['update', '-qq'], { env });
  run('apt-get', ['install', '-y', '-qq', '--no-install-recommends', ...wanted], { env });
}

if (!needs[task]) {
  console.error('usage: bootstrap.mjs start|test|bench|cluster [args]');
  process.exit(2);
}
ensureNodeModules();
ensureDebianPackages();
const tsx = join(root, 'node_modules', '.bin', 'tsx');
// Run the task as a child and pass stop signals on, so Ctrl-C lets it shut its database down cleanly.
const child = spawn(tsx, [join(root, 'scripts', `${task}.ts`), ...rest], { stdio: 'inherit', cwd: root });
for (const sig of ['SIGINT', 'SIGTERM', 'SIGHUP']) process.on(sig, () => child.kill(sig));
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
