/**
 * `npm run bench`: times our CLI, SymPy and Singular on the standard systems, whole process
 * against whole process, interleaved, and checks that they print the same reduced basis.
 * See bench/README.md for what is measured and how to read the tables.
 */
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { cpus, loadavg, tmpdir } from "node:os";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { measureSystem, type SystemResult } from "./lib/measure";
import { BenchOptionError, parseBenchOptions, USAGE } from "./lib/options";
import { runProcess } from "./lib/process";
import { cpuTable, wallTable } from "./lib/report";
import { formatSystemFile, parseSystemFile, type SystemFile } from "./lib/system-file";
import { selectSystems, standardSystems, type BenchSystem } from "./lib/systems";
import { formatTiming } from "./lib/table";
import { oursStart, oursTool, singularTool, sympyTool } from "./lib/tools";
import { measureAnalyseTarget, targetTable } from "./lib/analyse-target";
import { phosphorylationTwoSiteSymbolicNetwork } from "./lib/systems";

const root = join(dirname(fileURLToPath(import.meta.url)), "..");

function readSystem(s: BenchSystem): SystemFile {
  const path = join(root, "bench", "systems", `${s.name}.txt`);
  if (!existsSync(path)) throw new Error(`bench/systems/${s.name}.txt missing: run npx tsx bench/generate-systems.ts`);
  const text = readFileSync(path, "utf8");
  if (text !== formatSystemFile(s.file)) console.warn(`warning: bench/systems/${s.name}.txt differs from the generator's output`);
  return parseSystemFile(text);
}

async function main(): Promise<number> {
  // `--truth` has options of its own (bench/truth.ts).
  if (process.argv.includes("--truth")) return (await import("./truth")).runTruth(process.argv.slice(2));
  if (process.argv.includes("--nsite")) return (await import("./nsite")).runNSite(process.argv.slice(2), root);
  if (process.argv.includes("--load")) return (await import("./load")).runLoad(process.argv.slice(2), root);
  if (process.argv.includes("--workers")) return (await import("./lib/distributed")).runDistributed(process.argv.slice(2), root);
  const o = parseBenchOptions(process.argv.slice(2));
  if (o.help) {
    console.log(USAGE);
    return 0;
  }
  if (o.analyse) return analyseTarget(o);
  const tools = [oursTool(root, o.launcher), sympyTool(root), singularTool(root)].filter((t) => o.tools.includes(t.id));
  const systems = selectSystems(standardSystems(), o.only, o.quick);
  const cores = cpus().length;
  console.log(`machine: ${cores} cores, ${cpus()[0]?.model ?? "unknown CPU"}; field: ${o.prime === undefined ? "Q" : `Z/${o.prime}`}`);
  for (const t of tools) console.log(`  ${t.label}: ${t.unavailable ? `n/a — ${t.unavailable}` : t.version}`);
  const loadBefore = loadavg()[0];
  console.log(`load average (1 min) at start: ${loadBefore.toFixed(2)}`);
  console.log(`repeat ${o.repeat} (runs over ${o.long} s not repeated), timeout ${o.timeout} s, ${systems.length} systems\n`);

  const scratch = mkdtempSync(join(tmpdir(), "stillpoint-bench-"));
  const results: SystemResult[] = [];
  try {
    // One untimed run per program first, so our CLI's bundle is built (scripts/cli.mjs), tsx's
    // transform cache and Python's bytecode are warm before any timing.
    const warm = standardSystems()[0];
    for (const t of tools.filter((t) => !t.unavailable)) {
      const inv = t.invocation(`bench/systems/${warm.name}.txt`, readSystem(warm), scratch, o.prime);
      await runProcess(inv.command, inv.args, o.timeout, root);
    }
    for (const [i, s] of systems.entries()) {
      const r = await measureSystem(s.name, readSystem(s), i, tools, o, root, scratch);
      results.push(r);
      const parts = tools.map((t) => `${t.label} ${formatTiming(r.tools[t.id]!, o.timeout)}`);
      console.log(`${r.name} (${r.order}): ${parts.join(" | ")} | bases ${r.agreement.status}`);
      for (const d of r.agreement.details) console.log(`  !!! ${d}`);
    }
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }
  const loadAfter = loadavg()[0];

  console.log(`\nWall clock, median seconds per whole process:\n${wallTable(results, o.repeat, o.timeout)}\n`);
  console.log(`CPU time (user + system, median) and peak memory:\n${cpuTable(results, o.timeout)}\n`);
  console.log("ratios are ours / reference: below 1 means ours is faster; '<' and '>' are bounds from a timeout.");
  if (Math.max(loadBefore, loadAfter) > cores)
    console.log(`note: load average ${loadBefore.toFixed(1)} → ${loadAfter.toFixed(1)} exceeds the ${cores} cores: other jobs shared the machine, wall times are inflated.`);
  for (const r of results)
    for (const [id, t] of Object.entries(r.tools)) if (t?.status === "error") console.log(`error: ${r.name}: ${id} failed: ${t.message}`);
  const disagreements = results.filter((r) => r.agreement.status === "disagree");
  if (disagreements.length > 0) console.log(`\n!!! BASES DIFFER on ${disagreements.map((r) => r.name).join(", ")} — see the !!! lines above.`);

  const resultsDir = join(root, "bench", "results");
  mkdirSync(resultsDir, { recursive: true });
  const json = {
    generatedAt: new Date().toISOString(),
    machine: { cores, cpu: cpus()[0]?.model ?? "unknown", node: process.version, loadAverage: { start: loadBefore, end: loadAfter } },
    programs: Object.fromEntries(tools.map((t) => [t.id, t.unavailable ? { unavailable: t.unavailable } : { version: t.version }])),
    options: { ...o, prime: o.prime?.toString() },
    systems: results,
  };
  writeFileSync(join(resultsDir, "latest.json"), JSON.stringify(json, null, 2) + "\n");
  console.log(`\nwritten: bench/results/latest.json (${results.length} systems)`);
  return disagreements.length > 0 ? 1 : 0;
}

