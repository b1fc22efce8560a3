/// <reference lib="webworker" />
import { runTakeoff, type TakeoffInput } from './run-takeoff';

// The takeoff runs here so a drag on the canvas never waits for it.
self.onmessage = (e: MessageEvent<{ id: number; input: TakeoffInput }>) => {
  const { id, input } = e.data;
  (self as unknown as Worker).postMessage({ id, run: runTakeoff(input) });
};
