import { useEffect, useRef, useState } from 'react';
import type { Plan } from '../../../shared/plan/plan-schema';
import type { TakeoffProduct, TakeoffSettings } from '../../../shared/takeoff/compute-takeoff';
import type { TakeoffRun } from './run-takeoff';

/** During a drag, plans whose takeoff takes longer than this wait for the drag to end. */
const LIVE_DURING_DRAG_MS = 40;

/**
 * The live takeoff of `plan`, computed in a Web Worker: at most one request in flight, and only
 * the newest plan is sent when it comes back, so a fast drag never queues stale work. While a
 * drag is in progress, a plan whose takeoff is slow (a very large loft) is recomputed when the
 * drag ends instead, so the worker does not compete with drawing for the CPU. Falls back to
 * computing in place where workers are missing (tests). `enabled: false` computes nothing (a
 * read-only viewer is shown the stored takeoff instead).
 */
export function useLiveTakeoff(
  plan: Plan,
  products: TakeoffProduct[],
  settings?: Partial<TakeoffSettings>,
  dragging = false,
  enabled = true,
): TakeoffRun | null {
  const [run, setRun] = useState<TakeoffRun | null>(null);
  const worker = useRef<Worker | null>(null);
  const busy = useRef(false);
  const pending = useRef<{ plan: Plan; products: TakeoffProduct[]; settings?: Partial<TakeoffSettings> } | null>(null);
  const seq = useRef(0);
  const last = useRef<{ plan: Plan; products: TakeoffProduct[]; settings?: Partial<TakeoffSettings> } | null>(null);

  useEffect(() => {
    if (typeof Worker === 'undefined') return;
    const w = new Worker(new URL('./takeoff.worker.ts', import.meta.url), { type: 'module' });
    worker.current = w;
    w.onmessage = (e: MessageEvent<{ id: number; run: TakeoffRun }>) => {
      busy.current = false;
      if (e.data.id === seq.current) setRun(e.data.run);
      const next = pending.current;
      pending.current = null;
      if (next) send(next);
    };
    w.onerror = () => {
      // A worker that cannot start (or crashed): compute in place from now on, starting with the newest plan.
      worker.current = null;
      busy.current = false;
      const latest = pending.current ?? last.current;
      pending.current = null;
      if (latest) send(latest);
    };
    return () => {
      w.terminate();
      worker.current = null;
      busy.current = false;
    };
  }, []);

  function send(input: { plan: Plan; products: TakeoffProduct[]; settings?: Partial<TakeoffSettings> }) {
    last.current = input;
    const id = ++seq.current;
    if (!worker.current) {
      // Loaded only here, so the editor chunk does not carry a second copy of the engine.
      void import('./run-takeoff').then(({ runTakeoff }) => {
        if (id === seq.current) setRun(runTakeoff(input));
      });
      return;
    }
    busy.current = true;
    worker.current.postMessage({ id, input });
  }

  const lastElapsed = useRef(0);
  useEffect(() => {
    if (run) lastElapsed.current = run.elapsedMs;
  }, [run]);

  useEffect(() => {
    if (!enabled) return;
    if (dragging && lastElapsed.current > LIVE_DURING_DRAG_MS) return;
    const input = { plan, products, settings };
    if (busy.current) pending.current = input;
    else send(input);
  }, [plan, products, settings, dragging, enabled]);

  return run;
}
