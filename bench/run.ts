/**
 * `npm run bench`: times our CLI, SymPy and Singular on the standard systems, whole process
 * against whole process, interleaved, and checks that they print the same reduced basis.
 * See bench/README.md for what is measured and how to read the table.
 */
import { mkdtempSync, mkdirSync, readFileSync, rmSync, writeFileSync, existsSync } from "node:fs";
import { cpus, loadavg, tmpdir } from "node:os";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import { checkAgreement, type Agreement } from "./lib/agreement";
import { BenchOptionError, parseBenchOptions, USAGE, type BenchOptions } from "./lib/options";
import { runProcess } from "./lib/process";
import { median } from "./lib/stats";
import { formatSystemFile, monomialOrderOf, parseSystemFile, type SystemFile } from "./lib/system-file";
import { selectSystems, standardSystems, type BenchSystem } from "./lib/systems";
import { formatNumber, formatRatio, formatTiming, ratioOf, renderTable, type Ratio, type ToolSummary } from "./lib/table";
import { oursTool, singularTool, sympyTool, type Tool, type ToolId } from "./lib/tools";

const root = join(dirname(fileURLToPath(import.meta.url)), "..");

interface SystemResult {
  readonly name: string;
  readonly order: string;
  readonly vars: number;
  readonly equations: number;
  readonly tools: Partial<Record<ToolId, ToolSummary>>;
  readonly ratios: { readonly sympy: Ratio; readonly singular: Ratio };
  readonly agreement: Agreement;
}

function readSystem(s: BenchSystem): SystemFile {
  const path = join(root, "bench", "systems", `${s.name}.txt`);
  if (!existsSync(path)) throw new Error(`bench/systems/${s.name}.txt missing: run npx tsx bench/generate-systems.ts`);
  const text = readFileSync(path, "utf8");
  if (text !== formatSystemFile(s.file)) console.warn(`warning: bench/systems/${s.name}.txt differs from the generator's output`);
  return parseSystemFile(text);
}

interface ToolState {
  runs: number[];
  final?: ToolSummary;
  output?: string[];
}

async function benchSystem(s: BenchSystem, index: number, tools: Tool[], o: BenchOptions, scratch: string): Promise<SystemResult> {
  const system = readSystem(s);
  const relPath = `bench/systems/${s.name}.txt`;
  const states = new Map<ToolId, ToolState>(tools.map((t) => [t.id, { runs: [] }]));
  for (const t of tools) if (t.unavailable) states.get(t.id)!.final = { status: "n/a", reason: t.unavailable };
  for (let round = 0; round < o.repeat; round++) {
    // Rotate who goes first so no program always runs on a cold or a warm machine.
    const shift = (round + index) % tools.length;
    for (const t of [...tools.slice(shift), ...tools.slice(0, shift)]) {
      const st = states.get(t.id)!;
      if (st.final) continue;
      const inv = t.invocation(relPath, system, scratch, o.prime);
      const run = await runProcess(inv.command, inv.args, o.timeout, root);
      if (run.timedOut) st.final = { status: "timeout" };
      else if (run.exitCode !== 0 && run.exitCode === t.unsupportedExitCode) st.final = { status: "n/a", reason: run.stderr.trim() };
      else if (run.exitCode !== 0) {
        const message = run.stderr.trim().split("\n").slice(-3).join(" / ") || `exit code ${run.exitCode}`;
        st.final = { status: "error", message };
      } else {
        st.runs.push(run.seconds);
        st.output ??= run.stdout.split("\n");
        if (run.seconds > o.long) st.final = { status: "ok", median: run.seconds, runs: st.runs };
      }
    }
  }
  const summaries: Partial<Record<ToolId, ToolSummary>> = {};
  const outputs: Partial<Record<ToolId, string[]>> = {};
  for (const t of tools) {
    const st = states.get(t.id)!;
    // A run that failed after earlier successes still counts as a failure of the program.
    summaries[t.id] = st.final ?? { status: "ok", median: median(st.runs), runs: st.runs };
    if (st.output) outputs[t.id] = st.output;
  }
  const na: ToolSummary = { status: "n/a", reason: "not run" };
  const ours = summaries.ours ?? na;
  return {
    name: s.name,
    order: system.order,
    vars: system.vars.length,
    equations: system.polys.length,
    tools: summaries,
    ratios: { sympy: ratioOf(ours, summaries.sympy ?? na, o.timeout), singular: ratioOf(ours, summaries.singular ?? na, o.timeout) },
    agreement: checkAgreement(outputs, system.vars, monomialOrderOf(system), o.prime),
  };
}

