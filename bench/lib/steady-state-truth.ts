/**
 * Positive steady-state counts of `analyseNetwork` checked against independent evidence, on seeded
 * random mass-action networks (3–6 species, 3–6 reaction rows, molecularity ≤ 3 per side, small
 * rational constants, positive initial concentrations):
 * - a multistart Newton search on the class (a lower bound: every root it finds must be listed);
 * - where Debian's Singular is installed, the dimension and vector-space dimension of the class's
 *   ideal saturated by the product of the species, computed by Singular's `std`/`eliminate`
 *   (Greuel & Pfister, "A Singular Introduction to Commutative Algebra", 2nd ed. 2008): a finite
 *   list needs dimension 0 and at most vdim states; a continuum needs dimension > 0;
 * - the result's own consistency check against the theorems it cites;
 * - the time limit: no analysis may run past its budget by more than a second.
 * Used by tests/domain/steady-state/truth.test.ts (a CI-sized subset) and `npm run bench -- --truth`.
 */
import { execFileSync } from "node:child_process";
import { existsSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { fromTerms, terms } from "../../domain/algebra/index";
import { neg, parseRational, sign, type Rational } from "../../domain/algebra/rational";
import { parseNetworkCsv, type Network } from "../../domain/network/index";
import { multistartPositiveSolutions, seededRandom } from "../../domain/numeric/multistart";
import { solveLinear } from "../../domain/numeric/dense";
import { floatSystem } from "../../domain/steady-state/float-eval";
import { analyseNetwork, kineticsRing, steadyStateSystem, totalsFromInitial, type SteadyStateAnalysis } from "../../domain/steady-state/index";

export const SINGULAR = "/usr/bin/Singular";

export interface TruthCase {
  readonly seed: number;
  readonly csv: string;
  readonly initial: string;
}

export interface TruthOutcome {
  readonly case: TruthCase;
  /** What our analysis said: a count, "continuum", or "undecided" (out of budget). */
  readonly ours: number | "continuum" | "undecided";
  readonly newton: number;
  readonly singular: { dim: number; vdim: number } | null;
  readonly elapsedMs: number;
  readonly problems: string[];
}

const NAMES = ["A", "B", "C", "D", "G", "H"];
const VALUES = ["1", "2", "3", "1/2", "5", "3/2", "1/3", "5/2", "1/10", "20"];

/** One seeded random network with its initial concentrations (CSV in the product's own format). */
export function randomCase(seed: number): TruthCase {
  const random = seededRandom(seed);
  const pick = <T>(xs: readonly T[]) => xs[Math.floor(random() * xs.length)];
  const ns = 3 + Math.floor(random() * 4);
  const species = NAMES.slice(0, ns);
  // 0 to 3 molecules per side (mostly 1–2); 3 allows autocatalytic steps such as 2A + B -> 3A, the
  // usual source of several steady states.
  const complex = () => {
    const u = random();
    const size = u < 0.08 ? 0 : u < 0.45 ? 1 : u < 0.85 ? 2 : 3;
    if (size === 0) return "0";
    const counts = new Map<string, number>();
    for (let i = 0; i < size; i++) {
      const x = pick(species);
      counts.set(x, (counts.get(x) ?? 0) + 1);
    }
    return [...counts].sort(([a], [b]) => (a < b ? -1 : 1)).map(([x, c]) => (c === 1 ? x : `${c}${x}`)).join(" + ");
  };
  const count = 3 + Math.floor(random() * 4);
  const rows: string[] = [];
  const seen = new Set<string>();
  let k = 1;
  for (let guard = 0; rows.length < count && guard < 100; guard++) {
    const left = complex();
    const right = complex();
    if (left === right || seen.has(`${left}|${right}`) || seen.has(`${right}|${left}`)) continue;
    seen.add(`${left}|${right}`);
    const i = k++;
    rows.push(random() < 0.8 ? `${left} <-> ${right},r${i},k${i},km${i},${pick(VALUES)},${pick(VALUES)}` : `${left} -> ${right},r${i},k${i},,${pick(VALUES)},`);
  }
  const csv = `reaction,label,rate,reverse_rate,rate_value,reverse_rate_value\n${rows.join("\n")}\n`;
  let network: Network;
  try {
    network = parseNetworkCsv(csv);
  } catch {
    return randomCase(seed + 100_000); // a row set the parser refuses (e.g. an unused species): next seed
  }
  const initial = network.species.map((s) => `${s}=${pick(["1", "2", "1/2", "3"])}`).join(",");
  return { seed, csv, initial };
}

const toInitial = (text: string) => new Map(text.split(",").map((e) => [e.split("=")[0], parseRational(e.split("=")[1])!] as const));
const abs = (r: Rational) => (sign(r) < 0 ? neg(r) : r);

/** Singular's dimension and vdim of the class's saturated ideal, or null (not installed, or over its limit). */
export function singularDimension(network: Network, analysis: SteadyStateAnalysis, timeoutMs = 20_000): { dim: number; vdim: number } | null {
  if (!existsSync(SINGULAR)) return null;
  const vars = network.species;
  const eqs = analysis.steadyStateSystem.equations;
  const product = vars.join("*");
  const script = [
    `ring r = 0, (t_sat, ${vars.join(", ")}), dp;`,
    `ideal I = ${eqs.join(",\n  ")}, 1 - t_sat*${product};`,
    "ideal J = eliminate(std(I), t_sat);",
    `ring s = 0, (${vars.join(", ")}), dp;`,
    "ideal K = std(imap(r, J));",
    'print(string(dim(K)) + " " + string(vdim(K)));',
    "quit;",
  ].join("\n");
  const dir = mkdtempSync(join(tmpdir(), "truth-"));
  try {
    const file = join(dir, "s.sing");
    writeFileSync(file, script);
    const out = execFileSync(SINGULAR, ["-q", "--no-rc", file], { encoding: "utf8", timeout: timeoutMs, stdio: ["ignore", "pipe", "ignore"] });
    const m = /(-?\d+) (-?\d+)/.exec(out);
    return m ? { dim: Number(m[1]), vdim: Number(m[2]) } : null;
  } catch {
    return null;
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

/** Runs one case and compares; `problems` lists every disagreement (empty when all agree). */
export function checkCase(c: TruthCase, options: { timeoutMs: number; singular: boolean; starts: number }): TruthOutcome {
  const network = parseNetworkCsv(c.csv);
  const initial = toInitial(c.initial);
  const t0 = Date.now();
  const r = analyseNetwork(network, { initial, timeoutMs: options.timeoutMs });
  const elapsedMs = Date.now() - t0;
  const problems: string[] = [...r.contradictions.map((x) => `contradiction: ${x}`)];
  if (elapsedMs > options.timeoutMs + 1000) problems.push(`ran ${elapsedMs} ms with a budget of ${options.timeoutMs} ms`);
  const ours: TruthOutcome["ours"] = r.steadyStateSet === "finite" && r.steadyStates ? r.steadyStates.length : r.steadyStateSet === "continuum" ? "continuum" : "undecided";

  const kin = kineticsRing(network);
  const laws = r.structure.conservationLaws.map((law) => network.species.map((s) => BigInt(law[s] ?? 0)));
  const sys = steadyStateSystem(network, kin, laws, totalsFromInitial(laws, network.species, initial));
  const all = kin.species.map((_, i) => i);
  const square = floatSystem(sys.equations, all);
  const sizes = floatSystem(sys.equations.map((p) => fromTerms(p.ring, terms(p).map((t) => ({ coeff: abs(t.coeff), exponents: t.exponents })))), all);
  // A root has a small residual relative to the size of the terms that cancel.
  const satisfies = (x: number[]) => {
    const m = sizes.values(x);
    return square.values(x).every((v, i) => Math.abs(v) <= 1e-8 * Math.max(m[i], 1e-300));
  };
  // Log-coordinate Newton also creeps towards boundary states (a species → 0, residual shrinking
  // with it) and runs off to solutions at infinity; with constants and totals between 1/10 and 20,
  // a genuine positive state of these networks lies well inside [1e-6, 1e6].
  // At a genuine simple root the full Newton step is tiny (it estimates the distance to the root);
  // at a point creeping towards a boundary root it is a fixed fraction of the vanishing coordinate.
  const holds = (x: number[]) => {
    const step = solveLinear(square.jacobian(x), square.values(x).map((v) => -v));
    return step !== null && step.every((d, i) => Number.isFinite(d) && Math.abs(d) <= 1e-7 * Math.abs(x[i]));
  };
  const genuine = (x: number[]) => Math.max(...x) < 1e6 && Math.min(...x) > 1e-6 && satisfies(x) && holds(x);
  for (const s of r.steadyStates ?? []) {
    const x = kin.species.map((sp) => s.concentrations[sp]);
    if (!satisfies(x)) problems.push(`listed state ${JSON.stringify(s.concentrations)} does not satisfy the steady-state equations`);
  }
  const found = multistartPositiveSolutions((x) => ({ f: square.values(x), jacobian: square.jacobian(x) }), {
    low: kin.species.map(() => 1e-3),
    high: kin.species.map(() => 20),
    starts: options.starts,
    seed: c.seed,
    residualTol: 1e-10,
    maxIterations: 60,
  }).filter(genuine);
  if (ours !== "continuum" && ours !== "undecided")
    for (const x of found) {
      const known = (r.steadyStates ?? []).some((s) => kin.species.every((sp, i) => Math.abs(s.concentrations[sp] - x[i]) <= 1e-5 * Math.max(x[i], 1e-12)));
      if (!known) problems.push(`Newton found a positive steady state that is not listed: ${kin.species.map((sp, i) => `${sp}=${x[i]}`).join(", ")}`);
    }
  const singular = options.singular ? singularDimension(network, r) : null;
  if (singular) {
    // (A finite positive list beside a positive dimension is possible: the continuum may lie where a
    // species or a one-signed pivot is zero or negative, outside the positive orthant.)
    if (typeof ours === "number" && singular.dim === 0 && ours > singular.vdim) problems.push(`we list ${ours} states, more than Singular's vdim ${singular.vdim}`);
    if (ours === "continuum" && singular.dim <= 0) problems.push(`we report a continuum, Singular finds dimension ${singular.dim}`);
  }
  return { case: c, ours, newton: found.length, singular, elapsedMs, problems };
}

/** Reproduction text for a disagreement: the file and the command. */
export function reproduction(o: TruthOutcome): string {
  return `seed ${o.case.seed}: ours ${o.ours}, Newton ${o.newton}, Singular ${o.singular ? `dim ${o.singular.dim} vdim ${o.singular.vdim}` : "n/a"}\n${o.case.csv}` +
    `npm run -s cli -- analyse NETWORK.csv --initial ${o.case.initial} --json\n  ${o.problems.join("\n  ")}`;
}
