/**
 * `npm run bench -- --nsite [--max N] [--timeout S]`: how `analyse --json` grows with n on the n-site
 * distributive phosphorylation cycle with numeric constants (Wang & Sontag, J. Math. Biol. 57, 2008,
 * for the mechanism), beside Singular's saturated lex basis of the same steady-state system (the
 * brute-force route), whole process each, side by side per n. Constants and totals are invented
 * round values; the steady states are checked to satisfy the system (residual in the JSON).
 */
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { loadavg, tmpdir } from "node:os";
import { join } from "node:path";
import { runProcess } from "./lib/process";

const SINGULAR = "/usr/bin/Singular";

/** The n-site cycle as our CSV: Si + E <-> ESi -> Si+1 + E and Si+1 + F <-> FSi+1 -> Si + F. */
export function nSiteCsv(n: number): { csv: string; initial: string } {
  const rows = ["reaction,label,rate,reverse_rate,rate_value,reverse_rate_value"];
  const on = ["2", "3", "5/2", "4", "3/2"];
  for (let i = 0; i < n; i++) {
    rows.push(`S${i} + E <-> ES${i},kinase binding ${i},a${i},b${i},${on[i % 5]},1`);
    rows.push(`ES${i} -> S${i + 1} + E,kinase step ${i},c${i},,1,`);
    rows.push(`S${i + 1} + F <-> FS${i + 1},phosphatase binding ${i + 1},d${i + 1},e${i + 1},${on[(i + 2) % 5]},1`);
    rows.push(`FS${i + 1} -> S${i} + F,phosphatase step ${i + 1},f${i + 1},,1,`);
  }
  return { csv: rows.join("\n") + "\n", initial: "S0=5,E=1,F=1" };
}

function singularScript(species: readonly string[], equations: readonly string[]): string {
  return [
    `ring r = 0, (t_sat, ${species.join(", ")}), (dp(1), lp(${species.length}));`,
    "option(redSB);",
    `ideal I = ${equations.join(",\n  ")}, 1 - t_sat*${species.join("*")};`,
    "ideal J = eliminate(std(I), t_sat);",
    `ring s = 0, (${species.join(", ")}), lp;`,
    "ideal K = std(imap(r, J));",
    'print("size " + string(size(K)) + " vdim " + string(vdim(K)));',
    "quit;",
  ].join("\n");
}

export async function runNSite(argv: readonly string[], root: string): Promise<number> {
  const flag = (name: string, fallback: number) => {
    const i = argv.indexOf(`--${name}`);
    return i >= 0 ? Number(argv[i + 1]) : fallback;
  };
  const max = flag("max", 5);
  const timeout = flag("timeout", 120);
  const scratch = mkdtempSync(join(tmpdir(), "stillpoint-nsite-"));
  console.log(`n-site distributive phosphorylation, numeric constants; timeout ${timeout} s; load average (1 min) at start ${loadavg()[0].toFixed(2)}`);
  const rows: string[][] = [];
  try {
    for (let n = 1; n <= max; n++) {
      const { csv, initial } = nSiteCsv(n);
      const file = join(scratch, `nsite-${n}.csv`);
      writeFileSync(file, csv);
      await runProcess("node", ["scripts/cli.mjs", "analyse", file, "--initial", initial, "--json"], timeout, root); // warm-up (bundle)
      const ours = await runProcess("node", ["scripts/cli.mjs", "analyse", file, "--initial", initial, "--json", "--timeout", String(timeout)], timeout + 5, root, join(scratch, "t-ours"));
      let states = "-";
      let equations: string[] = [];
      let species: string[] = [];
      if (!ours.timedOut && ours.exitCode === 0) {
        const j = JSON.parse(ours.stdout) as { steadyStates: { residual: number }[] | null; steadyStateSystem: { equations: string[] }; species: string[]; unfinished: unknown[] };
        states = j.steadyStates ? `${j.steadyStates.length} (max residual ${Math.max(0, ...j.steadyStates.map((s) => s.residual)).toExponential(1)})` : `none listed${j.unfinished.length ? ", unfinished" : ""}`;
        equations = j.steadyStateSystem.equations;
        species = j.species;
      }
      let ref = "n/a";
      let refSeconds: number | undefined;
      if (equations.length > 0) {
        const script = join(scratch, `nsite-${n}.sing`);
        writeFileSync(script, singularScript(species, equations));
        const s = await runProcess(SINGULAR, ["-q", "--no-rc", script], timeout, root, join(scratch, "t-sing"));
        refSeconds = s.timedOut ? undefined : s.seconds;
        ref = s.timedOut ? `>${timeout} s` : `${s.seconds.toFixed(2)} s (CPU ${s.cpuSeconds?.toFixed(2) ?? "?"}) ${/size \d+ vdim -?\d+/.exec(s.stdout)?.[0] ?? s.stderr.trim().slice(0, 40)}`;
      }
      const oursText = ours.timedOut ? `>${timeout} s` : `${ours.seconds.toFixed(2)} s (CPU ${ours.cpuSeconds?.toFixed(2) ?? "?"})`;
      const ratio = !ours.timedOut && refSeconds ? (ours.seconds / refSeconds).toFixed(2) : "-";
      rows.push([String(n), String(3 * n + 3), oursText, states, ref, ratio]);
      console.log(rows[rows.length - 1].join(" | "));
    }
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }
  console.log("\n| n | species | ours analyse --json | positive steady states | Singular saturated lex basis | ratio (wall) |\n|---|---|---|---|---|---|");
  for (const r of rows) console.log(`| ${r.join(" | ")} |`);
  console.log(`load average (1 min) at end ${loadavg()[0].toFixed(2)}`);
  return 0;
}
