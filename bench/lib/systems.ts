/**
 * The standard benchmark systems, built exactly (bigint rationals) and printed in the CLI's
 * input format. Definitions:
 * - katsura-n: Katsura et al., "Distribution of effective field in the Ising spin glass of the
 *   ±J model at T = 0", Cell Biophysics 11 (1987); as distributed in the PoSSo test suite
 *   (recalled from memory): unknowns u_0..u_n with u_{-i} = u_i and u_i = 0 for |i| > n;
 *   Σ_{l=-n..n} u_l = 1 and Σ_{l=-n..n} u_l·u_{m-l} = u_m for m = 0..n-1.
 * - cyclic-n: Björck and Fröberg, "A faster way to count the solutions of inhomogeneous systems
 *   of algebraic equations, with applications to cyclic n-roots", J. Symbolic Computation 12
 *   (1991) (recalled from memory): Σ_i Π_{j<d} x_{(i+j) mod n} = 0 for d = 1..n-1, and
 *   x_0···x_{n-1} = 1.
 * - phosphorylation cycles: mass-action steady-state ideals of the distributive one-site
 *   (Goldbeter and Koshland, PNAS 78, 1981) and two-site cycle (Wang and Sontag, J. Math. Biol.
 *   57, 2008), with invented rate constants and totals.
 *
 * Example: cyclic(3).polys are x0 + x1 + x2, x0*x1 + x0*x2 + x1*x2 (printed in grevlex), x0*x1*x2 - 1.
 */
import { conservationEquation, massActionRhs, type Reaction } from "./mass-action";
import { canonical, polyAdd, polyConst, polyMul, polySub, polyVar, type Poly } from "./poly";
import { q, qParse, type Q } from "./rational";
import type { SystemFile } from "./system-file";

export interface PolySystem {
  readonly vars: readonly string[];
  readonly polys: readonly Poly[];
}

export interface BenchSystem {
  /** File stem in bench/systems/, e.g. "katsura-5" or "phospho-2site-lex". */
  readonly name: string;
  readonly file: SystemFile;
  /** Part of the `--quick` set (seconds, not minutes, in every program). */
  readonly quick: boolean;
  /** Run only when named with `--only` (minutes per program; not part of the default run). */
  readonly extra?: boolean;
}

const names = (prefix: string, count: number): string[] => Array.from({ length: count }, (_, i) => `${prefix}${i}`);

/** katsura-n: n+1 unknowns x0..xn, n+1 equations (one linear, n quadratic). */
export function katsura(n: number): PolySystem {
  if (n < 1) throw new RangeError("katsura-n needs n >= 1");
  const vars = names("x", n + 1);
  const nv = vars.length;
  const u = (i: number): Poly => (Math.abs(i) > n ? new Map() : polyVar(Math.abs(i), nv));
  let linear = polyConst(q(-1n), nv);
  for (let l = -n; l <= n; l++) linear = polyAdd(linear, u(l));
  const quadratics: Poly[] = [];
  for (let m = 0; m < n; m++) {
    let sum: Poly = new Map();
    for (let l = -n; l <= n; l++) sum = polyAdd(sum, polyMul(u(l), u(m - l)));
    quadratics.push(polySub(sum, u(m)));
  }
  return { vars, polys: [linear, ...quadratics] };
}

/** cyclic-n: n unknowns x0..x(n-1), n equations of degrees 1..n. */
export function cyclic(n: number): PolySystem {
  if (n < 2) throw new RangeError("cyclic-n needs n >= 2");
  const vars = names("x", n);
  const x = (i: number): Poly => polyVar(i % n, n);
  const polys: Poly[] = [];
  for (let d = 1; d < n; d++) {
    let sum: Poly = new Map();
    for (let i = 0; i < n; i++) {
      let prod = polyConst(q(1n), n);
      for (let j = 0; j < d; j++) prod = polyMul(prod, x(i + j));
      sum = polyAdd(sum, prod);
    }
    polys.push(sum);
  }
  let all = polyConst(q(1n), n);
  for (let i = 0; i < n; i++) all = polyMul(all, x(i));
  polys.push(polyAdd(all, polyConst(q(-1n), n)));
  return { vars, polys };
}

