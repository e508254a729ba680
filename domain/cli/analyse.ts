import { parseRational, sign, type Rational } from "../algebra/rational";
import { analyseNetwork, type SteadyStateAnalysis } from "../steady-state/index";
import { analysisResultJson } from "../steady-state/result";
import type { CliIO, CommandModule } from "./io";
import { cliInputError } from "./input-errors";
import { CliError, parseArgs } from "./io";
import { formatInitial, readNetworkFile } from "./network-input";

const USAGE =
  "usage: analyse NETWORK.csv|.xml|.sbml|.txt [--order A,B,C] [--initial S=1,E=0.1] [--relation 'EXPR; EXPR'] [--timeout SECONDS] [--full-basis] [--json]";

/** Reads `S=1,E=0.1` into exact values; every bad entry is reported with its position. */
export function parseInitial(text: string): Map<string, Rational> {
  const out = new Map<string, Rational>();
  const problems: string[] = [];
  text.split(",").forEach((entry, i) => {
    const m = /^\s*([A-Za-z][A-Za-z0-9_]*)\s*=\s*(.+?)\s*$/.exec(entry);
    const value = m ? parseRational(m[2]) : null;
    if (!m || !value || sign(value) < 0)
      problems.push(`entry ${i + 1} '${entry.trim()}': expected NAME=VALUE with a non-negative decimal or fraction, e.g. S=1 or E=1/10`);
    else if (out.has(m[1])) problems.push(`entry ${i + 1}: '${m[1]}' is given twice`);
    else out.set(m[1], value);
  });
  if (problems.length > 0) throw new CliError(`--initial: ${problems.join("; ")}`);
  return out;
}

const law = (l: Record<string, number>) =>
  Object.entries(l)
    .map(([s, c], i) => `${c < 0 ? (i === 0 ? "-" : " - ") : i === 0 ? "" : " + "}${Math.abs(c) === 1 ? "" : Math.abs(c)}${s}`)
    .join("");

/** A readable plain-text report of the same analysis. */
export function toReport(r: SteadyStateAnalysis): string {
  const s = r.structure;
  const lines: string[] = [];
  const section = (title: string) => lines.push("", title, "-".repeat(title.length));
  lines.push(`Species (${s.species.length}): ${s.species.join(", ")}`);
  if (s.constants.length > 0)
    lines.push(`Held constant (${s.constants.length}): ${s.constants.map((c) => (c.value ? `${c.name} = ${c.value}` : `${c.name} (symbolic)`)).join(", ")}`);
  lines.push(`Complexes (${s.complexes.length}): ${s.complexes.join(", ")}`);
  lines.push(`Directed reactions: ${s.reactions}; rank ${s.rank}; linkage classes ${s.linkageClasses}; deficiency ${s.deficiency}; weakly reversible: ${s.weaklyReversible ? "yes" : "no"}`);
  lines.push(`Conservation laws: ${s.conservationLaws.length === 0 ? "none" : s.conservationLaws.map(law).join("; ")}`);
  if (s.deficiencyZeroTheorem.applies) lines.push(`Deficiency zero theorem: ${s.deficiencyZeroTheorem.conclusions.join(" ")}`);
  section("Mass-action ODEs");
  for (const o of r.odes) lines.push(`  d${o.species}/dt = ${o.rhs}`);
  section("Elimination order");
  lines.push(`  ${r.order.species.join(", ")}${r.order.userGiven ? " (given)" : " (suggested)"}`);
  if (!r.order.userGiven) lines.push(`  Reason: ${r.order.reason}.`);
  lines.push(`  Ring order: ${r.ordering}`);
  section("Parametrisation of the positive steady states");
  if (r.parametrisation) {
    lines.push(`  Free: ${r.parametrisation.free.join(", ") || "(none)"}${r.parametrisation.positive ? " — positive parametrisation (all coefficients positive)" : ""}`);
    for (const [sp, e] of Object.entries(r.parametrisation.expressions)) lines.push(`  ${sp} = ${e}`);
    lines.push(r.nonVanishing.length > 0 ? `  Valid where these do not vanish: ${r.nonVanishing.join("; ")}` : "  Valid at every positive point: every elimination pivot has coefficients of one sign.");
  } else if (r.rootsNeeded.length > 0) {
    lines.push("  No rational parametrisation found; these species need roots of polynomials:");
    for (const x of r.rootsNeeded) lines.push(`  ${x.species}: degree ${x.degree} in ${x.species}: ${x.polynomial} = 0`);
  } else lines.push("  none");
  section("Absolute concentration robustness");
  lines.push(r.acr.length === 0 ? "  no species found with ACR" : r.acr.map((a) => `  ${a.species} = ${a.value} at every positive steady state`).join("\n"));
  section("Lex Gröbner basis of the saturated steady-state ideal");
  if (r.groebnerBasis === null)
    lines.push(r.groebnerBasisStatus === "skipped" ? "  not computed: the parametrisation describes the steady states (--full-basis computes it)" : "  not finished within the budget (see warnings)");
  else for (const b of r.triangularForm) {
    lines.push(`  ${b.species === null ? "parameters only" : `leading species ${b.species}`}:`);
    for (const p of b.polynomials) lines.push(`    ${p}`);
  }
  if (r.genericConditions.length > 0) lines.push(`  For generic parameters: must not vanish: ${r.genericConditions.join("; ")}`);
  if (r.relations.length > 0) {
    section("Relations");
    for (const x of r.relations)
      lines.push(`  ${x.expression}: ${x.inIdeal ? "in the saturated ideal (vanishes at every positive steady state)" : x.vanishes ? "vanishes on the saturated variety (in the radical, not the ideal)" : `does not vanish at every positive steady state; remainder ${x.remainder}`}`);
  }
  if (r.steadyStateSet === "continuum") {
    section("Positive steady states in the class");
    lines.push("  infinitely many: the steady states of this class form a continuum (see warnings)");
  } else if (r.steadyStates === null && r.steadyStatesReason) {
    section("Positive steady states in the class");
    lines.push(`  not listed: ${r.steadyStatesReason}`);
  } else if (r.steadyStates) {
    section(`Positive steady states in the class (${r.steadyStates.length})`);
    if (r.eliminant) lines.push(`  from the real roots of ${r.eliminant.polynomial} (in ${r.eliminant.variable})`);
    r.steadyStates.forEach((x, i) => {
      const conc = Object.entries(x.concentrations).map(([k, v]) => `${k}=${v.toPrecision(12)}`).join(", ");
      const eig = x.eigenvalues.map((e) => (e.im === 0 ? e.re.toPrecision(6) : `${e.re.toPrecision(6)}${e.im < 0 ? "-" : "+"}${Math.abs(e.im).toPrecision(6)}i`)).join(", ");
      lines.push(`  #${i + 1} ${x.verdict}: ${conc}`);
      lines.push(`     eigenvalues on the stoichiometric subspace: ${eig || "(none)"}`);
    });
  }
  if (r.unfinished.length > 0) {
    section("Unfinished stages");
    for (const u of r.unfinished) lines.push(`  - ${u.stage}: ${u.reason}`);
  }
  if (r.warnings.length > 0) {
    section("Notes and warnings");
    for (const w of r.warnings) lines.push(`  - ${w}`);
  }
  return lines.join("\n").trimStart() + "\n";
}

