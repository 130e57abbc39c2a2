/** Load figures with autocannon on loopback: requests/s, p50, p99, errors. */
import autocannon from 'autocannon';
import { spawn, type ChildProcess } from 'node:child_process';
import { join } from 'node:path';
import { readFileSync } from 'node:fs';

export interface LoadFigure {
  rps: number;
  p50Ms: number;
  p99Ms: number;
  errors: number;
}

export async function measure(url: string, seconds: number, connections: number): Promise<LoadFigure> {
  const result = await autocannon({ url, duration: seconds, connections, pipelining: 1 });
  return {
    rps: Math.round(result.requests.average),
    p50Ms: result.latency.p50,
    p99Ms: result.latency.p99,
    errors: result.errors + result.timeouts + result.non2xx,
  };
}

/** Starts a process that prints its port once listening (`PORT n` or `(port n)`); resolves with the port. */
/**
 * The environment every bench runs the production server with: the bench database, production mode with a
 * relay address that takes no mail (production refuses to start without one; the bench sends none), the built
 * client, and the per-address board-page limit out of the way (the bench is one client asking far more often
 * than any visitor: the limit is not what is measured). `extra` adds or overrides.
 */
export function productionServerEnv(databaseUrl: string, extra: Record<string, string> = {}): NodeJS.ProcessEnv {
  return {
    ...process.env,
    DATABASE_URL: databaseUrl,
    SESSION_SECRET: 'bench-secret',
    PORT: '0',
    NODE_ENV: 'production',
    SMTP_HOST: '127.0.0.1',
    SMTP_PORT: '1',
    RATE_PUBLIC_MINUTE: '100000000',
    WAYMARK_CLIENT_DIR: 'dist',
    ...extra,
  };
}

export function spawnServer(args: string[], env: NodeJS.ProcessEnv): Promise<{ child: ChildProcess; port: number }> {
  return new Promise((resolve, reject) => {
    // node --import tsx (not the tsx wrapper), so the pid is the server's own and its RSS is measured.
    const child = spawn(process.execPath, ['--import', 'tsx', ...args], { env, cwd: join(import.meta.dirname, '..'), stdio: ['ignore', 'pipe', 'inherit'] });
    let out = '';
    child.stdout!.on('data', (d: Buffer) => {
      out += d.toString();
      const m = out.match(/PORT (\d+)|\(port (\d+)\)/);
      if (m) resolve({ child, port: Number(m[1] ?? m[2]) });
    });
    child.on('exit', (code) => reject(new Error(`server exited (${code}) before listening: ${out}`)));
  });
}

export function rssMb(pid: number): number {
  try {
    const status = readFileSync(`/proc/${pid}/status`, 'utf8');
    const kb = Number(status.match(/VmRSS:\s+(\d+)/)?.[1] ?? 0);
    return Math.round(kb / 1024);
  } catch {
    return 0;
  }
}
