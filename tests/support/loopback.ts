/**
 * HTTP requests to the built server from another loopback address (127.x.y.z), so that the
 * server sees a different client. The sign-in limiter counts per client address: the rate-limit
 * test uses one address of its own, and signIn() a fresh one each time so other tests never meet it.
 */
import { request, type IncomingMessage } from 'node:http';
import { BASE_URL } from './env';

let counter = 0;

/** A loopback address no other call of this test process used, e.g. 127.23.0.7. */
export function freshLoopbackAddress(): string {
  counter += 1;
  // 127.x.y.z with x from the pid (parallel test processes differ), y.z from a counter.
  return `127.${10 + (process.pid % 200)}.${Math.floor(counter / 250) % 250}.${(counter % 250) + 1}`;
}

export interface LoopbackAnswer {
  status: number;
  headers: Record<string, string | string[] | undefined>;
  body: any;
}

/** One request from `localAddress` to the test server; the body (when given) is sent as JSON. */
export function requestFrom(localAddress: string, method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<LoopbackAnswer> {
  return requestAt(BASE_URL, BASE_URL, localAddress, method, path, body, headers);
}

/**
 * One request to the server at `base` on a connection of its own, from `localAddress` when given;
 * a state change names `origin`, as a browser does. The body (when given) is sent as JSON. A
 * network failure rejects, like fetch.
 */
export function requestAt(base: string, origin: string, localAddress: string | undefined, method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<LoopbackAnswer> {
  const url = new URL(path, base);
  const payload = body === undefined ? undefined : JSON.stringify(body);
  return new Promise((resolve, reject) => {
    const req = request(
      {
        host: url.hostname,
        port: url.port,
        path: url.pathname + url.search,
        method,
        localAddress,
        agent: false,
        headers: { ...(method === 'GET' ? {} : { origin }), ...(payload ? { 'content-type': 'application/json', 'content-length': Buffer.byteLength(payload) } : {}), ...headers },
      },
      (res) => answerOf(res).then(resolve, reject),
    );
    req.setTimeout(30_000, () => req.destroy(new Error('timed out')));
    req.on('error', reject);
    if (payload) req.write(payload);
    req.end();
  });
}

/** A response read whole: its status, headers and body (parsed when it is JSON, else the text). */
export function answerOf(res: IncomingMessage): Promise<LoopbackAnswer> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('error', reject);
    res.on('end', () => {
      const text = Buffer.concat(chunks).toString('utf8');
      let parsed: unknown = text;
      try {
        parsed = JSON.parse(text);
      } catch {
        /* not JSON */
      }
      resolve({ status: res.statusCode ?? 0, headers: res.headers, body: parsed });
    });
  });
}

/** The Cookie header value for the cookies a loopback answer sets. */
export function loopbackCookie(a: LoopbackAnswer): string {
  const set = a.headers['set-cookie'] ?? [];
  return (Array.isArray(set) ? set : [set])
    .map((c) => c.split(';')[0]!)
    .filter((c) => !/=$/.test(c))
    .join('; ');
}
