/**
 * What a benchmark's processes cost, read from /proc (Linux): resident memory,
 * and CPU time (user + system) of a process or of a PostgreSQL cluster — its
 * postmaster and every backend — so a run can report CPU per request next to
 * latency. CPU per request moves far less with a busy machine than latency does.
 */
import fs from 'node:fs';

const ticksPerMs = 100 / 1000; // USER_HZ is 100 on Linux

export function rssOf(pid: number): number {
  const status = fs.readFileSync(`/proc/${pid}/status`, 'utf8');
  return Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? 0) / 1024;
}

function stat(pid: number): { ppid: number; ticks: number } | undefined {
  try {
    const s = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
    // The command name may hold spaces: fields are counted after its closing bracket.
    const f = s.slice(s.lastIndexOf(')') + 2).split(' ');
    return { ppid: Number(f[1]), ticks: Number(f[11]) + Number(f[12]) };
  } catch {
    return undefined; // exited
  }
}

/** CPU milliseconds used so far by the processes. */
export function cpuMsOf(pids: number[]): number {
  return pids.reduce((ms, pid) => ms + (stat(pid)?.ticks ?? 0) / ticksPerMs, 0);
}

/** The postmaster listening on `port` and its children (backends and workers), now. */
export function clusterPids(port: number): number[] {
  const all = fs
    .readdirSync('/proc')
    .filter((d) => /^\d+$/.test(d))
    .map(Number);
  const postmaster = all.find((pid) => {
    try {
      const cmd = fs.readFileSync(`/proc/${pid}/cmdline`, 'utf8').split('\0');
      return cmd.some((a) => a.endsWith('postgres')) && cmd.join(' ').includes(`-p ${port}`);
    } catch {
      return false;
    }
  });
  if (postmaster === undefined) return [];
  return [postmaster, ...all.filter((pid) => stat(pid)?.ppid === postmaster)];
}