/** A rate is a number ("3/2") or, for symbolic systems, a parameter name ("k1"). */
const rateOf = (text: string): Q | string => (/^[A-Za-z]/.test(text) ? text : qParse(text));

const reaction = (from: string, to: string, rate: string): Reaction => {
  const side = (s: string) => Object.fromEntries(s.split("+").map((t) => [t.trim(), 1]));
  return { reactants: side(from), products: side(to), rate: rateOf(rate) };
};

/** S + K <-> SK -> P + K with the three rate constants [binding, unbinding, catalysis]. */
const enzymeStep = (s: string, k: string, p: string, [on, off, cat]: readonly string[]): Reaction[] => [
  reaction(`${s}+${k}`, `${k}${s}`, on),
  reaction(`${k}${s}`, `${s}+${k}`, off),
  reaction(`${k}${s}`, `${p}+${k}`, cat),
];

/**
 * Steady-state ideal of a phosphorylation cycle: the mass-action ODEs of every species except
 * E, F and S0 (whose equations depend on the others), plus the conservation laws of kinase E,
 * phosphatase F and total substrate, with the given totals.
 */
function phosphorylationIdeal(
  species: readonly string[],
  reactions: readonly Reaction[],
  totals: { E: string; F: string; S: string },
  parameters: readonly string[] = [],
): PolySystem {
  const vars = [...species, ...parameters];
  const rhs = massActionRhs(reactions, vars);
  const odes = species.filter((s) => !["E", "F", "S0"].includes(s)).map((s) => rhs[vars.indexOf(s)]);
  const ones = (list: string[]) => Object.fromEntries(list.map((s) => [s, 1]));
  const withE = species.filter((s) => s.startsWith("E"));
  const withF = species.filter((s) => s.startsWith("F"));
  const withS = species.filter((s) => s.includes("S"));
  return {
    vars,
    polys: [
      ...odes,
      conservationEquation(ones(withE), rateOf(totals.E), vars),
      conservationEquation(ones(withF), rateOf(totals.F), vars),
      conservationEquation(ones(withS), rateOf(totals.S), vars),
    ],
  };
}

/** One-site cycle S0 + E <-> ES0 -> S1 + E, S1 + F <-> FS1 -> S0 + F: 6 species, 6 equations. */
export function phosphorylationOneSite(): PolySystem {
  const species = ["ES0", "FS1", "E", "F", "S0", "S1"];
  const reactions = [...enzymeStep("S0", "E", "S1", ["2", "1", "3"]), ...enzymeStep("S1", "F", "S0", ["3/2", "1/2", "2"])];
  return phosphorylationIdeal(species, reactions, { E: "1/2", F: "1/3", S: "2" });
}

// Intermediates first, then enzymes, then substrate forms: the lex order eliminates in this order.
const TWO_SITE_SPECIES = ["ES0", "ES1", "FS2", "FS1", "E", "F", "S0", "S2", "S1"];

function twoSiteReactions(k: readonly string[]): Reaction[] {
  return [
    ...enzymeStep("S0", "E", "S1", k.slice(0, 3)),
    ...enzymeStep("S1", "E", "S2", k.slice(3, 6)),
    ...enzymeStep("S2", "F", "S1", k.slice(6, 9)),
    ...enzymeStep("S1", "F", "S0", k.slice(9, 12)),
  ];
}

/**
 * Two-site distributive cycle S0 -E-> S1 -E-> S2 -F-> S1 -F-> S0 (Wang and Sontag 2008):
 * 9 species, 12 rate constants, 9 equations.
 */
export function phosphorylationTwoSite(): PolySystem {
  const rates = ["2", "1", "3", "5/2", "1/2", "4", "3/2", "1", "2", "1", "1/3", "5/4"];
  return phosphorylationIdeal(TWO_SITE_SPECIES, twoSiteReactions(rates), { E: "1/2", F: "1/3", S: "3" });
}

/**
 * The same two-site cycle with all twelve rate constants k1..k12 and the totals Etot, Ftot,
 * Stot symbolic: 24 variables, species first. In `lex(9), grevlex(15)` this is the brute-force
 * block-order computation of issue 4 (parameters below all species).
 */
