import type { Server } from 'node:http';
import type { AppDeps } from '../deps';

export interface ShutdownOptions {
  server: Server;
  deps: Pick<AppDeps, 'lifecycle' | 'logger' | 'close'>;
  /** Readiness reads 503 this long before the listener closes (the load balancer's reaction time). */
  graceMs: number;
  /** The longest wait for requests in flight once the listener is closed. */
  timeoutMs: number;
  exit: (code: number) => void;
}

const wait = (ms: number) => new Promise<void>((resolve) => setTimeout(resolve, ms));

/**
 * Graceful stop on SIGTERM/SIGINT: readiness turns 503 (and answers carry `Connection: close`), the
 * grace period passes, the listener closes, requests in flight finish (or are cut after the
 * timeout), then deps.close() stops the mail worker (the message being sent finishes; one cut off
 * stays queued and is retried by any instance) and the pools, and the process exits 0.
 */
export function createShutdown(opts: ShutdownOptions) {
  const { server, deps } = opts;
  const log = deps.logger;
  let inFlight = 0;
  server.on('request', (_req, res) => {
    inFlight++;
    res.once('close', () => inFlight--);
  });
  let stopping: Promise<void> | null = null;

  async function run(reason: string) {
    deps.lifecycle.draining = true;
    log.info({ reason, inFlight, graceMs: opts.graceMs }, 'shutting down: readiness now 503');
    if (opts.graceMs > 0) await wait(opts.graceMs);
    const closed = new Promise<void>((resolve) => server.close(() => resolve()));
    server.closeIdleConnections();
    let timer: NodeJS.Timeout | undefined;
    const outcome = await Promise.race([
      closed.then(() => 'drained' as const),
      new Promise<'timeout'>((resolve) => {
        timer = setTimeout(() => resolve('timeout'), opts.timeoutMs);
      }),
    ]);
    clearTimeout(timer);
    if (outcome === 'timeout') {
      log.warn({ inFlight }, `requests still running after ${opts.timeoutMs} ms: closing their connections`);
      server.closeAllConnections();
      await closed;
    }
    log.info('requests drained; stopping the mail worker and closing the database pools');
    await deps.close();
    log.info('stopped');
  }

  return {
    inFlight: () => inFlight,
    /**
     * Starts the stop once. A second signal changes nothing: a terminal's Ctrl-C reaches both
     * `npm start` and the server, and the launcher then sends SIGTERM as well.
     */
    stop(reason: string): Promise<void> {
      if (stopping) return stopping;
      // However stuck the drain or a pool is, the process ends.
      setTimeout(
        () => {
          log.error('shutdown did not finish in time: exiting');
          opts.exit(1);
        },
        opts.graceMs + opts.timeoutMs + 30_000,
      ).unref();
      stopping = run(reason).then(
        () => opts.exit(0),
        (err: unknown) => {
          log.error({ err }, 'shutdown failed');
          opts.exit(1);
        },
      );
      return stopping;
    },
  };
}
