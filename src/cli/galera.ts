/**
 * A three-node MariaDB Galera cluster on loopback, for `npm run test:cluster` (src/cli/test-cluster.ts)
 * and the tests in tests/cluster/. Each node has its own data directory under the cluster's base
 * folder, its own SQL port and socket, and Galera's group (gcomm), incremental-transfer (IST) and
 * snapshot-transfer (SST, rsync) ports. Nodes run as the `mysql` user: as root, rsync's SST daemon
 * drops to `nobody` and the joiner cannot write its data directory (see STACK.md).
 *
 * Ports from `firstPort` (the test's TEST_PORT + 1): SQL firstPort…+2; Galera's at firstPort + 20000.
 */
import { spawn, spawnSync } from 'node:child_process';
import { chownSync, mkdirSync, openSync, rmSync, writeFileSync } from 'node:fs';
import { resolve } from 'node:path';
import mysql from 'mysql2/promise';
import { serverPid } from './server-pid';
import { ensurePackageFile, ensureProgram, findProgram } from './system';

export const GALERA_LIBRARY = '/usr/lib/galera/libgalera_smm.so';
const CLUSTER_NAME = 'selfsown-test';

export interface GaleraNode {
  /** 1, 2 or 3; also the node's server_id. */
  n: number;
  dataDir: string;
  socket: string;
  pidFile: string;
  logFile: string;
  /** The SQL port on 127.0.0.1. */
  port: number;
  gcommPort: number;
  istPort: number;
  sstPort: number;
}

export interface GaleraCluster {
  base: string;
  nodes: GaleraNode[];
}

