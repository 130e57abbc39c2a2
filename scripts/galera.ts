/**
 * A MariaDB Galera cluster on loopback: N private servers (scripts/mariadb.ts), each with its own data dir and
 * ports, joined by Debian's galera-4 provider (it comes with mariadb-server). Used by `npm run cluster`, the
 * cluster test and the bench. The why of each setting is beside it.
 */
import { chmodSync, existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import mysql from 'mysql2/promise';
import { freePort, startPrivateMariadb, type PrivateMariadb, type Readiness } from './mariadb.js';

export interface GaleraNode extends PrivateMariadb {
  name: string;
}

export interface GaleraCluster {
  nodes: GaleraNode[];
  /** One `mysql://` URL listing every node (server/db/client.ts opens a pool cluster on it). */
  url: string;
  /** `wsrep_cluster_size` as one node sees it. */
  clusterSize(node?: GaleraNode): Promise<number>;
  /** Stops the nodes last to first, so the first is the last to leave and may bootstrap the next start. */
  stop(): Promise<void>;
}

/** Galera's three ports per node: group communication, incremental state transfer, full state transfer (rsync). */
interface NodePorts {
  sql: number;
  group: number;
  ist: number;
  sst: number;
}

const PROVIDER = '/usr/lib/galera/libgalera_smm.so';

/** Ready for the app once the node has joined and caught up (before that it answers "WSREP has not yet prepared node"). */
const synced: Readiness = async (conn) => {
  const [rows] = await conn.query("SHOW STATUS LIKE 'wsrep_local_state_comment'");
  return (rows as Array<{ Value: string }>)[0]?.Value === 'Synced';
};

/**
 * Marks the first node safe to bootstrap from when no node is (every node was killed, not stopped). In a development
 * cluster that is the simple way back; the first node's data wins, and a node that was ahead copies it again.
 */
function allowBootstrap(dataDir: string): void {
  const file = join(dataDir, 'db', 'grastate.dat');
  if (!existsSync(file)) return;
  const text = readFileSync(file, 'utf8');
  if (/safe_to_bootstrap:\s*0/.test(text)) writeFileSync(file, text.replace(/safe_to_bootstrap:\s*0/, 'safe_to_bootstrap: 1'));
}

function galeraArgs(name: string, ports: NodePorts, all: NodePorts[], bootstrap: boolean): string[] {
  return [
    '--wsrep-on=ON',
    `--wsrep-provider=${PROVIDER}`,
    `--wsrep-cluster-name=waymark`,
    `--wsrep-node-name=${name}`,
    `--wsrep-cluster-address=gcomm://${all.map((p) => `127.0.0.1:${p.group}`).join(',')}`,
    `--wsrep-node-address=127.0.0.1:${ports.group}`,
    // A small write-set cache: three nodes share one disk, and a node that was down briefly still catches up from it.
    `--wsrep-provider-options=gmcast.listen_addr=tcp://127.0.0.1:${ports.group};ist.recv_addr=127.0.0.1:${ports.ist};gcache.size=64M`,
    `--wsrep-sst-receive-address=127.0.0.1:${ports.sst}`,
    '--wsrep-sst-method=rsync',
    // Galera replicates row images and cannot hand out interleaved auto-increment locks.
    '--binlog-format=ROW',
    '--innodb-autoinc-lock-mode=2',
    // Causal reads: a read on any node waits until that node has applied every write the cluster has committed
    // before it, so a save acknowledged through one node is seen by a board-page read through another.
    '--wsrep-sync-wait=1',
    ...(bootstrap ? ['--wsrep-new-cluster'] : []),
  ];
}

async function clusterPorts(count: number, firstSqlPort?: number, firstGroupPort?: number): Promise<NodePorts[]> {
  const out: NodePorts[] = [];
  for (let i = 0; i < count; i++) {
    if (firstSqlPort && firstGroupPort) {
      out.push({ sql: firstSqlPort + i, group: firstGroupPort + i, ist: firstGroupPort + 10 + i, sst: firstGroupPort + 20 + i });
    } else out.push({ sql: await freePort(), group: await freePort(), ist: await freePort(), sst: await freePort() });
  }
  return out;
}

/**
 * Starts `count` nodes under `dir` (`dir/node1`, …): the first bootstraps the cluster, the others join one at a time
 * (each copies the first's data by rsync on its first start). Fixed ports when `firstSqlPort`/`firstGroupPort` are
 * given (npm run cluster: 3401…, 4561…), else free ones (tests). Nodes run as `mysql`: see scripts/mariadb.ts.
 */
export async function startGaleraCluster(opts: {
  dir: string;
  count?: number;
  dbName?: string;
  firstSqlPort?: number;
  firstGroupPort?: number;
  durable?: boolean;
  supervise?: boolean;
}): Promise<GaleraCluster> {
  const count = opts.count ?? 3;
  const dbName = opts.dbName ?? 'waymark';
  const ports = await clusterPorts(count, opts.firstSqlPort, opts.firstGroupPort);
  // The servers run as `mysql`, which must reach its data dirs (a temporary dir is made 0700 for root).
  mkdirSync(opts.dir, { recursive: true });
  chmodSync(opts.dir, 0o755);
  const nodes: GaleraNode[] = [];
  const stop = async () => {
    for (const node of [...nodes].reverse()) await node.stop().catch(() => {});
  };
  try {
    for (let i = 0; i < count; i++) {
      const name = `node${i + 1}`;
      const dataDir = join(opts.dir, name);
      if (i === 0) allowBootstrap(dataDir);
      const node = await startPrivateMariadb({
        dataDir,
        port: ports[i].sql,
        dbName,
        durable: opts.durable,
        supervise: opts.supervise,
        user: 'mysql',
        // Only the first node's first start makes a new cluster; restarted, it joins the others like any node.
        extraArgs: (firstStart) => galeraArgs(name, ports[i], ports, i === 0 && firstStart),
        ready: synced,
        startTimeoutMs: 120_000,
      });
      nodes.push(Object.assign(node, { name }));
    }
  } catch (err) {
    await stop();
    throw err;
  }
  const hosts = ports.map((p) => `127.0.0.1:${p.sql}`).join(',');
  return {
    nodes,
    url: `mysql://root@${hosts}/${dbName}`,
    stop,
    async clusterSize(node = nodes[0]) {
      const conn = await mysql.createConnection({ host: '127.0.0.1', port: node.port, user: 'root', password: '' });
      try {
        const [rows] = await conn.query("SHOW STATUS LIKE 'wsrep_cluster_size'");
        return Number((rows as Array<{ Value: string }>)[0]?.Value ?? 0);
      } finally {
        await conn.end();
      }
    },
  };
}