/** `--analyse`: the issue-4 target, parametrisation (ours) against brute force (Singular). */
async function analyseTarget(o: ReturnType<typeof parseBenchOptions>): Promise<number> {
  const network = phosphorylationTwoSiteSymbolicNetwork();
  const system = readSystem(standardSystems().find((s) => s.name === network.name)!);
  const singular = singularTool(root);
  const ours = oursTool(root, o.launcher);
  console.log(`issue-4 target: ${network.name} (${network.reactions.length} reactions, ${network.rates.length} symbolic rate constants); timeout ${o.timeout} s, repeat ${o.repeat}`);
  console.log(`  ours: ${ours.unavailable ?? ours.version}\n  Singular: ${singular.unavailable ?? singular.version}`);
  console.log(`load average (1 min) at start: ${loadavg()[0].toFixed(2)}\n`);
  const scratch = mkdtempSync(join(tmpdir(), "stillpoint-bench-"));
  try {
    const rows = await measureAnalyseTarget(
      network, system,
      o.tools.includes("ours") && !ours.unavailable ? oursStart(root, o.launcher) : undefined,
      o.tools.includes("singular") ? singular : { ...singular, unavailable: "not selected" },
      o.repeat, o.timeout, root, scratch,
    );
    console.log(`Whole process, wall clock and CPU (user + system) seconds:\n${targetTable(rows, o.timeout)}`);
    console.log(`load average (1 min) at end: ${loadavg()[0].toFixed(2)}`);
    return rows.some((r) => r.program === "ours" && !r.ok) ? 1 : 0;
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }
}

main().then(
  (code) => process.exit(code),
  (e: unknown) => {
    // Option mistakes and unknown system names are the user's to fix: message only, no stack.
    console.error(e instanceof BenchOptionError || e instanceof RangeError ? e.message : e);
    process.exit(2);
  },
);
