/**
 * Whether the app keeps answering while the largest print it allows renders: `/api/health` and a
 * board page's JSON polled one request after another, first with nothing else running (the baseline, same run), then while
 * the chart of a 1999-way board (the schema's largest: 2000 devices with the main switch) is printed
 * again and again. Prints render on the render threads, so the health p99 should stay near the baseline.
 */
import type { ChildProcess } from 'node:child_process';
import { DEMO_PASSWORD, DEMO_USERS } from '../server/seed/index.js';
import { makeSchedule } from '../tests/helpers/boards.js';
import { productionServerEnv, spawnServer } from './load.js';

export interface EventLoopFigures {
  /** Health p99 with nothing else running. */
  healthP99MsIdle: number;
  /** Health p99 while the big print renders back to back. */
  healthP99MsDuringBigPrint: number;
  /** A demo board page's JSON, alone and during the big print. */
  boardPageP99MsIdle: number;
  boardPageP99MsDuringBigPrint: number;
  healthSamples: number;
  bigPrint: string;
  /** Median time of one big print, end to end. */
  bigPrintMs: number;
  prints: number;
}

const CIRCUITS = 1999;
const p99 = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.floor(xs.length * 0.99))] ?? 0;
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)] ?? 0;
const round = (ms: number) => Math.round(ms * 10) / 10;

/** A signed-in member over fetch: the session and CSRF cookies kept by hand, the token sent on writes. */
async function signIn(base: string) {
  const cookies = new Map<string, string>();
  const keep = (res: Response) => {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const at = pair.indexOf('=');
      cookies.set(pair.slice(0, at), pair.slice(at + 1));
    }
    return res;
  };
  const cookie = () => [...cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  const { token } = (await keep(await fetch(`${base}/api/auth/csrf`)).json()) as { token: string };
  const send = async (method: string, path: string, body?: unknown) =>
    keep(
      await fetch(`${base}${path}`, {
        method,
        headers: { cookie: cookie(), 'x-csrf-token': token, 'content-type': 'application/json' },
        body: body === undefined ? undefined : JSON.stringify(body),
      }),
    );
  const owner = DEMO_USERS.find((u) => u.role === 'owner') ?? DEMO_USERS[0];
  const login = await send('POST', '/api/auth/login', { email: owner.email, password: DEMO_PASSWORD });
  if (!login.ok) throw new Error(`demo sign-in: ${login.status}`);
  return send;
}

/** Polls `url` one request after another until `until()` says stop; each answer's latency in ms. */
async function poll(url: string, until: () => boolean): Promise<number[]> {
  const latencies: number[] = [];
  while (!until()) {
    const started = performance.now();
    const res = await fetch(url);
    await res.arrayBuffer();
    if (!res.ok) throw new Error(`${url} answered ${res.status}`);
    latencies.push(performance.now() - started);
    await new Promise((r) => setTimeout(r, 5));
  }
  return latencies;
}

export async function benchEventLoop(databaseUrl: string, opts: { prints: number; idleSeconds: number }): Promise<EventLoopFigures> {
  const env = productionServerEnv(databaseUrl, { WAYMARK_DEMO: 'on' });
  const children: ChildProcess[] = [];
  try {
    const app = await spawnServer(['server/index.ts'], env);
    children.push(app.child);
    const base = `http://127.0.0.1:${app.port}`;
    const send = await signIn(base);
    const schedule = makeSchedule(CIRCUITS, 'Largest allowed board');
    const created = await send('POST', '/api/boards', { name: schedule.board.name });
    const { id } = (await created.json()) as { id: number };
    const saved = await send('PUT', `/api/boards/${id}/schedule`, { ...schedule, baseRevision: 1 });
    if (!saved.ok) throw new Error(`save the big board: ${saved.status} ${await saved.text()}`);
    const printUrl = `/api/boards/${id}/pdf/chart?media=a4`;
    const first = await send('GET', printUrl); // the render threads are warm before anything is timed
    if (!first.ok) throw new Error(`big print: ${first.status} ${await first.text()}`);
    await first.arrayBuffer();

    const listed = (await (await send('GET', '/api/boards')).json()) as { items: Array<{ id: number }> };
    const summaries = await Promise.all(
      listed.items.map(async (b) => (await (await send('GET', `/api/boards/${b.id}`)).json()) as { publicToken: string; publicEnabled: boolean }),
    );
    const demoPage = summaries.find((b) => b.publicEnabled);
    if (!demoPage) throw new Error('no demo board with its page on');
    const pageUrl = `${base}/api/public/boards/${demoPage.publicToken}`;

    const idleUntil = performance.now() + opts.idleSeconds * 1000;
    const [idle, idlePage] = await Promise.all([
      poll(`${base}/api/health`, () => performance.now() > idleUntil),
      poll(pageUrl, () => performance.now() > idleUntil),
    ]);

    let printing = true;
    const printTimes: number[] = [];
    const prints = (async () => {
      for (let i = 0; i < opts.prints; i++) {
        const started = performance.now();
        const res = await send('GET', printUrl);
        await res.arrayBuffer();
        if (!res.ok) throw new Error(`big print: ${res.status}`);
        printTimes.push(performance.now() - started);
      }
      printing = false;
    })();
    const [during, duringPage] = await Promise.all([poll(`${base}/api/health`, () => !printing), poll(pageUrl, () => !printing)]);
    await prints;
    return {
      healthP99MsIdle: round(p99(idle)),
      healthP99MsDuringBigPrint: round(p99(during)),
      boardPageP99MsIdle: round(p99(idlePage)),
      boardPageP99MsDuringBigPrint: round(p99(duringPage)),
      healthSamples: during.length,
      bigPrint: `chart on A4 of a ${CIRCUITS}-way board`,
      bigPrintMs: Math.round(median(printTimes)),
      prints: printTimes.length,
    };
  } finally {
    for (const c of children) c.kill('SIGTERM');
  }
}