/** Where each node lives and listens (nothing is started). */
export function clusterLayout(base: string, firstPort: number): GaleraCluster {
  const nodes = [1, 2, 3].map((n) => {
    const dir = resolve(base, `node${n}`);
    return {
      n,
      dataDir: resolve(dir, 'data'),
      socket: resolve(dir, 'run', 'mariadb.sock'),
      pidFile: resolve(dir, 'run', 'mariadb.pid'),
      logFile: resolve(dir, 'mariadb.log'),
      port: firstPort + n - 1,
      gcommPort: firstPort + 20000 + n - 1,
      istPort: firstPort + 20003 + n - 1,
      sstPort: firstPort + 20006 + n - 1,
    };
  });
  return { base, nodes };
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

function mysqlIds(): { uid: number; gid: number } {
  const uid = Number(spawnSync('id', ['-u', 'mysql'], { encoding: 'utf8' }).stdout.trim());
  const gid = Number(spawnSync('id', ['-g', 'mysql'], { encoding: 'utf8' }).stdout.trim());
  if (!Number.isInteger(uid) || !Number.isInteger(gid) || uid <= 0) throw new Error('the system user "mysql" is missing; reinstall the Debian package mariadb-server');
  return { uid, gid };
}

/** Installs MariaDB and Galera when missing (as root, from Debian) and creates fresh data directories. */
export function initCluster(cluster: GaleraCluster): void {
  ensureProgram('mariadbd', 'mariadb-server');
  ensurePackageFile(GALERA_LIBRARY, 'galera-4');
  ensureProgram('rsync', 'rsync');
  const installDb = findProgram('mariadb-install-db') ?? findProgram('mysql_install_db');
  if (!installDb) throw new Error('mariadb-install-db is missing; reinstall the Debian package mariadb-server');
  const { uid, gid } = mysqlIds();
  rmSync(cluster.base, { recursive: true, force: true });
  for (const node of cluster.nodes) {
    for (const dir of [node.dataDir, resolve(node.socket, '..')]) {
      mkdirSync(dir, { recursive: true });
      chownSync(dir, uid, gid);
    }
    chownSync(resolve(node.dataDir, '..'), uid, gid);
    const r = spawnSync(installDb, ['--no-defaults', `--datadir=${node.dataDir}`, '--user=mysql', '--auth-root-authentication-method=normal', '--skip-test-db'], { encoding: 'utf8' });
    if (r.status !== 0) throw new Error(`mariadb-install-db failed for node ${node.n}:\n${r.stdout}\n${r.stderr}`);
    writeFileSync(node.logFile, '');
    chownSync(node.logFile, uid, gid);
  }
}

function nodeArgs(cluster: GaleraCluster, node: GaleraNode, bootstrap: boolean): string[] {
  const peers = cluster.nodes.map((x) => `127.0.0.1:${x.gcommPort}`).join(',');
  return [
    '--no-defaults',
    `--datadir=${node.dataDir}`,
    `--port=${node.port}`,
    '--bind-address=127.0.0.1',
    `--socket=${node.socket}`,
    `--pid-file=${node.pidFile}`,
    `--log-error=${node.logFile}`,
    '--user=mysql',
    `--server-id=${node.n}`,
    '--character-set-server=utf8mb4',
    '--collation-server=utf8mb4_unicode_ci',
    '--skip-name-resolve',
    '--innodb-ft-min-token-size=2',
    '--innodb-ft-enable-stopword=0',
    '--innodb-buffer-pool-size=128M',
    '--local-infile=ON',
    // What Galera needs: row events, InnoDB, interleaved auto-increment locks.
    '--binlog-format=ROW',
    '--default-storage-engine=InnoDB',
    '--innodb-autoinc-lock-mode=2',
    // Migration 0009's triggers are created by the app's user, not SUPER: allowed when binary logging is on.
    '--log-bin-trust-function-creators=1',
    '--wsrep-on=ON',
    `--wsrep-provider=${GALERA_LIBRARY}`,
    `--wsrep-cluster-name=${CLUSTER_NAME}`,
    `--wsrep-cluster-address=gcomm://${bootstrap ? '' : peers}`,
    `--wsrep-node-address=127.0.0.1:${node.gcommPort}`,
    `--wsrep-node-name=node${node.n}`,
    `--wsrep-provider-options=gmcast.listen_addr=tcp://127.0.0.1:${node.gcommPort};ist.recv_addr=127.0.0.1:${node.istPort};base_port=${node.gcommPort};gcache.size=128M`,
    '--wsrep-sst-method=rsync',
    `--wsrep-sst-receive-address=127.0.0.1:${node.sstPort}`,
    // Reads wait until this node has applied what the cluster committed before them: a session
    // created through one app server is seen at once through another (see README, hosting).
    '--wsrep-sync-wait=1',
  ];
}

/** A root connection over the node's socket, or null when it does not answer. */
export async function rootConnection(node: GaleraNode): Promise<mysql.Connection | null> {
  try {
    return await mysql.createConnection({ socketPath: node.socket, user: 'root', connectTimeout: 2000 });
  } catch {
    return null;
  }
}

/** The node's wsrep state ('Synced', 'Joined'…) and cluster size, or null when it does not answer. */
export async function nodeState(node: GaleraNode): Promise<{ state: string; size: number; ready: boolean } | null> {
  const c = await rootConnection(node);
  if (!c) return null;
  try {
    const [rows] = (await c.query("SHOW STATUS WHERE Variable_name IN ('wsrep_local_state_comment', 'wsrep_cluster_size', 'wsrep_ready')")) as unknown as [{ Variable_name: string; Value: string }[]];
    const v = new Map(rows.map((r) => [r.Variable_name, r.Value]));
    return { state: v.get('wsrep_local_state_comment') ?? '', size: Number(v.get('wsrep_cluster_size') ?? 0), ready: v.get('wsrep_ready') === 'ON' };
  } catch {
    return null;
  } finally {
    await c.end().catch(() => undefined);
  }
}

/** Waits until the node is Synced in a cluster of `size` nodes. */
export async function waitSynced(node: GaleraNode, size: number, timeoutMs = 90_000): Promise<void> {
  const until = Date.now() + timeoutMs;
  let last: Awaited<ReturnType<typeof nodeState>> = null;
  while (Date.now() < until) {
    last = await nodeState(node);
    if (last && last.ready && last.state === 'Synced' && last.size >= size) return;
    await sleep(250);
  }
  throw new Error(`node ${node.n} not synced after ${timeoutMs / 1000} s (last: ${JSON.stringify(last)}); see ${node.logFile}`);
}

/** Starts a node in the background (its own process group, detached); `bootstrap` starts a new cluster. */
export function startNode(cluster: GaleraCluster, node: GaleraNode, bootstrap = false): number {
  const mariadbd = ensureProgram('mariadbd', 'mariadb-server');
  rmSync(node.socket, { force: true });
  const out = openSync(node.logFile, 'a');
  const child = spawn(mariadbd, nodeArgs(cluster, node, bootstrap), { detached: true, stdio: ['ignore', out, out] });
  child.unref();
  return child.pid!;
}

/** The running node's pid, from its pid file, or null (a stale pid file included). */
export function nodePid(node: GaleraNode): number | null {
  return serverPid(node.pidFile, node.dataDir);
}

/** SIGKILL: the node dies mid-transaction, as in a power cut. Returns when the process is gone. */
export async function killNode(node: GaleraNode): Promise<void> {
  const pid = nodePid(node);
  if (!pid) throw new Error(`node ${node.n} is not running`);
  process.kill(pid, 'SIGKILL');
  for (let i = 0; i < 100 && nodePid(node); i++) await sleep(50);
}

/** Stops a node cleanly (SIGTERM, then SIGKILL after 30 s), waiting for its process to exit. */
export async function stopNode(node: GaleraNode): Promise<void> {
  const pid = nodePid(node);
  if (!pid) return;
  process.kill(pid, 'SIGTERM');
  for (let i = 0; i < 600 && nodePid(node); i++) await sleep(50);
  if (nodePid(node)) process.kill(pid, 'SIGKILL');
}

/** Starts the three nodes: the first bootstraps, the others join one after another (SST). */
export async function startCluster(cluster: GaleraCluster): Promise<void> {
  const [first, ...rest] = cluster.nodes;
  startNode(cluster, first!, true);
  await waitSynced(first!, 1);
  for (const [i, node] of rest.entries()) {
    startNode(cluster, node);
    await waitSynced(node, i + 2);
  }
}

/** Stops every node that runs (on failure too; never throws). */
export async function stopCluster(cluster: GaleraCluster): Promise<void> {
  await Promise.all(cluster.nodes.map((n) => stopNode(n).catch(() => undefined)));
}

/** The cluster layout as JSON, for the tests (CLUSTER_LAYOUT). */
export function layoutJson(cluster: GaleraCluster): string {
  return JSON.stringify(cluster);
}
