/**
 * A throw-away three-node Galera cluster (scripts/galera.ts) for the cluster tests, and test apps aimed at one
 * node or at all of them.
 */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import mysql from 'mysql2/promise';
import { startGaleraCluster, type GaleraCluster, type GaleraNode } from '../../scripts/galera.js';
import { removeDir } from '../../scripts/mariadb.js';
import { openDatabase } from '../../server/db/client.js';
import { migrateDatabase } from '../../server/db/migrate.js';
import type { ServerConfig } from '../../server/config.js';
import { startTestApp, type TestApp } from './app.js';

export interface TestCluster extends GaleraCluster {
  close(): Promise<void>;
}

/** Starts the nodes in a temporary dir and migrates the schema once, through the first node (DDL replicates). */
export async function startTestCluster(): Promise<TestCluster> {
  const dir = mkdtempSync(join(tmpdir(), 'waymark-galera-'));
  const cluster = await startGaleraCluster({ dir, dbName: 'waymark_cluster', durable: false });
  const database = openDatabase(cluster.nodes[0].url, { connectionLimit: 1 });
  await migrateDatabase(database).finally(() => database.close());
  return Object.assign(cluster, {
    async close() {
      await cluster.stop();
      removeDir(dir);
    },
  });
}

/** A test app (startTestApp) on another database URL than the suite's: one node's, or the cluster's list of all. */
export async function startTestAppOn(databaseUrl: string, overrides: Partial<ServerConfig> = {}): Promise<TestApp> {
  const suiteUrl = process.env.DATABASE_URL;
  process.env.DATABASE_URL = databaseUrl;
  try {
    // Board-page reads come in a stream from one address: the public limit has its own tests.
    return await startTestApp({ ...overrides, rateLimits: { publicPerMinute: 1_000_000 } as ServerConfig['rateLimits'] });
  } finally {
    process.env.DATABASE_URL = suiteUrl;
  }
}

/** Runs one query on one node directly (not through the app), to see what that node holds. */
export async function onNode<T>(node: GaleraNode, sql: string, values: unknown[] = []): Promise<T[]> {
  const conn = await mysql.createConnection({ uri: node.url });
  try {
    return (await conn.query(sql, values))[0] as T[];
  } finally {
    await conn.end();
  }
}

/** Certification failures and brute-force aborts a node has counted: proof that two nodes' writes met. */
export async function conflictCount(nodes: GaleraNode[]): Promise<number> {
  let sum = 0;
  for (const node of nodes) {
    const rows = await onNode<{ Value: string }>(node, "SHOW STATUS WHERE Variable_name IN ('wsrep_local_cert_failures', 'wsrep_local_bf_aborts')");
    sum += rows.reduce((n, r) => n + Number(r.Value), 0);
  }
  return sum;
}
