/**
 * A private MariaDB server for development, tests and benchmarks: its own data dir,
 * its own port on 127.0.0.1, started in its own process group and stopped by its pid.
 * Debian's packaged service is not used (it does not start without systemd).
 */
import { spawn, execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { join } from 'node:path';
import mysql from 'mysql2/promise';

export interface PrivateMariadb {
  url: string;
  port: number;
  socket: string;
  dataDir: string;
  stop(): Promise<void>;
  /** Starts the server again on the same data dir and port (used by the outage tests). */
  start(): Promise<void>;
  /** The running server's process id; 0 while it is down. */
  pid(): number;
}

export async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = createServer();
    srv.unref();
    srv.on('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const addr = srv.address();
      const port = typeof addr === 'object' && addr ? addr.port : 0;
      srv.close(() => resolve(port));
    });
  });
}

function binary(name: string): string {
  for (const dir of ['/usr/sbin', '/usr/bin', '/usr/local/bin', '/usr/local/sbin']) {
    if (existsSync(join(dir, name))) return join(dir, name);
  }
  return name;
}

/** Ready when a query answers; a cluster node also asks that it has joined (see scripts/galera.ts). */
export type Readiness = (conn: mysql.Connection) => Promise<boolean>;

async function waitForQuery(port: number, timeoutMs: number, ready?: Readiness): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  let lastError: unknown;
  while (Date.now() < deadline) {
    try {
      // `mariadb-admin ping` counts "access denied" as alive, so prove it with a real query.
      const conn = await mysql.createConnection({ host: '127.0.0.1', port, user: 'root', password: '' });
      try {
        await conn.query('SELECT 1');
        if (!ready || (await ready(conn))) return;
        lastError = new Error('not ready yet');
      } finally {
        await conn.end();
      }
      await new Promise((r) => setTimeout(r, 200));
    } catch (err) {
      lastError = err;
      await new Promise((r) => setTimeout(r, 100));
    }
  }
  throw new Error(`MariaDB did not answer on port ${port}: ${String(lastError)}`);
}

/**
 * Starts (initialising if needed) a MariaDB on `dataDir`. The database `dbName`
 * and a user `waymark` with a random password are created on first start.
 */
/**
 * With `supervise`, a server that exits without being asked to (a crash, a kill) is started again with
 * a back-off (0.5 s, 1 s, 2 s … at most 30 s; back to 0.5 s after a minute up), and each restart is logged.
 * The app's pool makes new connections, so it serves again without a restart of its own.
 */
export async function startPrivateMariadb(opts: {
  dataDir: string;
  port?: number;
  dbName?: string;
  durable?: boolean;
  supervise?: boolean;
  /**
   * The system user the server runs as. `mysql` (the Debian package's user) when a Galera state transfer must write
   * into the data dir: rsync runs as the server's user, and a root-owned dir refuses it. The dir is then chowned.
   */
  user?: 'root' | 'mysql';
  /** More server options (Galera's), told whether this is the first start of this process or a restart. */
  extraArgs?: (firstStart: boolean) => string[];
  ready?: Readiness;
  /** How long a start may take before it is given up (a joining cluster node copies the data first). */
  startTimeoutMs?: number;
}): Promise<PrivateMariadb> {
  const user = opts.user ?? 'root';
  const dataDir = opts.dataDir;
  const dbName = opts.dbName ?? 'waymark';
  const port = opts.port ?? (await freePort());
  const socket = join(dataDir, 'mysqld.sock');
  const pidFile = join(dataDir, 'mysqld.pid');
  const logFile = join(dataDir, 'mysqld.log');
  const db = join(dataDir, 'db');
  mkdirSync(dataDir, { recursive: true });

  if (!existsSync(join(db, 'mysql'))) {
    mkdirSync(db, { recursive: true });
    if (user === 'mysql') execFileSync('chown', ['-R', 'mysql:mysql', dataDir]);
    execFileSync(
      binary('mariadb-install-db'),
      ['--no-defaults', `--datadir=${db}`, `--user=${user}`, '--auth-root-authentication-method=normal', '--skip-test-db'],
      { stdio: 'ignore' },
    );
  }
  if (user === 'mysql') execFileSync('chown', ['-R', 'mysql:mysql', dataDir]);
  let firstStart = true;

  let pid = 0;
  let wanted = true;
  let restarts = 0;
  let upSince = 0;
  const restartLater = (why: string) => {
    if (Date.now() - upSince > 60_000) restarts = 0;
    const delay = Math.min(30_000, 500 * 2 ** restarts++);
    console.error(`waymark: MariaDB exited (${why}); restarting in ${delay / 1000} s`);
    setTimeout(() => {
      if (wanted && !pid) start().catch((err) => console.error(`waymark: MariaDB did not come back: ${err instanceof Error ? err.message : err}`));
    }, delay).unref();
  };
  const start = async (): Promise<void> => {
    // A server left over from a killed run would hold the data dir: stop it first.
    if (existsSync(pidFile)) {
      const old = Number(readFileSync(pidFile, 'utf8').trim());
      try {
        process.kill(old, 'SIGTERM');
        await new Promise((r) => setTimeout(r, 1500));
      } catch {
        /* gone */
      }
    }
    const child = spawn(
      binary('mariadbd'),
      [
        '--no-defaults',
        `--datadir=${db}`,
        `--socket=${socket}`,
        `--pid-file=${pidFile}`,
        `--port=${port}`,
        '--bind-address=127.0.0.1',
        `--user=${user}`,
        '--character-set-server=utf8mb4',
        '--collation-server=utf8mb4_unicode_ci',
        `--log-error=${logFile}`,
        '--skip-log-bin',
        '--innodb-buffer-pool-size=64M',
        // Full durability (flush the log at every commit) unless told otherwise: a power cut must not lose a save the
        // app has acknowledged. Only the throw-away test and benchmark databases trade that for speed.
        `--innodb-flush-log-at-trx-commit=${opts.durable === false ? 2 : 1}`,
        '--max-connections=500',
        ...(opts.extraArgs?.(firstStart) ?? []),
      ],
      { detached: true, stdio: 'ignore' },
    );
    child.unref();
    pid = child.pid ?? 0;
    child.on('exit', (code, signal) => {
      if (pid !== child.pid) return;
      pid = 0;
      if (opts.supervise && wanted) restartLater(signal ?? `exit code ${code}`);
    });
    firstStart = false;
    await waitForQuery(port, opts.startTimeoutMs ?? 30_000, opts.ready);
    upSince = Date.now();
  };
  await start();

  const root = await mysql.createConnection({ host: '127.0.0.1', port, user: 'root', password: '' });
  await root.query(`CREATE DATABASE IF NOT EXISTS \`${dbName}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci`);
  await root.end();

  const stop = async () => {
    wanted = false;
    if (!pid) return;
    const p = pid;
    pid = 0;
    try {
      process.kill(p, 'SIGTERM');
    } catch {
      return;
    }
    const deadline = Date.now() + 15_000;
    while (Date.now() < deadline) {
      try {
        process.kill(p, 0);
      } catch {
        return;
      }
      await new Promise((r) => setTimeout(r, 100));
    }
    try {
      process.kill(p, 'SIGKILL');
    } catch {
      /* already gone */
    }
  };

  const startAgain = () => {
    wanted = true;
    return start();
  };
  return { url: `mysql://root@127.0.0.1:${port}/${dbName}`, port, socket, dataDir, stop, start: startAgain, pid: () => pid };
}

export function removeDir(dir: string): void {
  rmSync(dir, { recursive: true, force: true });
}
