/**
 * `npm test`: a throw-away MariaDB (own port, temp data dir, removed afterwards even on failure),
 * migrations, the type check and client build, then every vitest test against that database.
 * `npm test -- tests/api/boards.test.ts` runs only the named tests and skips the type check.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startPrivateMariadb, removeDir, type PrivateMariadb } from './mariadb.js';
import { openDatabase } from '../server/db/client.js';
import { migrateDatabase } from '../server/db/migrate.js';

const root = join(import.meta.dirname, '..');
const args = process.argv.slice(2);
const focused = args.some((a) => !a.startsWith('-'));
const bin = (name: string) => join(root, 'node_modules', '.bin', name);

function step(title: string, cmd: string, cmdArgs: string[], env: NodeJS.ProcessEnv = process.env): boolean {
  console.log(`\n== ${title}`);
  const r = spawnSync(cmd, cmdArgs, { stdio: 'inherit', cwd: root, env });
  return r.status === 0;
}

let mariadb: PrivateMariadb | null = null;
const dataDir = mkdtempSync(join(tmpdir(), 'waymark-test-db-'));
let code = 1;
const cleanup = async () => {
  await mariadb?.stop().catch(() => {});
  removeDir(dataDir);
};
for (const sig of ['SIGINT', 'SIGTERM'] as const)
  process.on(sig, async () => {
    await cleanup();
    process.exit(130);
  });

try {
  if (!focused) {
    // Errors only: the warnings (each `any` left in tests) are for `npm run lint`, and do not fail.
    if (!step('lint', bin('eslint'), ['.', '--quiet'])) throw new Error('lint failed');
    // Import cycles in the server, shared, scripts and bench code (type-only imports skipped: see "madge" in package.json).
    if (
      !step('import cycles', bin('madge'), [
        '--circular',
        '--no-spinner',
        '--extensions',
        'ts',
        '--ts-config',
        'tsconfig.node.json',
        'server',
        'shared',
        'scripts',
        'bench',
      ])
    ) {
      throw new Error('import cycle found: see the list above');
    }
    if (!step('format', bin('prettier'), ['--check', '--log-level', 'warn', '.'])) throw new Error('format check failed: run `npm run format`');
    if (!step('type check (client)', bin('vue-tsc'), ['--noEmit', '-p', 'tsconfig.app.json'])) throw new Error('type check failed');
    if (!step('type check (server, shared, tests)', bin('tsc'), ['--noEmit', '-p', 'tsconfig.node.json'])) throw new Error('type check failed');
  }
  if (!focused || process.env.WAYMARK_BUILD === '1') {
    if (!step('client build (for the browser tests)', bin('vite'), ['build', '--logLevel', 'warn'])) throw new Error('client build failed');
  }
  console.log('\n== throw-away MariaDB');
  mariadb = await startPrivateMariadb({ dataDir, dbName: 'waymark_test', durable: false });
  const database = openDatabase(mariadb.url);
  await migrateDatabase(database);
  await database.close();
  console.log(`   ${mariadb.url} (data in ${dataDir})`);
  const env = { ...process.env, DATABASE_URL: mariadb.url, WAYMARK_TEST_DB_DATADIR: dataDir, WAYMARK_TEST_DB_PORT: String(mariadb.port), NODE_ENV: 'test' };
  code = step('tests', bin('vitest'), ['run', ...args], env) ? 0 : 1;
} catch (err) {
  console.error(`waymark: ${err instanceof Error ? err.message : err}`);
  code = 1;
} finally {
  await cleanup();
}
process.exit(code);
