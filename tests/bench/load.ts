/**
 * The load rows of `npm run bench`: requests per second of the dashboard's data endpoint (the
 * heavy household's share report for its growing year, as the share page asks for it) under 50
 * connections for 20 s (autocannon, loopback only), against GET /api/health on the same server with
 * the same session cookie (so both pass the same middleware); rounds alternate. Both send the
 * Accept-Encoding the dashboard's browser sends (Chromium's), as the page's own fetch does. Then
 * the server's resident memory.
 */
import autocannon from 'autocannon';
import { median, limitRow, ratioRow, type BenchRow } from './rows';
import { rssMb, type BenchServer } from './server';

const CONNECTIONS = 50;
const SECONDS = Number(process.env.BENCH_LOAD_SECONDS || 20);
/** What Chromium sends with every fetch over http. */
const BROWSER_ACCEPT_ENCODING = 'gzip, deflate, br, zstd';

interface LoadRun {
  rps: number;
  failures: number;
}

async function hammer(url: string, cookie: string): Promise<LoadRun> {
  if (!url.startsWith('http://127.0.0.1:')) throw new Error('the load test runs against loopback only');
  const r = await autocannon({ url, connections: CONNECTIONS, duration: SECONDS, headers: { cookie, 'accept-encoding': BROWSER_ACCEPT_ENCODING } });
  return { rps: r.requests.average, failures: r.errors + r.timeouts + r.non2xx };
}

export async function benchLoad(server: BenchServer, heavyId: number, rounds: number): Promise<BenchRow[]> {
  const share = `${server.base}/api/households/${heavyId}/share`;
  const health = `${server.base}/api/health`;
  const shareRuns: LoadRun[] = [];
  const healthRuns: LoadRun[] = [];
  for (let i = 0; i < rounds; i++) {
    shareRuns.push(await hammer(share, server.cookie));
    healthRuns.push(await hammer(health, server.cookie));
  }
  const failures = shareRuns.reduce((n, r) => n + r.failures, 0) + healthRuns.reduce((n, r) => n + r.failures, 0);
  console.log(`  load: share ${shareRuns.map((r) => r.rps.toFixed(0)).join(', ')} req/s; health ${healthRuns.map((r) => r.rps.toFixed(0)).join(', ')} req/s; ${failures} failed`);
  return [
    ratioRow('load', median(shareRuns.map((r) => r.rps)), median(healthRuns.map((r) => r.rps)), 0.5, { atLeast: true, also: { ok: failures === 0, text: `0 errors (${failures})` } }),
    limitRow('rss', await rssMb(server.child.pid!), 300, 'MB'),
  ];
}
