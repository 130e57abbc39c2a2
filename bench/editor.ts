/**
 * The board editor in headless Chromium (Debian's, driven by playwright-core) at 1366 × 900, on boards
 * of 10 and 120 circuits the bench makes itself through the API: how long until the circuit table is on
 * screen, and how long one keystroke in a label cell takes to reach the next frame (median and worst).
 */
import { chromium, type Page } from 'playwright-core';
import { BOARD_FILE_FORMAT } from '../shared/schemas/schedule.js';
import { DEMO_PASSWORD, DEMO_USERS } from '../server/seed/index.js';
import { makeSchedule } from '../tests/helpers/boards.js';
import { CHROMIUM_ARGS } from '../tests/helpers/browser.js';
import { productionServerEnv, spawnServer } from './load.js';

export interface EditorFigures {
  load10Ms: number;
  load120Ms: number;
  key10MedianMs: number;
  key120MedianMs: number;
  key120MaxMs: number;
  key10MaxMs: number;
  inputs10: number;
  inputs120: number;
}

const LAPTOP = { width: 1366, height: 900 }; // a common laptop viewport in CSS pixels // from memory
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
const round = (n: number) => Math.round(n * 10) / 10;

async function api(page: Page, method: 'GET' | 'POST', path: string, data?: unknown): Promise<{ id: number }> {
  const { token } = (await (await page.request.get('/api/auth/csrf')).json()) as { token: string };
  const res = await page.request.fetch(path, { method, headers: { 'X-CSRF-Token': token }, data });
  if (!res.ok()) throw new Error(`${method} ${path}: ${res.status()} ${await res.text()}`);
  return res.json() as Promise<{ id: number }>;
}

/** Editor load until the first circuit's label box is on screen, median of `runs` after one warm-up. */
async function loadMs(page: Page, boardId: number, runs: number): Promise<number> {
  const times: number[] = [];
  for (let i = 0; i <= runs; i++) {
    await page.goto('about:blank');
    const started = Date.now();
    await page.goto(`/boards/${boardId}`);
    await page.locator('td[data-cell="label-c1"] input').waitFor({ state: 'visible' });
    if (i > 0) times.push(Date.now() - started);
  }
  return median(times);
}

/**
 * Each key pressed in the label box of `circuitId`, timed in the page from the keydown event to just
 * after the next frame is drawn (a task queued from requestAnimationFrame runs once the frame is done).
 * Keys come 150 ms apart, a brisk typist's pace (common practice).
 */
/** Page script (the bench is typed without the DOM library): times every keydown to just after its frame. */
const KEY_TIMER = `
  window.keyTimes = [];
  document.addEventListener('keydown', (event) => requestAnimationFrame(() => setTimeout(() => window.keyTimes.push(performance.now() - event.timeStamp))), { capture: true });
`;

async function keyTimes(page: Page, circuitId: string, keys: number): Promise<number[]> {
  const input = page.locator(`td[data-cell="label-${circuitId}"] input`);
  // A table that builds only the lines in view is scrolled down to the line, as a user would.
  for (let i = 0; i < 40 && !(await input.count()); i++) {
    await page.evaluate(`document.querySelector('.board-circuits__scroll')?.scrollBy(0, 300)`);
    await page.waitForTimeout(50);
  }
  await input.scrollIntoViewIfNeeded();
  await input.click();
  await page.keyboard.press('End');
  await page.evaluate(KEY_TIMER);
  for (let i = 0; i < keys; i++) {
    // Backspace keeps the label inside its 24 characters however long the run.
    await page.keyboard.press(i % 2 ? 'Backspace' : 'x');
    await page.waitForTimeout(150);
  }
  await page.waitForTimeout(600);
  return page.evaluate<number[]>('window.keyTimes');
}

async function figuresFor(page: Page, circuits: number, runs: number): Promise<{ loadMs: number; keys: number[]; inputs: number }> {
  const file = { format: BOARD_FILE_FORMAT, kind: 'waymark-board', ...makeSchedule(circuits, `Bench board ${circuits}`) };
  const { id } = await api(page, 'POST', '/api/boards/import', file);
  const load = await loadMs(page, id, runs);
  const inputs = await page.locator('input').count();
  // A label in the middle of the board (way 5 of 10, way 60 of 120): the table around it is on screen.
  const keys = await keyTimes(page, `c${Math.ceil(circuits / 2)}`, 10);
  return { loadMs: load, keys, inputs };
}

/** Starts the production server on the bench database, signs in as the demo owner and measures both boards. */
export async function benchEditor(databaseUrl: string, opts: { runs: number }): Promise<EditorFigures> {
  const env = productionServerEnv(databaseUrl);
  const server = await spawnServer(['server/index.ts'], env);
  const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: CHROMIUM_ARGS });
  try {
    const context = await browser.newContext({ viewport: LAPTOP, baseURL: `http://127.0.0.1:${server.port}` });
    const page = await context.newPage();
    await api(page, 'POST', '/api/auth/login', { email: DEMO_USERS[0].email, password: DEMO_PASSWORD });
    const small = await figuresFor(page, 10, opts.runs);
    const big = await figuresFor(page, 120, opts.runs);
    return {
      load10Ms: small.loadMs,
      load120Ms: big.loadMs,
      key10MedianMs: round(median(small.keys)),
      key120MedianMs: round(median(big.keys)),
      key120MaxMs: round(Math.max(...big.keys)),
      key10MaxMs: round(Math.max(...small.keys)),
      inputs10: small.inputs,
      inputs120: big.inputs,
    };
  } finally {
    await browser.close();
    server.child.kill('SIGTERM');
  }
}
