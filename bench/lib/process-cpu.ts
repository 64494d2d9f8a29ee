/**
 * Which process serves a port, and how much CPU it has used: for figures that hold up on a busy
 * machine (CPU time per request does not depend on what else shares the cores; throughput does).
 */
import { execFileSync } from 'node:child_process';
import { readFileSync } from 'node:fs';

/** The pid listening on `port` on this machine (ss from iproute2). */
export function pidOn(port: number | string): number {
  const pid = /pid=(\d+)/.exec(execFileSync('ss', ['-Hltnp', `sport = :${port}`], { encoding: 'utf8' }))?.[1];
  if (!pid) throw new Error(`no process found listening on port ${port}`);
  return Number(pid);
}

const TICKS_PER_SECOND = Number(execFileSync('getconf', ['CLK_TCK'], { encoding: 'utf8' }).trim());

/** CPU seconds the processes have used, all their threads: utime + stime of /proc/<pid>/stat (proc(5)). */
export function cpuSeconds(pids: readonly number[]): number {
  return pids.reduce((sum, pid) => {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    return sum + (Number(fields[11]) + Number(fields[12])) / TICKS_PER_SECOND;
  }, 0);
}
