import os from 'node:os';
import { Piscina } from 'piscina';
import { checkPlanCounts } from '../../../shared/plan/plan-limits';
import type { PlanTask, PlanTaskResult } from './plan-task';

export type { PlanTask, PlanTaskResult } from './plan-task';

/** Raised when a computation passes the pool's time limit; its worker was stopped. */
export class PlanTimeoutError extends Error {
  constructor(readonly limitMs: number) {
    super(`the plan took longer than ${limitMs / 1000} s to work out and was stopped`);
    this.name = 'PlanTimeoutError';
  }
}

/** Raised when every worker is busy and the queue is full. */
export class PlanPoolBusyError extends Error {
  constructor() {
    super('the takeoff workers are busy; try again in a moment');
    this.name = 'PlanPoolBusyError';
  }
}

export interface PlanPool {
  /** Runs the task in a worker thread; rejects with PlanTimeoutError past the limit. */
  run(task: PlanTask): Promise<PlanTaskResult>;
  close(): Promise<void>;
}

export interface PlanPoolOptions {
  /** Worker threads (default: one fewer than the CPUs, at least 1, at most 4). */
  threads?: number;
  /** Time limit per task, ms. */
  timeLimitMs?: number;
  /** Tasks waiting beyond the running ones before new ones are refused. */
  maxQueue?: number;
}

/**
 * A small pool of worker threads (piscina) for plan validation and takeoffs, so a heavy plan never
 * blocks the request thread: other requests are answered meanwhile. Each task has a time limit;
 * past it the worker running it is terminated (piscina aborts a running task that way) and
 * replaced. Oversized plans are refused by counting before they are even sent to a worker.
 * Workers also get a heap limit, so a plan cannot exhaust the server's memory.
 */
export function createPlanPool(opts: PlanPoolOptions = {}): PlanPool {
  const threads = opts.threads ?? Math.max(1, Math.min(4, os.availableParallelism() - 1));
  const timeLimitMs = opts.timeLimitMs ?? 10_000;
  const piscina = new Piscina<PlanTask, PlanTaskResult>({
    filename: new URL('./plan-worker.mjs', import.meta.url).href,
    minThreads: 0,
    maxThreads: threads,
    idleTimeout: 60_000,
    maxQueue: opts.maxQueue ?? 50,
    resourceLimits: { maxOldGenerationSizeMb: 512 },
  });
  // A worker takes a moment to start (tsx compiles the engine); that is not the plan's time. The
  // first task, and the first after a worker was stopped, waits for a trivial task to come back.
  let ready: Promise<unknown> | null = null;
  const warmUp = () => (ready ??= piscina.run({ kind: 'validate', plan: null }).catch(() => undefined));
  return {
    async run(task) {
      const tooBig = checkPlanCounts(task.plan);
      if (tooBig.length) return { ok: false, errors: tooBig };
      await warmUp();
      const signal = AbortSignal.timeout(timeLimitMs);
      try {
        return await piscina.run(task, { signal });
      } catch (e) {
        if (signal.aborted) {
          ready = null;
          throw new PlanTimeoutError(timeLimitMs);
        }
        if (e instanceof Error && /queue is at limit/i.test(e.message)) throw new PlanPoolBusyError();
        throw e;
      }
    },
    async close() {
      await piscina.destroy();
    },
  };
}
