// Listens and shuts down gracefully: stop accepting, finish in-flight requests, stop the import
// workers, close the database.
import type { Server } from 'node:http';
import type { Express } from 'express';
import type { Logger } from 'pino';
import type { AppContext } from './context.ts';
import type { Db } from './db/knex.ts';

export interface RunningServer {
  server: Server;
  url: string;
  stop(): Promise<void>;
}

/** An address to reach a server bound to `host` from this machine: a wildcard bind is reached on loopback. */
function reachableHost(host: string): string {
  if (host === '0.0.0.0') return '127.0.0.1';
  if (host === '::') return '[::1]';
  return host.includes(':') ? `[${host}]` : host;
}

/** Listens on `host` (loopback unless told otherwise) and `port` (0: any free port); `url` is where it answers. */
export async function listen(
  app: Express,
  db: Db,
  logger: Logger,
  port: number,
  onStop?: () => Promise<void>,
  host = '127.0.0.1',
): Promise<RunningServer> {
  const server = await new Promise<Server>((resolve, reject) => {
    const s = app.listen(port, host, (error?: Error) => (error ? reject(error) : resolve(s)));
  });
  const address = server.address();
  const boundPort = typeof address === 'object' && address ? address.port : port;
  let stopping: Promise<void> | undefined;
  const stop = () =>
    (stopping ??= (async () => {
      logger.info('shutting down: finishing in-flight requests');
      await new Promise<void>((resolve) => {
        // Connections whose response has just finished become idle: close them as they do.
        const sweep = setInterval(() => server.closeIdleConnections(), 100);
        // Keep-alive clients that never go idle must not hold the shutdown forever.
        const deadline = setTimeout(() => server.closeAllConnections(), 10_000);
        server.close(() => {
          clearInterval(sweep);
          clearTimeout(deadline);
          resolve();
        });
        server.closeIdleConnections();
      });
      await onStop?.();
      await (app.locals.ctx as AppContext | undefined)?.importWorkers.close();
      await db.destroy();
      logger.info('stopped');
    })());
  return { server, url: `http://${reachableHost(host)}:${boundPort}`, stop };
}

export function stopOnSignals(running: RunningServer, logger: Logger): void {
  const handle = (signal: NodeJS.Signals) => {
    logger.info({ signal }, 'signal received');
    running.stop().then(
      () => process.exit(0),
      (error: unknown) => {
        logger.error({ err: error }, 'shutdown failed');
        process.exit(1);
      },
    );
  };
  process.once('SIGINT', handle);
  process.once('SIGTERM', handle);
}