/**
 * `analyse NETWORK.csv [--order A,B,C] [--initial S=1,E=0.1] [--relation EXPR] [--timeout S] [--json]`.
 * Every input problem (CSV, order, initial values, relation) ends as a CliError → stderr, exit code 2.
 */
export function run(args: readonly string[], io: CliIO): number {
  const json = args.includes("--json");
  const fullBasis = args.includes("--full-basis");
  const { positionals, flags } = parseArgs(args.filter((a) => a !== "--json" && a !== "--full-basis"), ["order", "initial", "relation", "timeout"]);
  if (positionals.length !== 1) throw new CliError(USAGE);
  const timeout = flags.has("timeout") ? Number(flags.get("timeout")) : 20;
  if (!(timeout > 0)) throw new CliError("--timeout expects a positive number of seconds");
  const order = flags.has("order") ? flags.get("order")!.split(",").map((s) => s.trim()).filter((s) => s !== "") : undefined;
  const initial = flags.has("initial") ? parseInitial(flags.get("initial")!) : undefined;
  const relations = flags.has("relation") ? flags.get("relation")!.split(";").map((s) => s.trim()).filter((s) => s !== "") : [];
  let result: SteadyStateAnalysis;
  try {
    // `.xml`/`.sbml` files are read as SBML, `.txt` as a reaction list; the file's initial values
    // (SBML initial concentrations, a `# initial:` line) stand in for a missing --initial, and say so.
    const doc = readNetworkFile(io, positionals[0]);
    for (const n of doc.notes) io.stderr(`note: ${n}\n`);
    const start = initial ?? (doc.initial.size > 0 ? new Map(doc.initial) : undefined);
    if (!initial && start) io.stderr(`note: initial concentrations from the file: ${formatInitial(start)}\n`);
    result = analyseNetwork(doc.network, { order, initial: start, relations, timeoutMs: timeout * 1000, fullBasis });
  } catch (e) {
    throw cliInputError(e) ?? e;
  }
  io.stdout(json ? JSON.stringify(analysisResultJson(result), null, 2) + "\n" : toReport(result));
  return 0;
}

export const command: CommandModule = {
  run,
  summary: "analyse NETWORK.csv|.xml [--order A,B] [--initial S=1] [--json]   structure, steady states, parametrisation, stability",
};
