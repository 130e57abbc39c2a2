/**
 * `npm run bench`: its own MariaDB and production build, then in one run:
 * PDF timings against a bare pdf-lib baseline, the board page under load against a bare Express
 * endpoint, SQL queries per board read at 10 and 1000 circuits, and server memory after the load.
 * Prints a table and writes bench-results.json at the repository root.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir, cpus, totalmem } from 'node:os';
import { join } from 'node:path';
import { startPrivateMariadb, removeDir, type PrivateMariadb } from './mariadb.js';
import { openDatabase } from '../server/db/client.js';
import { migrateDatabase } from '../server/db/migrate.js';
import { seedDemo } from '../server/seed/index.js';
import { seedDemoBoards } from '../server/seed/boards.js';
import { benchPdf } from '../bench/pdf.js';
import { benchQueries } from '../bench/queries.js';
import { benchLoad } from '../bench/load-suite.js';
import { benchEventLoop } from '../bench/event-loop.js';
import { benchEditor, type EditorFigures } from '../bench/editor.js';
import { benchClusterInto } from '../bench/cluster.js';
import { benchTransfer, transferTargets, type TransferFigures } from '../bench/transfer.js';

const root = join(import.meta.dirname, '..');
const quick = process.argv.includes('--quick');
const editorOnly = process.argv.includes('--editor');
const transferOnly = process.argv.includes('--transfer');
let mariadb: PrivateMariadb | null = null;
const dataDir = mkdtempSync(join(tmpdir(), 'waymark-bench-db-'));

try {
  if (!existsSync(join(root, 'dist', 'index.html')) || !process.argv.includes('--no-build')) {
    const r = spawnSync(join(root, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'warn'], { stdio: 'inherit', cwd: root });
    if (r.status !== 0) throw new Error('client build failed');
  }
  mariadb = await startPrivateMariadb({ dataDir, dbName: 'waymark_bench', durable: false });
  const database = openDatabase(mariadb.url);
  await migrateDatabase(database);
  await seedDemo(database.db, seedDemoBoards);

  if (transferOnly) {
    const transfer = await benchTransferFigures(mariadb.url);
    await database.close();
    const missed = transferTargets(transfer);
    console.log(missed.length ? `\nTargets missed:\n  ${missed.join('\n  ')}` : '\nTransfer targets met.');
  } else {
    console.log('== Board editor in headless Chromium (1366 × 900; load median, keystroke → next frame over 10 keys)');
    const editor = await benchEditor(mariadb.url, { runs: quick ? 3 : 5 });
    console.table([editor]);
    const editorFailures = editorTargets(editor);
    if (editorOnly) {
      await database.close();
      console.log(editorFailures.length ? `\nTargets missed:\n  ${editorFailures.join('\n  ')}` : '\nEditor targets met.');
    } else {
      const transfer = await benchTransferFigures(mariadb.url);
      await benchServer(database, mariadb.url, editor, transfer, [...editorFailures, ...transferTargets(transfer)]);
    }
  }
} finally {
  await mariadb?.stop();
  removeDir(dataDir);
}

async function benchTransferFigures(databaseUrl: string): Promise<TransferFigures> {
  console.log('== Bytes over the wire (headless Chromium: first visits, a repeat after a one-screen release, the board page at 1.6 Mbit/s)');
  const transfer = await benchTransfer(databaseUrl);
  console.table([transfer]);
  return transfer;
}

/** The PDF, query and load figures, then bench-results.json with the editor's beside them. */
async function benchServer(
  database: ReturnType<typeof openDatabase>,
  databaseUrl: string,
  editor: EditorFigures,
  transfer: TransferFigures,
  editorFailures: string[],
): Promise<void> {
  console.log('== PDF generation (median of repeated runs, baseline = bare pdf-lib with the same text runs and rectangles)');
  const pdf = await benchPdf(database, { runs: quick ? 3 : 9 });
  console.table(pdf);

  console.log('== SQL queries per board read');
  const queries = await benchQueries(database);
  console.table([queries]);

  console.log('== Board page under load (autocannon on loopback)');
  const { load, rssMb } = await benchLoad(database, databaseUrl, { seconds: quick ? 3 : 10, connections: 50 });
  console.table(load);
  console.log(`Server RSS after the load: ${rssMb} MB`);

  console.log('== /api/health while the largest allowed print renders (render threads; baseline: health alone, same run)');
  const eventLoop = await benchEventLoop(databaseUrl, { prints: quick ? 2 : 5, idleSeconds: quick ? 3 : 10 });
  console.table([eventLoop]);
  await database.close();

  const machine = `${cpus().length} × ${cpus()[0]?.model ?? 'cpu'}, ${Math.round(totalmem() / 2 ** 30)} GiB, Node ${process.version}`;
  writeFileSync(
    join(root, 'bench-results.json'),
    JSON.stringify({ machine, at: new Date().toISOString(), pdf, load, queries, rssMb, eventLoop, editor, transfer }, null, 2) + '\n',
  );
  console.log(`\nWrote bench-results.json (${machine})`);
  await benchClusterInto(join(root, 'bench-results.json'), { seconds: quick ? 3 : 10 });
  const failures = [
    ...editorFailures,
    ...pdf.filter((p) => p.ratio > 2).map((p) => `${p.name}: ${p.ratio}× its baseline (target ≤ 2×)`),
    ...load
      .filter((l) => l.ratio < 0.4 || l.errors > 0)
      .map((l) => `${l.route}: ${Math.round(l.ratio * 100)} % of bare, ${l.errors} errors (target ≥ 40 %, 0 errors)`),
    ...(queries.at10 !== queries.at1000 ? [`queries differ: ${queries.at10} at 10 circuits, ${queries.at1000} at 1000`] : []),
    ...(eventLoop.healthP99MsDuringBigPrint > 50
      ? [`health p99 ${eventLoop.healthP99MsDuringBigPrint} ms during the big print (target ≤ 50; alone ${eventLoop.healthP99MsIdle} ms)`]
      : []),
  ];
  const chart100 = pdf.find((p) => p.name === 'chart-100')?.medianMs ?? 0;
  const chart1000 = pdf.find((p) => p.name === 'chart-1000')?.medianMs ?? 0;
  if (chart100 && chart1000 > 12 * chart100) failures.push(`chart-1000 is ${(chart1000 / chart100).toFixed(1)}× chart-100 (target ≤ 12×)`);
  console.log(failures.length ? `\nTargets missed:\n  ${failures.join('\n  ')}` : '\nAll targets met.');
}

/** Issue 19's targets: a 120-way board loads within 1.5 × a 10-way one and a keystroke stays inside one frame. */
function editorTargets(e: EditorFigures): string[] {
  const out: string[] = [];
  if (e.load120Ms > 1.5 * e.load10Ms) out.push(`editor load120Ms ${e.load120Ms} > 1.5 × load10Ms ${e.load10Ms}`);
  if (e.key120MedianMs > 16 || e.key120MedianMs > 1.5 * e.key10MedianMs)
    out.push(`editor key120MedianMs ${e.key120MedianMs} (target ≤ 16 and ≤ 1.5 × key10MedianMs ${e.key10MedianMs})`);
  if (e.key120MaxMs > 50) out.push(`editor key120MaxMs ${e.key120MaxMs} (target ≤ 50)`);
  return out;
}