function tableOf(results: readonly SystemResult[], o: BenchOptions): string {
  const cell = (r: SystemResult, id: ToolId) => {
    const t = r.tools[id];
    if (!t) return "–";
    const runs = t.status === "ok" && t.runs.length !== o.repeat ? ` (${t.runs.length}×)` : "";
    return formatTiming(t, o.timeout) + runs;
  };
  const sizes = (r: SystemResult) => [...new Set(Object.values(r.agreement.basisSizes))].join("/") || "–";
  const check = (r: SystemResult) => ({ agree: "same", disagree: "DIFFERS", unchecked: "–" })[r.agreement.status];
  const rows = results.map((r) => [
    r.name,
    r.order,
    cell(r, "ours"),
    cell(r, "sympy"),
    cell(r, "singular"),
    formatRatio(r.ratios.sympy),
    formatRatio(r.ratios.singular),
    sizes(r),
    check(r),
  ]);
  const headers = ["system", "order", "ours", "SymPy", "Singular", "ours/SymPy", "ours/Singular", "basis", "bases"];
  return renderTable(headers, rows, [false, false, true, true, true, true, true, true, false]);
}

async function main(): Promise<number> {
  const o = parseBenchOptions(process.argv.slice(2));
  if (o.help) {
    console.log(USAGE);
    return 0;
  }
  const tools = [oursTool(root), sympyTool(root), singularTool(root)].filter((t) => o.tools.includes(t.id));
  const systems = selectSystems(standardSystems(), o.only, o.quick);
  console.log(`machine: ${cpus().length} cores, ${cpus()[0]?.model ?? "unknown CPU"}; field: ${o.prime === undefined ? "Q" : `Z/${o.prime}`}`);
  for (const t of tools) console.log(`  ${t.label}: ${t.unavailable ? `n/a — ${t.unavailable}` : t.version}`);
  const loadBefore = loadavg()[0];
  console.log(`load average (1 min) at start: ${loadBefore.toFixed(2)} on ${cpus().length} cores`);
  console.log(`repeat ${o.repeat} (runs over ${o.long} s not repeated), timeout ${o.timeout} s, ${systems.length} systems\n`);

  const scratch = mkdtempSync(join(tmpdir(), "stillpoint-bench-"));
  const results: SystemResult[] = [];
  try {
    // One untimed run per program first, so tsx's transform cache and Python's bytecode are warm.
    const warm = standardSystems()[0];
    for (const t of tools.filter((t) => !t.unavailable)) {
      const inv = t.invocation(`bench/systems/${warm.name}.txt`, readSystem(warm), scratch, o.prime);
      await runProcess(inv.command, inv.args, o.timeout, root);
    }
    for (const [i, s] of systems.entries()) {
      const r = await benchSystem(s, i, tools, o, scratch);
      results.push(r);
      const parts = tools.map((t) => `${t.label} ${formatTiming(r.tools[t.id]!, o.timeout)}`);
      console.log(`${r.name} (${r.order}): ${parts.join(" | ")} | bases ${r.agreement.status}`);
      for (const d of r.agreement.details) console.log(`  !!! ${d}`);
    }
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }

  const loadAfter = loadavg()[0];
  console.log(`\n${tableOf(results, o)}\n`);
  console.log("times: median wall-clock seconds per whole process; ratios < 1 mean ours is faster; '<'/'>' are bounds from a timeout.");
  if (Math.max(loadBefore, loadAfter) > cpus().length)
    console.log(`note: load average ${loadBefore.toFixed(1)} → ${loadAfter.toFixed(1)} exceeds the ${cpus().length} cores: other jobs shared the machine, times are inflated.`);
  const failures = results.flatMap((r) =>
    Object.entries(r.tools).flatMap(([id, t]) => (t?.status === "error" ? [`${r.name}: ${id} failed: ${t.message}`] : [])),
  );
  for (const f of failures) console.log(`error: ${f}`);
  const disagreements = results.filter((r) => r.agreement.status === "disagree");
  if (disagreements.length > 0) {
    console.log(`\n!!! BASES DIFFER on ${disagreements.map((r) => r.name).join(", ")} — see the !!! lines above.`);
  }

  const resultsDir = join(root, "bench", "results");
  mkdirSync(resultsDir, { recursive: true });
  const json = {
    generatedAt: new Date().toISOString(),
    machine: { cores: cpus().length, cpu: cpus()[0]?.model ?? "unknown", node: process.version, loadAverage: { start: loadBefore, end: loadAfter } },
    programs: Object.fromEntries(tools.map((t) => [t.id, t.unavailable ? { unavailable: t.unavailable } : { version: t.version }])),
    options: { ...o, prime: o.prime?.toString() },
    systems: results,
  };
  writeFileSync(join(resultsDir, "latest.json"), JSON.stringify(json, null, 2) + "\n");
  console.log(`\nwritten: bench/results/latest.json (${results.length} systems)`);
  return disagreements.length > 0 ? 1 : 0;
}

main().then(
  (code) => process.exit(code),
  (e: unknown) => {
    // Option mistakes and unknown system names are the user's to fix: message only, no stack.
    console.error(e instanceof BenchOptionError || e instanceof RangeError ? e.message : e);
    process.exit(2);
  },
);
