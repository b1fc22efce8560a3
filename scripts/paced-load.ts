// An open-loop load at an even pace, for the serving bench's fixed rates. autocannon's rates are not
// that: each connection sends its share of a second's requests back to back as the second starts
// and then waits, so every target sees a burst of `rate` requests at once each second, and its
// correction for coordinated omission takes the expected interval as ceil(1 / rate) ms = 1 ms, which
// fills the histogram with made-up samples behind every slow answer. Here request i is due at
// start + i / rate, is sent then (round-robin over the URLs, on at most `connections` keep-alive
// sockets) and its latency is counted from when it was due, so a late send or a full pool of
// sockets counts against the target, as it would for a user.
import http from 'node:http';
import { performance } from 'node:perf_hooks';

export interface PacedResult {
  rps: number;
  p50: number;
  p99: number;
  /** Answers other than 2xx, errors and timeouts. */
  bad: number;
  total: number;
}

const percentile = (sorted: number[], p: number) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)] : 0);

export async function pacedLoad(opts: {
  urls: string[];
  headers: Record<string, string>;
  rate: number;
  seconds: number;
  connections: number;
}): Promise<PacedResult> {
  const agent = new http.Agent({ keepAlive: true, maxSockets: Math.max(1, Math.ceil(opts.connections / opts.urls.length)) });
  const total = Math.round(opts.rate * opts.seconds);
  const interval = 1000 / opts.rate;
  const latencies: number[] = [];
  let bad = 0;
  let done = 0;
  let lastEnd = 0;
  const start = performance.now() + 5;
  await new Promise<void>((resolve) => {
    const finish = (due: number, ok: boolean) => {
      lastEnd = performance.now();
      if (ok) latencies.push(lastEnd - due);
      else bad++;
      if (++done === total) resolve();
    };
    const send = (i: number) => {
      const due = start + i * interval;
      // A request that fails mid-answer can report on both the response and the request: count it once.
      let counted = false;
      const once = (ok: boolean) => {
        if (counted) return;
        counted = true;
        finish(due, ok);
      };
      const req = http.get(opts.urls[i % opts.urls.length], { agent, headers: opts.headers, timeout: 10_000 }, (res) => {
        res.on('data', () => {});
        res.on('end', () => once(res.statusCode! >= 200 && res.statusCode! < 300));
        res.on('error', () => once(false));
      });
      req.on('timeout', () => req.destroy(new Error('timeout')));
      req.on('error', () => once(false));
    };
    let sent = 0;
    const tick = () => {
      const now = performance.now();
      while (sent < total && start + sent * interval <= now) send(sent++);
      if (sent < total) setTimeout(tick, Math.max(0, start + sent * interval - performance.now()));
    };
    setTimeout(tick, 5);
  });
  agent.destroy();
  latencies.sort((a, b) => a - b);
  const round = (ms: number) => Math.round(ms * 10) / 10;
  return { rps: done / ((lastEnd - start) / 1000), p50: round(percentile(latencies, 50)), p99: round(percentile(latencies, 99)), bad, total };
}
