/**
 * The board page under load: the JSON route and the HTML route of the demo board, each against
 * a bare Express endpoint that returns a constant body of the same size, in the same run.
 */
import type { ChildProcess } from 'node:child_process';
import { isNull } from 'drizzle-orm';
import type { Database } from '../server/db/client.js';
import { boards } from '../server/db/schema.js';
import { measure, productionServerEnv, rssMb, spawnServer } from './load.js';

export interface LoadRow {
  route: string;
  rps: number;
  p50Ms: number;
  p99Ms: number;
  errors: number;
  bareRps: number;
  ratio: number;
}

async function bodySize(url: string): Promise<{ size: number; type: string }> {
  const res = await fetch(url);
  if (!res.ok) throw new Error(`${url} answered ${res.status}`);
  return { size: (await res.arrayBuffer()).byteLength, type: res.headers.get('content-type') ?? 'text/plain' };
}

export async function benchLoad(
  database: Database,
  databaseUrl: string,
  opts: { seconds: number; connections: number },
): Promise<{ load: LoadRow[]; rssMb: number }> {
  const [board] = await database.db.select({ token: boards.publicToken }).from(boards).where(isNull(boards.deletedAt)).limit(1);
  if (!board) throw new Error('no demo board to load');
  const env = productionServerEnv(databaseUrl);
  const children: ChildProcess[] = [];
  try {
    const app = await spawnServer(['server/index.ts'], env);
    children.push(app.child);
    const base = `http://127.0.0.1:${app.port}`;
    const routes = [
      { route: 'GET /api/public/boards/:token', url: `${base}/api/public/boards/${board.token}` },
      { route: 'GET /b/:token (HTML)', url: `${base}/b/${board.token}` },
    ];
    const rows: LoadRow[] = [];
    for (const r of routes) {
      const { size, type } = await bodySize(r.url);
      const bare = await spawnServer(['bench/bare-server.ts', String(size), type], env);
      children.push(bare.child);
      const bareFigure = await measure(`http://127.0.0.1:${bare.port}/bare`, opts.seconds, opts.connections);
      const figure = await measure(r.url, opts.seconds, opts.connections);
      rows.push({ route: r.route, ...figure, bareRps: bareFigure.rps, ratio: Math.round((figure.rps / bareFigure.rps) * 100) / 100 });
    }
    return { load: rows, rssMb: rssMb(app.child.pid!) };
  } finally {
    for (const c of children) c.kill('SIGTERM');
  }
}