export function phosphorylationTwoSiteSymbolic(): PolySystem {
  const rates = Array.from({ length: 12 }, (_, i) => `k${i + 1}`);
  const totals = { E: "Etot", F: "Ftot", S: "Stot" };
  return phosphorylationIdeal(TWO_SITE_SPECIES, twoSiteReactions(rates), totals, [...rates, ...Object.values(totals)]);
}

/**
 * The n-site distributive cycle (Wang and Sontag 2008) with a few constants symbolic: the
 * modeller's everyday block-order case. Rates k1..k(6n) in the order of the reactions (kinase
 * steps S0→S1…, then phosphatase steps Sn→Sn-1…, each binding, unbinding, catalysis); the
 * constants named in `symbolic` (e.g. ["k1", "k4"]) and, with `symbolicTotals`, Etot, Ftot, Stot
 * stay parameters, listed after the species. Numeric constants and totals are invented round values.
 */
export function phosphorylationNSiteParametric(n: number, symbolic: readonly string[], symbolicTotals: boolean): PolySystem {
  const values = ["2", "1", "3", "5/2", "1/2", "4", "3/2", "1", "2", "1", "1/3", "5/4"];
  const rates = Array.from({ length: 6 * n }, (_, i) => (symbolic.includes(`k${i + 1}`) ? `k${i + 1}` : values[i % values.length]));
  const reactions: Reaction[] = [];
  for (let i = 0; i < n; i++) reactions.push(...enzymeStep(`S${i}`, "E", `S${i + 1}`, rates.slice(3 * i, 3 * i + 3)));
  for (let i = n - 1, r = 3 * n; i >= 0; i--, r += 3) reactions.push(...enzymeStep(`S${i + 1}`, "F", `S${i}`, rates.slice(r, r + 3)));
  const species = [
    ...Array.from({ length: n }, (_, i) => `ES${i}`),
    ...Array.from({ length: n }, (_, i) => `FS${n - i}`),
    "E", "F", "S0",
    ...Array.from({ length: n }, (_, i) => `S${n - i}`),
  ];
  const totals = symbolicTotals ? { E: "Etot", F: "Ftot", S: "Stot" } : { E: "1/2", F: "1/3", S: "3" };
  const parameters = [...symbolic, ...(symbolicTotals ? Object.values(totals) : [])];
  return phosphorylationIdeal(species, reactions, totals, parameters);
}

/**
 * The n-site distributive cycle with every constant numeric but "measured": four significant
 * digits (invented values from a fixed rule, not data), totals 5.3, 1.21, 0.97, and saturated
 * by 1 − t_sat·(product of the species) as an analysis' steady-state ideal is (positive
 * concentrations only), in grevlex. Small integers keep bases small; constants like these are
 * what make a steady-state basis over Q large (hundreds of primes to lift), so this is the
 * distributed bench's steady-state ideal. Its homogenisation is not saturated in h, so it is
 * proven through F^h (domain/algebra/groebner/homogenise.ts).
 */
export function phosphorylationNSiteMeasured(n: number): PolySystem {
  const value = (i: number) => `${((i * 7919) % 9000) + 1000}/1000`; // 1.000 … 9.999
  const rates = Array.from({ length: 6 * n }, (_, i) => value(i + 1));
  const reactions: Reaction[] = [];
  for (let i = 0; i < n; i++) reactions.push(...enzymeStep(`S${i}`, "E", `S${i + 1}`, rates.slice(3 * i, 3 * i + 3)));
  for (let i = n - 1, r = 3 * n; i >= 0; i--, r += 3) reactions.push(...enzymeStep(`S${i + 1}`, "F", `S${i}`, rates.slice(r, r + 3)));
  // Species in the order of an analysis of this network (complexes first, then S1..Sn, S0, E, F).
  const species = [
    ...Array.from({ length: n }, (_, i) => [`ES${i}`, `FS${i + 1}`]).flat(),
    ...Array.from({ length: n }, (_, i) => `S${i + 1}`),
    "S0", "E", "F",
  ];
  const ideal = phosphorylationIdeal(species, reactions, { E: "53/10", F: "121/100", S: "97/100" }, ["t_sat"]);
  const nv = ideal.vars.length;
  let product = polyVar(nv - 1, nv);
  for (let k = 0; k < species.length; k++) product = polyMul(product, polyVar(k, nv));
  // t_sat first, as an analysis orders it.
  const first = (p: Poly): Poly => new Map([...p.values()].map((t) => {
    const exps = [t.exps[nv - 1], ...t.exps.slice(0, nv - 1)];
    return [exps.join(","), { exps, coef: t.coef }] as const;
  }));
  const polys = [...ideal.polys, polySub(polyConst(q(1n), nv), product)].map(first);
  return { vars: ["t_sat", ...ideal.vars.slice(0, nv - 1)], polys };
}

