// The serving bench's rows: medians of rounds and the table printed at the end.
import { median } from '../shared/reports/suggestions';

/** Each figure the median of the rounds' (failures: their sum). */
export function medianOf(runs: Array<Omit<Row, 'instances' | 'target'>>): Omit<Row, 'instances' | 'target'> {
  return {
    rate: runs[0].rate,
    rps: median(runs.map((r) => r.rps)),
    p50: median(runs.map((r) => r.p50)),
    p99: median(runs.map((r) => r.p99)),
    bad: runs.reduce((n, r) => n + r.bad, 0),
    load: median(runs.map((r) => r.load)),
    cpuUs: median(runs.map((r) => r.cpuUs)),
    dbCpuUs: median(runs.map((r) => r.dbCpuUs)),
  };
}

export interface Row {
  instances: number;
  target: string;
  rate: number | null;
  rps: number;
  p50: number;
  p99: number;
  bad: number;
  /** The 1-minute load average as the run started. */
  load: number;
  /** CPU time of the answering Node processes per request (user + system; PostgreSQL's not counted). */
  cpuUs: number;
  /** CPU time of the PostgreSQL cluster per request (every process of it, so also other instances' polling). */
  dbCpuUs: number;
}

export function printTable(rows: Row[]) {
  const bare = (r: Row) => rows.find((b) => b.target === 'bare handler' && b.instances === r.instances && b.rate === r.rate)!;
  const lines = [
    '| instances | target | rate | req/s | p50 ms | p99 ms | failed | req/s ÷ bare | p99 ÷ bare | node CPU µs/req | PostgreSQL CPU µs/req | load |',
    '|---|---|---|---|---|---|---|---|---|---|---|---|',
    ...rows.map((r) => {
      const b = bare(r);
      const ratio = (b.rps ? r.rps / b.rps : 0).toFixed(2);
      const p99 = (b.p99 ? r.p99 / b.p99 : 0).toFixed(1);
      return `| ${r.instances} | ${r.target} | ${r.rate ?? 'max'} | ${r.rps.toFixed(0)} | ${r.p50} | ${r.p99} | ${r.bad} | ${ratio} | ${p99} | ${r.cpuUs.toFixed(0)} | ${r.dbCpuUs.toFixed(0)} | ${r.load.toFixed(1)} |`;
    }),
  ];
  console.log(`\n${lines.join('\n')}`);
}
