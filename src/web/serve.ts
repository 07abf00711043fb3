/**
 * `npm start`: serve the app on 127.0.0.1, port from PORT (default 5173), opening on the demo study.
 * Structured request logs (pino, JSON lines); SIGTERM/SIGINT close the server gracefully: no new
 * connections, running requests finish, then exit (forced after 10 s).
 */
import { serve } from '@hono/node-server';
import pino from 'pino';
import { createApp } from './app.ts';

export const DEFAULT_PORT = 5173;
const HOST = '127.0.0.1';
const SHUTDOWN_GRACE_MS = 10_000;

const logger = pino({ level: process.env.LOG_LEVEL ?? 'info' });
const port = process.env.PORT === undefined ? DEFAULT_PORT : Number(process.env.PORT);
if (!Number.isInteger(port) || port < 0 || port > 65535) {
  logger.fatal({ port: process.env.PORT }, 'PORT must be an integer from 0 to 65535');
  process.exit(2);
}

const app = createApp({ logger });
const server = serve({ fetch: app.fetch, hostname: HOST, port }, (info) => {
  logger.info({ url: `http://${HOST}:${info.port}/` }, 'Straddle is listening; the demo study is at /');
});

let closing = false;
function shutdown(signal: string): void {
  if (closing) return;
  closing = true;
  logger.info({ signal }, 'shutting down');
  const force = setTimeout(() => {
    logger.warn('forced exit after the grace period');
    process.exit(1);
  }, SHUTDOWN_GRACE_MS);
  force.unref();
  server.close((error) => {
    if (error) logger.error({ err: error }, 'error while closing');
    process.exit(error ? 1 : 0);
  });
  // Idle keep-alive connections would hold close() open until they time out.
  (server as { closeIdleConnections?: () => void }).closeIdleConnections?.();
}
process.on('SIGTERM', () => shutdown('SIGTERM'));
process.on('SIGINT', () => shutdown('SIGINT'));
