/**
 * Growers write through both app servers while node 1 (server A's own) is SIGKILLed and later
 * rejoins. Each grower behaves as the app's offline queue does (src/components/entries/outbox.ts):
 * a network error or a 5xx keeps the entry and sends it again with the same Idempotency-Key — here
 * through the other server, as a load balancer would. At the end every acknowledged entry is stored
 * exactly once (rows = 201 answers), and the three nodes hold the same rows and checksums.
 */
import { randomUUID } from 'node:crypto';
import { readFileSync, statSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { killNode, nodeState, startNode, waitSynced } from '@/cli/galera';
import { makeCrop } from '../support/entries';
import { addMember, createHousehold, newVerifiedUser, type TestUser } from '../support/users';
import { call, CLUSTER, logLines, onNode, retriesLogged, sleep, yesterday, type Answer } from './support';

const [node1, node2, node3] = CLUSTER.nodes as [(typeof CLUSTER.nodes)[0], (typeof CLUSTER.nodes)[0], (typeof CLUSTER.nodes)[0]];

/** The note on every imported row (entries sent through the API have none). */
const IMPORT_NOTE = 'cluster import';

interface Grower {
  user: TestUser;
  householdId: number;
  cropId: number;
  foodId: number;
}

interface Tally {
  /** Idempotency-Key → the entry id its 201 named (the same id on every replay). */
  harvests: Map<string, number>;
  purchases: Map<string, number>;
  /** Sends that failed (network error or 5xx) and were sent again. */
  resent: number;
  replays: number;
  reads: number;
  /** Any answer other than 2xx or a retried failure: must stay empty. */
  unexpected: string[];
}

const tally: Tally = { harvests: new Map(), purchases: new Map(), resent: 0, replays: 0, reads: 0, unexpected: [] };
const growers: Grower[] = [];
const householdIds: number[] = [];
let stop = false;

beforeAll(async () => {
  const foods = await call(0, '', 'GET', '/api/foods?q=potato&dataset=ifct2017');
  const foodId = foods.body.foods[0].id as number;
  for (let h = 0; h < 3; h++) {
    const [owner, grower] = await Promise.all([newVerifiedUser({ name: `Owner ${h}` }), newVerifiedUser({ name: `Grower ${h}` })]);
    const household = await createHousehold(owner.cookie, { name: `Cluster plot ${h}` });
    await addMember(owner, household.id, grower, 'grower');
    const crop = await makeCrop(owner.cookie, household.id, { name: 'Potato', foodId, category: 'root_tuber' });
    for (const user of [owner, grower]) growers.push({ user, householdId: household.id, cropId: crop.id, foodId });
    householdIds.push(household.id);
  }
});

afterAll(() => {
  stop = true;
});

/** Sends one keyed request until it gets a 2xx (or gives up after a minute), alternating servers on failure. */
async function sendKeyed(g: Grower, first: number, path: string, body: unknown): Promise<Answer | null> {
  const key = randomUUID();
  const until = Date.now() + 60_000;
  for (let server = first; Date.now() < until; server = 1 - server) {
    let a: Answer | null = null;
    try {
      a = await call(server, g.user.cookie, 'POST', path, body, { 'Idempotency-Key': key });
    } catch {
      /* a network error: send again */
    }
    if (a && a.status < 500) {
      if (a.status !== 201) tally.unexpected.push(`${path} → ${a.status} ${JSON.stringify(a.body)}`);
      if (a.headers['idempotency-replayed'] === 'true') tally.replays++;
      return a.status === 201 ? Object.assign(a, { key }) : null;
    }
    tally.resent++;
    await sleep(150 + Math.random() * 200);
  }
  tally.unexpected.push(`${path}: no answer within a minute`);
  return null;
}

/** One grower's loop: mostly harvests, some bought food, now and then the share report. */
async function grow(g: Grower, index: number): Promise<void> {
  const date = yesterday();
  for (let i = 0; !stop; i++) {
    const server = (index + i) % 2;
    const roll = i % 10;
    if (roll < 7) {
      const a = await sendKeyed(g, server, `/api/households/${g.householdId}/harvests`, { date, cropId: g.cropId, quantity: 1 + (i % 5) / 10, unit: 'kg', use: 'fresh' });
      if (a) tally.harvests.set((a as Answer & { key: string }).key, a.body.harvest.id);
    } else if (roll < 9) {
      const a = await sendKeyed(g, server, `/api/households/${g.householdId}/purchases`, { date, foodId: g.foodId, quantity: 2, unit: 'kg' });
      if (a) tally.purchases.set((a as Answer & { key: string }).key, a.body.purchase.id);
    } else {
      try {
        const r = await call(server, g.user.cookie, 'GET', `/api/households/${g.householdId}/share`);
        if (r.status === 200) tally.reads++;
        else if (r.status < 500) tally.unexpected.push(`share → ${r.status}`);
      } catch {
        /* a read lost with its node: the next one goes on */
      }
    }
  }
}

/** An import of `rows` harvests through server B (whose node stays up), in one transaction. */
async function importThroughB(g: Grower, rows: number): Promise<number> {
  const csv = ['Date,Crop,Quantity,Unit,Use,Note', ...Array.from({ length: rows }, (_, i) => `${yesterday()},Potato,${(i % 7) + 1},kg,fresh,${IMPORT_NOTE}`)].join('\n');
  const form = new FormData();
  form.set('file', new Blob([csv], { type: 'text/csv' }), 'cluster.csv');
  form.set('kind', 'harvests');
  form.set('mode', 'commit');
  const res = await fetch(`${process.env.CLUSTER_APP_URLS!.split(',')[1]}/api/households/${g.householdId}/imports`, {
    method: 'POST',
    headers: { cookie: g.user.cookie, origin: process.env.PUBLIC_ORIGIN! },
    body: form,
  });
  const body = (await res.json()) as { created?: number };
  expect(res.status, JSON.stringify(body)).toBe(201);
  return body.created ?? 0;
}

/** Waits until every node has applied the same last transaction (wsrep_last_committed). */
async function settled(): Promise<void> {
  for (let i = 0; i < 120; i++) {
    const seen = await Promise.all(
      CLUSTER.nodes.map(async (n) => (await onNode<{ Value: string }>(n, "SHOW STATUS LIKE 'wsrep_last_committed'"))[0]!.Value),
    );
    if (new Set(seen).size === 1) return;
    await sleep(250);
  }
  throw new Error('the nodes did not settle on one last committed transaction');
}

describe('writing through two servers while a node dies and rejoins', () => {
  it('loses and doubles nothing, and the rejoined node catches up', async () => {
    const retriesBefore = retriesLogged();
    const t0 = Date.now();
    const loops = growers.map((g, i) => grow(g, i));

    await sleep(8_000);
    const before = tally.harvests.size + tally.purchases.size;
    await killNode(node1);
    const killedAt = Date.now();
    expect(await nodeState(node1)).toBeNull();

    // While node 1 is down: an import through server B, and the growers go on through both.
    const imported = await importThroughB(growers[1]!, 40);
    await sleep(8_000);
    const duringOutage = tally.harvests.size + tally.purchases.size - before;

    const logFrom = statSync(node1.logFile).size;
    const restartedAt = Date.now();
    startNode(CLUSTER, node1);
    await waitSynced(node1, 3, 150_000);
    const rejoinedAt = Date.now();
    // It caught up by incremental transfer (IST) from the others' cache, not a full copy (SST).
    const rejoinLog = readFileSync(node1.logFile, 'utf8').slice(logFrom);
    expect(rejoinLog).toMatch(/Receiving IST|IST received/);
    await sleep(6_000);
    stop = true;
    await Promise.all(loops);

    expect(tally.unexpected).toEqual([]);
    expect(duringOutage).toBeGreaterThan(0);
    // Server A noticed its node was gone and went on through another.
    expect(logLines(0, /database host 127\.0\.0\.1:\d+ failed/).length).toBeGreaterThan(0);

    await settled();
    // Every acknowledged entry once: the ids the 201s named are the rows stored, on every node.
    const ids = (m: Map<string, number>) => [...m.values()].sort((a, b) => a - b);
    for (const node of [node1, node2, node3]) {
      const harvestIds = (await onNode<{ id: number }>(node, 'SELECT id FROM harvests WHERE household_id IN (?) AND note IS NULL ORDER BY id', [householdIds])).map((r) => r.id);
      const purchaseIds = (await onNode<{ id: number }>(node, 'SELECT id FROM purchases WHERE household_id IN (?) ORDER BY id', [householdIds])).map((r) => r.id);
      const importedRows = await onNode<{ n: number }>(node, 'SELECT COUNT(*) AS n FROM harvests WHERE household_id IN (?) AND note = ?', [householdIds, IMPORT_NOTE]);
      expect(harvestIds).toEqual(ids(tally.harvests));
      expect(purchaseIds).toEqual(ids(tally.purchases));
      expect(Number(importedRows[0]!.n)).toBe(imported);
    }

    // The same rows everywhere: counts and InnoDB checksums of the tables the run wrote.
    const tables = ['harvests', 'purchases', 'idempotency_keys', 'harvest_groups', 'purchase_groups', 'share_versions', 'session', 'user'];
    const sums = await Promise.all(
      [node1, node2, node3].map(async (n) => JSON.stringify(await onNode(n, `CHECKSUM TABLE ${tables.map((t) => `\`${t}\``).join(', ')}`).then((rows) => (rows as { Checksum: number }[]).map((r) => r.Checksum)))),
    );
    expect(new Set(sums).size).toBe(1);

    console.log(
      [
        `cluster run: ${growers.length} growers through 2 servers for ${((Date.now() - t0) / 1000).toFixed(0)} s`,
        `entries acknowledged: ${tally.harvests.size} harvests, ${tally.purchases.size} bought food (${duringOutage} while node 1 was down), ${imported} imported rows; share reads ${tally.reads}`,
        `client resends after a network error or 5xx: ${tally.resent}, replayed answers: ${tally.replays}; server write retries: ${retriesLogged() - retriesBefore}`,
        `node 1 killed ${((killedAt - t0) / 1000).toFixed(1)} s in, restarted ${((restartedAt - killedAt) / 1000).toFixed(1)} s later, synced again by IST ${((rejoinedAt - restartedAt) / 1000).toFixed(1)} s after its restart`,
        `checksums equal on 3 nodes: ${tables.join(', ')}`,
      ].join('\n'),
    );
  });
});
