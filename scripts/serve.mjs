// `npm start`: serves the built app (dist/) with a graceful shutdown. The adapter's own
// standalone server stops at once on a signal; this one, on SIGTERM or SIGINT, stops taking new
// connections, answers what is in flight (readiness says 503 meanwhile, so a load balancer
// stops sending), closes the idle keep-alive connections, waits up to SHUTDOWN_GRACE_SECONDS,
// then runs the app's shutdown hooks (the database pool) and exits 0.
//   HOST=0.0.0.0 PORT=4321 node scripts/serve.mjs
import http from 'node:http';
import pino from 'pino';

process.env.ASTRO_NODE_AUTOSTART = 'disabled';
const { handler, options } = await import('../dist/server/entry.mjs');

const log = pino({
  level: process.env.LOG_LEVEL || 'info',
  timestamp: pino.stdTimeFunctions.isoTime,
  formatters: { level: (label) => ({ level: label }) },
}).child({ service: 'web' });

// the same object src/lifecycle.server.ts keeps on globalThis (the bundle's hooks land here)
const lifecycle = (globalThis[Symbol.for('hoopline.lifecycle')] ??= { draining: false, closers: new Map() });
const graceMs = Number(process.env.SHUTDOWN_GRACE_SECONDS ?? 25) * 1000;
const host = process.env.HOST ?? (typeof options.host === 'string' ? options.host : '127.0.0.1');
const port = Number(process.env.PORT ?? options.port ?? 4321);

const inFlight = new Set();
const server = http.createServer((req, res) => {
  inFlight.add(res);
  res.once('close', () => inFlight.delete(res));
  if (lifecycle.draining) res.setHeader('connection', 'close');
  // An answer given before the request body was read to its end (a 413 past a limit) leaves the
  // rest of the body on the socket, and such a kept-alive connection would never answer the
  // client's next request. So it closes: our side ends once the answer is out, while what the
  // client is still sending is read and dropped (closing outright would reset a client in the
  // middle of an upload before it reads the 413), for at most 10 s.
  const writeHead = res.writeHead;
  res.writeHead = function (...args) {
    const socket = res.socket;
    if (!req.complete && !res.headersSent && socket) {
      res.setHeader('connection', 'close');
      socket.destroySoon = function () {
        this.end();
        this.resume();
        const timer = setTimeout(() => this.destroy(), 10_000);
        timer.unref();
        this.once('end', () => {
          clearTimeout(timer);
          this.destroy();
        });
      };
    }
    return writeHead.apply(this, args);
  };
  handler(req, res);
});
// longer than a load balancer's idle timeout (often 60 s), so the server never closes a
// kept-alive connection the balancer is about to reuse (that shows as a dropped request)
server.keepAliveTimeout = 65_000;
server.headersTimeout = 66_000;

server.on('error', (err) => {
  log.fatal({ err: { message: err.message, code: err.code } }, 'cannot listen');
  process.exit(1);
});
server.listen(port, host, () => log.info({ host, port }, 'listening'));

async function runHooks() {
  const hooks = [...lifecycle.closers.values()].reverse();
  lifecycle.closers.clear();
  for (const close of hooks) await close().catch(() => undefined);
}

let stopping = false;
async function stop(signal) {
  if (stopping) {
    log.warn({ signal }, 'second signal: closing every connection now');
    server.closeAllConnections();
    return;
  }
  stopping = true;
  lifecycle.draining = true;
  log.info({ signal, inFlight: inFlight.size, graceMs }, 'draining');
  for (const res of inFlight) if (!res.headersSent) res.setHeader('connection', 'close');
  const closed = new Promise((resolve) => server.close(resolve));
  // a connection that finishes its last request goes idle: close it as soon as it does
  const sweep = setInterval(() => server.closeIdleConnections(), 50);
  const timer = setTimeout(() => {
    log.warn({ inFlight: inFlight.size }, 'grace period over: closing the remaining connections');
    server.closeAllConnections();
  }, graceMs);
  server.closeIdleConnections();
  await closed;
  clearInterval(sweep);
  clearTimeout(timer);
  await runHooks();
  log.info('stopped');
  process.exit(0);
}
process.on('SIGTERM', (s) => void stop(s));
process.on('SIGINT', (s) => void stop(s));
