/**
 * CPU time of another process, for the fuzz watchdog (tests/fuzz/run.ts)
 * and the bench's capacity part (capacity.ts).
 */
import { readFileSync } from 'node:fs';

/**
 * CPU milliseconds (user + system) a process has used, from Linux /proc;
 * null when there is no such process or no /proc.
 */
export function processCpuMs(pid: number | null | undefined): number | null {
  if (pid === null || pid === undefined) return null;
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    // Fields 14 and 15 of stat (utime, stime), in clock ticks of 10 ms.
    return (Number(fields[11]) + Number(fields[12])) * 10;
  } catch {
    return null;
  }
}
