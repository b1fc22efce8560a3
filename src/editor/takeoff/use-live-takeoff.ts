import { useEffect, useRef, useState } from 'react';
import type { Plan } from '../../../shared/plan/plan-schema';
import type { TakeoffProduct, TakeoffSettings } from '../../../shared/takeoff/compute-takeoff';
import { runTakeoff, type TakeoffRun } from './run-takeoff';

/**
 * The live takeoff of `plan`, computed in a Web Worker: at most one request in flight, and only
 * the newest plan is sent when it comes back, so a fast drag never queues stale work. Falls back
 * to computing in place where workers are missing (tests).
 */
export function useLiveTakeoff(plan: Plan, products: TakeoffProduct[], settings?: Partial<TakeoffSettings>): TakeoffRun | null {
  const [run, setRun] = useState<TakeoffRun | null>(null);
  const worker = useRef<Worker | null>(null);
  const busy = useRef(false);
  const pending = useRef<{ plan: Plan; products: TakeoffProduct[]; settings?: Partial<TakeoffSettings> } | null>(null);
  const seq = useRef(0);

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
      worker.current = null;
      busy.current = false;
    };
    return () => {
      w.terminate();
      worker.current = null;
      busy.current = false;
    };
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  function send(input: { plan: Plan; products: TakeoffProduct[]; settings?: Partial<TakeoffSettings> }) {
    const id = ++seq.current;
    if (!worker.current) {
      setRun(runTakeoff(input));
      return;
    }
    busy.current = true;
    worker.current.postMessage({ id, input });
  }

  useEffect(() => {
    const input = { plan, products, settings };
    if (busy.current) pending.current = input;
    else send(input);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [plan, products, settings]);

  return run;
}