/** The symbolic two-site cycle as a reaction network, for `analyse` (see network-csv.ts). */
export interface BenchNetwork {
  readonly name: string;
  readonly reactions: readonly Reaction[];
  readonly species: readonly string[];
  readonly rates: readonly string[];
  readonly comments: readonly string[];
}

/**
 * The network behind phospho-2site-symbolic: the same twelve reactions with rate constants
 * k1..k12, written to bench/systems/phospho-2site-symbolic.csv for the issue-4 target
 * (`npm run bench -- --analyse`).
 */
export function phosphorylationTwoSiteSymbolicNetwork(): BenchNetwork {
  const rates = Array.from({ length: 12 }, (_, i) => `k${i + 1}`);
  return {
    name: "phospho-2site-symbolic",
    reactions: twoSiteReactions(rates),
    species: TWO_SITE_SPECIES,
    rates,
    comments: [
      "two-site distributive phosphorylation cycle (Wang and Sontag, J. Math. Biol. 2008), mass action, all twelve rate constants symbolic",
      "the network of bench/systems/phospho-2site-symbolic.txt, for npm run bench -- --analyse",
      "generated by bench/generate-systems.ts; do not edit",
    ],
  };
}

function toFile(sys: PolySystem, order: string, comments: string[]): SystemFile {
  // Input polynomials are printed in grevlex whatever the order: the file fixes the ideal, not a basis.
  return { comments, vars: sys.vars, order, polys: sys.polys.map((p) => canonical(p, sys.vars, "grevlex")) };
}

const KATSURA_SOURCE = "Katsura et al., Cell Biophysics 11 (1987); PoSSo test-suite form, recalled from memory";
const CYCLIC_SOURCE = "Björck and Fröberg, J. Symbolic Computation 12 (1991), cyclic n-roots; recalled from memory";

