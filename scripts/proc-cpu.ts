// CPU time of processes read from /proc (Linux), for the serving bench's CPU per request.
import fs from 'node:fs';
import path from 'node:path';
import { pgConfig } from './pg.mjs';

// utime + stime of a process in clock ticks (fields 14 and 15 of /proc/<pid>/stat, 16 and 17 for its
// reaped children; Linux counts 100 a second).
export const TICKS_PER_SECOND = 100;
function statFields(pid: number | string): string[] {
  const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
  return stat.slice(stat.lastIndexOf(')') + 2).split(' ');
}
export function cpuTicks(pid: number): number {
  const fields = statFields(pid);
  return Number(fields[11]) + Number(fields[12]);
}

/**
 * CPU ticks of the project cluster: its postmaster, every process it runs now (backends, background
 * workers) and those that ended (their time is added to the postmaster's children's time when it reaps them).
 */
export function clusterTicks(): number {
  const postmaster = Number(fs.readFileSync(path.join(pgConfig().dataDir, 'postmaster.pid'), 'utf8').split('\n')[0]);
  const own = statFields(postmaster);
  let ticks = Number(own[11]) + Number(own[12]) + Number(own[13]) + Number(own[14]);
  for (const entry of fs.readdirSync('/proc')) {
    if (!/^\d+$/.test(entry)) continue;
    try {
      const fields = statFields(entry);
      if (Number(fields[1]) === postmaster) ticks += Number(fields[11]) + Number(fields[12]);
    } catch {
      // the process ended meanwhile
    }
  }
  return ticks;
}
