/**
 * Reads a V8 CPU profile (.cpuprofile) and says where the time went: self time by package (the
 * node_modules folder a function lives in, "app" for our own code, "node" for Node's internals,
 * "(gc)", "(idle)"…) and the functions with the most self time. For `bench --load --profile`.
 */
import { readFileSync } from "node:fs";

interface ProfileNode {
  id: number;
  callFrame: { functionName: string; url: string; lineNumber: number };
  children?: number[];
}

interface CpuProfile {
  nodes: ProfileNode[];
  startTime: number;
  endTime: number;
  samples: number[];
  timeDeltas: number[];
}

export interface ProfileSummary {
  totalMs: number;
  /** Not idle and not the program waiting: what the process computed. */
  busyMs: number;
  byPackage: { name: string; ms: number; percentOfBusy: number }[];
  topFunctions: { name: string; where: string; ms: number; percentOfBusy: number }[];
}

function packageOf(url: string, functionName: string): string {
  if (url === "") return functionName.startsWith("(") ? functionName : "(native)";
  if (url.startsWith("node:")) return "node";
  const nm = url.lastIndexOf("node_modules/");
  if (nm >= 0) {
    const rest = url.slice(nm + "node_modules/".length).split("/");
    return rest[0]!.startsWith("@") ? `${rest[0]}/${rest[1]}` : rest[0]!;
  }
  if (url.includes("/build/") || url.includes("/builds/")) return "app (server build)";
  return "app";
}

/** `lastMs`: only the samples of the profile's last `lastMs` milliseconds (the load, not the start-up). */
export function summariseProfile(file: string, top = 15, lastMs = Number.POSITIVE_INFINITY): ProfileSummary & { inclusive: { name: string; ms: number; percentOfBusy: number }[] } {
  const profile = JSON.parse(readFileSync(file, "utf8")) as CpuProfile;
  const byId = new Map(profile.nodes.map((n) => [n.id, n]));
  const parent = new Map<number, number>();
  for (const n of profile.nodes) for (const c of n.children ?? []) parent.set(c, n.id);
  const selfUs = new Map<number, number>();
  const from = profile.endTime - lastMs * 1000;
  let t = profile.startTime;
  for (let i = 0; i < profile.samples.length; i++) {
    t += profile.timeDeltas[i] ?? 0;
    if (t < from) continue;
    // The delta before sample i+1 is the time sample i stood for.
    const dt = profile.timeDeltas[i + 1] ?? 0;
    selfUs.set(profile.samples[i]!, (selfUs.get(profile.samples[i]!) ?? 0) + dt);
  }
  // Inclusive time by function name (each name counted once per stack).
  const inclusiveUs = new Map<string, number>();
  for (const [id, us] of selfUs) {
    const seen = new Set<string>();
    for (let n: number | undefined = id; n !== undefined; n = parent.get(n)) {
      const f = byId.get(n)!.callFrame;
      const name = `${f.functionName || "(anonymous)"} [${packageOf(f.url, f.functionName)}]`;
      if (seen.has(name)) continue;
      seen.add(name);
      inclusiveUs.set(name, (inclusiveUs.get(name) ?? 0) + us);
    }
  }
  const pkg = new Map<string, number>();
  const fn = new Map<string, { where: string; us: number }>();
  let idle = 0;
  let total = 0;
  for (const [id, us] of selfUs) {
    const node = byId.get(id)!;
    const { functionName, url, lineNumber } = node.callFrame;
    total += us;
    if (functionName === "(idle)" || functionName === "(program)") {
      idle += us;
      continue;
    }
    const p = packageOf(url, functionName);
    pkg.set(p, (pkg.get(p) ?? 0) + us);
    const key = `${functionName || "(anonymous)"} ${url}:${lineNumber}`;
    const entry = fn.get(key) ?? { where: `${p} ${url.split("/").slice(-2).join("/")}:${lineNumber + 1}`, us: 0 };
    entry.us += us;
    fn.set(key, entry);
  }
  const busy = total - idle;
  const pct = (us: number) => Math.round((us / Math.max(1, busy)) * 1000) / 10;
  return {
    totalMs: Math.round(total / 1000),
    busyMs: Math.round(busy / 1000),
    byPackage: [...pkg].sort((a, b) => b[1] - a[1]).slice(0, top).map(([name, us]) => ({ name, ms: Math.round(us / 1000), percentOfBusy: pct(us) })),
    topFunctions: [...fn]
      .sort((a, b) => b[1].us - a[1].us)
      .slice(0, top)
      .map(([key, e]) => ({ name: key.split(" ")[0]!, where: e.where, ms: Math.round(e.us / 1000), percentOfBusy: pct(e.us) })),
    inclusive: [...inclusiveUs]
      .filter(([name]) => !name.startsWith("(root)") && !name.startsWith("(idle)") && !name.startsWith("(program)"))
      .sort((a, b) => b[1] - a[1])
      .slice(0, top * 4)
      .map(([name, us]) => ({ name, ms: Math.round(us / 1000), percentOfBusy: pct(us) })),
  };
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const last = process.env.LAST_MS ? Number(process.env.LAST_MS) : Number.POSITIVE_INFINITY;
  for (const file of process.argv.slice(2)) {
    const s = summariseProfile(file, 25, last);
    console.log(`${file}: ${s.totalMs} ms profiled, ${s.busyMs} ms busy`);
    for (const p of s.byPackage) console.log(`  ${p.percentOfBusy.toFixed(1).padStart(5)} %  ${String(p.ms).padStart(6)} ms  ${p.name}`);
    console.log("  top functions (self time):");
    for (const f of s.topFunctions) console.log(`  ${f.percentOfBusy.toFixed(1).padStart(5)} %  ${String(f.ms).padStart(6)} ms  ${f.name}  (${f.where})`);
    if (process.env.INCLUSIVE) {
      console.log("  inclusive:");
      for (const f of s.inclusive) console.log(`  ${f.percentOfBusy.toFixed(1).padStart(5)} %  ${String(f.ms).padStart(6)} ms  ${f.name}`);
    }
  }
}