/** Every system `npm run bench` knows, in table order. */
export function standardSystems(): BenchSystem[] {
  const generated = "generated by bench/generate-systems.ts; do not edit";
  const startup: PolySystem = { vars: ["x"], polys: [polyAdd(polyVar(0, 1), polyConst(q(-1n), 1))] };
  const out: BenchSystem[] = [
    { name: "startup", quick: true, file: toFile(startup, "lex", ["start-up baseline: the ideal (x - 1), so the time is almost all process start-up", generated]) },
  ];
  for (const n of [3, 4, 5, 6, 7, 8])
    out.push({ name: `katsura-${n}`, quick: n <= 4, file: toFile(katsura(n), "grevlex", [`katsura-${n}: ${KATSURA_SOURCE}`, generated]) });
  for (const n of [4, 5, 6, 7])
    out.push({ name: `cyclic-${n}`, quick: n <= 5, file: toFile(cyclic(n), "grevlex", [`cyclic-${n}: ${CYCLIC_SOURCE}`, generated]) });
  out.push({ name: "katsura-4-lex", quick: false, file: toFile(katsura(4), "lex", [`katsura-4 in lex: ${KATSURA_SOURCE}`, generated]) });
  out.push({ name: "cyclic-4-lex", quick: true, file: toFile(cyclic(4), "lex", [`cyclic-4 in lex: ${CYCLIC_SOURCE}`, generated]) });
  const one = phosphorylationOneSite();
  const two = phosphorylationTwoSite();
  const oneText = "one-site phosphorylation cycle (Goldbeter and Koshland, PNAS 1981), mass action, invented rate constants 2, 1, 3 | 3/2, 1/2, 2 and totals E 1/2, F 1/3, S 2";
  const twoText = "two-site distributive phosphorylation cycle (Wang and Sontag, J. Math. Biol. 2008), mass action, invented rate constants 2, 1, 3 | 5/2, 1/2, 4 | 3/2, 1, 2 | 1, 1/3, 5/4 and totals E 1/2, F 1/3, S 3";
  const ssText = "steady state: ODEs of all species but E, F, S0, then conservation of E, F and total S";
  for (const order of ["grevlex", "lex"] as const) {
    out.push({ name: `phospho-1site-${order}`, quick: true, file: toFile(one, order, [oneText, ssText, generated]) });
    out.push({ name: `phospho-2site-${order}`, quick: order === "grevlex", file: toFile(two, order, [twoText, ssText, generated]) });
  }
  const symbolic = phosphorylationTwoSiteSymbolic();
  const symbolicText = [
    "two-site distributive phosphorylation cycle (Wang and Sontag, J. Math. Biol. 2008), mass action, rate constants k1..k12 and totals symbolic",
    "species eliminated in lex, parameters k1..k12, Etot, Ftot, Stot below them in grevlex: the brute-force block order of issue 4",
  ];
  out.push({ name: "phospho-2site-symbolic", quick: false, extra: true, file: toFile(symbolic, "lex(9), grevlex(15)", [...symbolicText, ssText, generated]) });
  // The issue-11 block-order targets: species in lex above a few symbolic constants in grevlex.
  const parametric: { name: string; n: number; symbolic: string[]; totals: boolean; extra: boolean }[] = [
    { name: "phospho-2site-k3k6", n: 2, symbolic: ["k3", "k6"], totals: false, extra: false },
    { name: "phospho-2site-k2k5", n: 2, symbolic: ["k2", "k5"], totals: false, extra: false },
    { name: "phospho-2site-k1k4", n: 2, symbolic: ["k1", "k4"], totals: false, extra: false },
    { name: "phospho-2site-totals", n: 2, symbolic: [], totals: true, extra: false },
    { name: "phospho-3site-k3k6", n: 3, symbolic: ["k3", "k6"], totals: false, extra: true },
    { name: "phospho-3site-k3k6k9", n: 3, symbolic: ["k3", "k6", "k9"], totals: false, extra: true },
    { name: "phospho-4site-k3k6", n: 4, symbolic: ["k3", "k6"], totals: false, extra: true },
  ];
  for (const p of parametric) {
    const sys = phosphorylationNSiteParametric(p.n, p.symbolic, p.totals);
    const nspecies = 3 * p.n + 3;
    const text = `${p.n}-site distributive phosphorylation cycle (Wang and Sontag, J. Math. Biol. 2008), mass action, invented constants, symbolic: ${[...p.symbolic, ...(p.totals ? ["Etot", "Ftot", "Stot"] : [])].join(", ")}`;
    out.push({ name: p.name, quick: false, extra: p.extra, file: toFile(sys, `lex(${nspecies}), grevlex(${sys.vars.length - nspecies})`, [text, "species eliminated in lex above the symbolic constants in grevlex", ssText, generated]) });
  }
  const measuredText = "4-site distributive phosphorylation cycle (Wang and Sontag, J. Math. Biol. 2008), mass action, invented constants with four significant digits (k_i = ((7919·i) mod 9000 + 1000)/1000), totals E 5.3, F 1.21, S 0.97";
  out.push({ name: "phospho-4site-measured", quick: false, extra: true, file: toFile(phosphorylationNSiteMeasured(4), "grevlex", [measuredText, ssText, "saturated: 1 - t_sat * (product of the species), positive concentrations only", generated]) });
  return out;
}


/**
 * The systems a run covers: the named ones (`--only`, extras allowed), else the quick set, else
 * everything but the extras. Unknown names throw, listing the known ones.
 * Example: selectSystems(all, ["katsura-5"], false) is just katsura-5.
 */
export function selectSystems(all: readonly BenchSystem[], only: readonly string[] | undefined, quick: boolean): BenchSystem[] {
  if (only) {
    const known = new Set(all.map((s) => s.name));
    const unknown = only.filter((n) => !known.has(n));
    if (unknown.length > 0) throw new RangeError(`unknown system(s) ${unknown.join(", ")}; known: ${[...known].join(", ")}`);
    return all.filter((s) => only.includes(s.name));
  }
  return all.filter((s) => !s.extra && (s.quick || !quick));
}
