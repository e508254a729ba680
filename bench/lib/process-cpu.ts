/**
 * CPU time by process tree, read from Linux's /proc, so the load bench can say what a request
 * really costs (the app's CPU milliseconds per answered request), how much of the machine the
 * load generator itself took, and what else was running beside it. On a machine without /proc
 * every reading is zero and the report says "n/a".
 *
 *   const before = cpuSnapshot();  …load…  const after = cpuSnapshot();
 *   treeCpuMs(before, after, appPid)   // CPU ms the app server and its children used meanwhile
 */
import { readdirSync, readFileSync } from "node:fs";

interface ProcEntry {
  pid: number;
  ppid: number;
  name: string;
  /** User + system CPU of the process itself, in clock ticks. */
  self: number;
  /**
   * `self` plus its children that ended and were waited for: a job process that lived two seconds
   * between two snapshots still counts, in its parent's total.
   */
  ticks: number;
}

export interface CpuSnapshot {
  at: number;
  /** Busy ticks of the whole machine (all cores) since boot, from /proc/stat. */
  machineBusy: number;
  machineTotal: number;
  processes: Map<number, ProcEntry>;
}

/** Linux's USER_HZ: /proc reports CPU time in these ticks; 100 on every common kernel. */
const TICKS_PER_SECOND = 100;

function readProc(pid: number): ProcEntry | undefined {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, "utf8");
    // The command name is in parentheses and may itself contain spaces or parentheses.
    const close = stat.lastIndexOf(")");
    const name = stat.slice(stat.indexOf("(") + 1, close);
    const fields = stat.slice(close + 2).split(" ");
    // Fields after the name, 0-based: 1 = ppid, 11 = utime, 12 = stime, 13 = cutime, 14 = cstime.
    const self = Number(fields[11]) + Number(fields[12]);
    return { pid, ppid: Number(fields[1]), name, self, ticks: self + Number(fields[13]) + Number(fields[14]) };
  } catch {
    return undefined;
  }
}

export function cpuSnapshot(): CpuSnapshot {
  const processes = new Map<number, ProcEntry>();
  let machineBusy = 0;
  let machineTotal = 0;
  try {
    for (const entry of readdirSync("/proc")) {
      if (!/^\d+$/.test(entry)) continue;
      const p = readProc(Number(entry));
      if (p) processes.set(p.pid, p);
    }
    const cpu = readFileSync("/proc/stat", "utf8").split("\n")[0]!.trim().split(/\s+/).slice(1).map(Number);
    // user nice system idle iowait irq softirq steal: idle and iowait are not busy.
    machineTotal = cpu.slice(0, 8).reduce((a, b) => a + b, 0);
    machineBusy = machineTotal - cpu[3]! - cpu[4]!;
  } catch {
    // No /proc: all zero.
  }
  return { at: performance.now(), machineBusy, machineTotal, processes };
}

function descendants(snapshot: CpuSnapshot, root: number): Set<number> {
  const out = new Set<number>([root]);
  let grew = true;
  while (grew) {
    grew = false;
    for (const p of snapshot.processes.values()) {
      if (!out.has(p.pid) && out.has(p.ppid)) {
        out.add(p.pid);
        grew = true;
      }
    }
  }
  return out;
}

/**
 * CPU milliseconds the tree under `root` used between the snapshots, children that came and went
 * in between included (in their parent's waited-for time).
 */
export function treeCpuMs(before: CpuSnapshot, after: CpuSnapshot, root: number): number {
  let ticks = 0;
  const now = descendants(after, root);
  for (const pid of now) {
    const a = after.processes.get(pid)!;
    const b = before.processes.get(pid);
    // A pid reused in between would show as a new process: count only its current run.
    ticks += b && b.name === a.name ? a.ticks - b.ticks : a.ticks;
  }
  // A descendant alive at the first snapshot and gone by the second lands whole in its parent's
  // waited-for time; what it had used before the first snapshot is not this phase's.
  for (const pid of descendants(before, root)) if (!now.has(pid)) ticks -= before.processes.get(pid)!.ticks;
  return (Math.max(0, ticks) * 1000) / TICKS_PER_SECOND;
}

/** The whole machine's busy CPU milliseconds (all cores) between the snapshots. */
export function machineCpuMs(before: CpuSnapshot, after: CpuSnapshot): number {
  const total = after.machineTotal - before.machineTotal;
  if (total <= 0) return 0;
  const wallMs = after.at - before.at;
  const cores = Math.max(1, Math.round(total / ((wallMs / 1000) * TICKS_PER_SECOND)));
  return ((after.machineBusy - before.machineBusy) / total) * wallMs * cores;
}

/** The `limit` busiest processes outside `ours` (their command names and CPU ms), for "running beside". */
export function busiestOthers(before: CpuSnapshot, after: CpuSnapshot, ours: readonly number[], limit = 3): { name: string; ms: number }[] {
  const excluded = new Set<number>();
  for (const root of ours) for (const pid of descendants(after, root)) excluded.add(pid);
  const byName = new Map<string, number>();
  for (const now of after.processes.values()) {
    if (excluded.has(now.pid)) continue;
    // Own time only: a shell's waited-for children (a test run it started) are not the shell.
    const then = before.processes.get(now.pid);
    const ticks = then && then.name === now.name ? now.self - then.self : 0;
    if (ticks > 0) byName.set(now.name, (byName.get(now.name) ?? 0) + ticks);
  }
  return [...byName]
    .map(([name, ticks]) => ({ name, ms: (ticks * 1000) / TICKS_PER_SECOND }))
    .sort((a, b) => b.ms - a.ms)
    .slice(0, limit);
}
