/**
 * A phone's signal, for the offline e2e specs: an HTTP proxy on loopback that the browser context
 * sends everything through (Playwright's `proxy` option), and that a test can cut. Cut, it drops
 * every open connection and closes each new one at once, so nothing the browser sends reaches the
 * app: not the page's requests, not the service worker's. Chromium's offline emulation alone tells
 * the page it is offline, but a request from a page the service worker controls has been seen to
 * reach the server under it; a real phone with no signal reaches nothing.
 */
import { createServer, request, type IncomingHttpHeaders } from 'node:http';
import type { AddressInfo, Socket } from 'node:net';

export interface Signal {
  /** The proxy's own address, for Playwright's `proxy.server`. */
  readonly url: string;
  /** Requests passed on to the app, and requests or connections dropped while cut (so a test can tell the browser does use it). */
  readonly counts: { passed: number; dropped: number };
  /** No signal: open connections dropped, new ones closed at once. */
  cut(): void;
  /** Signal again. */
  restore(): void;
  close(): Promise<void>;
}

/** Headers meant for the proxy itself, not passed on. */
const HOP_BY_HOP = new Set(['proxy-connection', 'proxy-authorization', 'keep-alive']);

function forwardedHeaders(headers: IncomingHttpHeaders): IncomingHttpHeaders {
  return Object.fromEntries(Object.entries(headers).filter(([name]) => !HOP_BY_HOP.has(name)));
}

/** Starts a proxy on 127.0.0.1 that passes requests for `target` (the app's origin) on to it, and nothing else. */
export async function startSignalProxy(target: string): Promise<Signal> {
  const app = new URL(target);
  const sockets = new Set<Socket>();
  let cut = false;
  const counts = { passed: 0, dropped: 0 };
  const server = createServer((req, res) => {
    if (cut) {
      counts.dropped += 1;
      return void req.socket.destroy();
    }
    const url = new URL(req.url ?? '/', target);
    if (url.host !== app.host) return void res.writeHead(502, { 'content-type': 'text/plain' }).end('only the app under test');
    counts.passed += 1;
    const upstream = request({ host: app.hostname, port: app.port, method: req.method, path: url.pathname + url.search, headers: forwardedHeaders(req.headers) }, (answer) => {
      res.writeHead(answer.statusCode ?? 502, answer.rawHeaders);
      answer.pipe(res);
    });
    upstream.on('error', () => req.socket.destroy());
    req.pipe(upstream);
  });
  server.on('connection', (socket) => {
    if (cut) {
      counts.dropped += 1;
      return void socket.destroy();
    }
    sockets.add(socket);
    socket.on('close', () => sockets.delete(socket));
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as AddressInfo;
  return {
    url: `http://127.0.0.1:${port}`,
    counts,
    cut() {
      cut = true;
      for (const s of sockets) s.destroy();
    },
    restore() {
      cut = false;
    },
    close() {
      for (const s of sockets) s.destroy();
      return new Promise((resolve) => server.close(() => resolve()));
    },
  };
}
