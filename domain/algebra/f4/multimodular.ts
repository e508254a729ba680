import type { MonomialComparator, OrderSpec } from "../order";
import { makeComparator } from "../order";
import type { Polynomial } from "../polynomial";
import { normalizeTerms } from "../polynomial";
import type { Rational } from "../rational";
import { gcdBig, rational } from "../rational";
import { integerCoefficients } from "../groebner/coefficients";
import { clearDenominators, toEngine } from "../groebner/convert";
import type { Limits } from "../groebner/limits";
import type { EPoly } from "../groebner/reduce";
import { ReductionKernel, toReducer } from "../groebner/reduce";
import { verifyGroebner } from "../groebner/verify";
import type { F4Poly, F4Stats } from "./f4";
import { f4ModP } from "./f4";
import { AlgebraError } from "../errors";
import { isPrime } from "../field";
import { F4_MAX_PRIME, invModP, primesBelow } from "./modp";
import { MonomialTable } from "./monomial-table";
import { isGradedOrder } from "./prime-field";
import { bitLength, crtStep, mqrr, rationalModP } from "./reconstruction";

/**
 * Primes for lifting: below 2^21, so p² < 2^42 and a dense row takes ~2000 additions before an
 * entry needs reducing (modp.ts). Measured here on katsura-7 mod p (one F4 run, busy machine):
 * about 0.7 s for p < 2^20 against 1.2 s for p < 2^26, which outweighs the 24 % more primes.
 */
const LIFT_PRIME_LIMIT = 2 ** 21;

/** Where the time of a multi-modular run went (ms), for the bench and the tests. */
export interface MultiModularStats {
  primes: number;
  unlucky: number;
  modularMs: number;
  liftMs: number;
  proofMs: number;
  /** Of proofMs: Buchberger's criterion (step 1). */
  criterionMs?: number;
  /** Which proof step failed, when the result could not be proven (the caller falls back). */
  failed?: "groebner" | "inputs" | "hilbert" | "membership" | "primes";
}

export interface MultiModularOptions {
  /** Most primes to try before giving up (the caller falls back to another method). */
  readonly maxPrimes?: number;
  readonly stats?: MultiModularStats;
  /**
   * A proven Gröbner basis of the same ideal in another order of the same variables (in practice
   * grevlex, computed first). With it, proof step 3 is ideal membership instead of Hilbert
   * functions, so orders that are not degree-compatible (lex, block orders) can be lifted too.
   */
  readonly reference?: readonly Polynomial<Rational>[];
}

interface Lifted {
  mons: number[];
  index: Map<number, number>;
  vals: bigint[];
}

interface Group {
  count: number;
  M: bigint;
  elems: Lifted[];
  candidate: LiftedBasis | null;
  /** Where reconstruction failed last time: tried first next time (cheap early exit). */
  failedAt: [number, number];
}

/**
 * The inputs of a multi-modular run as plain data (structured-clonable: bigints and typed arrays),
 * so that prime images can be computed elsewhere (another thread or process) from it alone.
 * `polys`: over Z (denominators cleared), nonzero, terms decreasing in `order`, exponents packed
 * `[degree, e_1..e_n]` per term (the engine layout).
 */
export interface MultiModularProblem {
  readonly n: number;
  readonly order: OrderSpec;
  readonly polys: readonly { readonly coeffs: readonly bigint[]; readonly exps: Int32Array }[];
}

/** A polynomial with packed exponents (terms decreasing) and coefficients of type C. */
export interface PackedPoly<C> {
  readonly exps: Int32Array;
  readonly coeffs: C;
}

/** The reduced Gröbner basis modulo `p` (monic residues, sorted by increasing leading monomial). */
export interface PrimeImage {
  readonly p: number;
  readonly basis: readonly PackedPoly<Int32Array>[];
}

/** A lifted candidate basis over Q, in the order of the images (not yet proven). */
export type LiftedBasis = readonly PackedPoly<readonly Rational[]>[];

/** Reusable per-process scratch for imageModPrime (the monomial table of the problem's ring). */
export interface ImageWorkspace {
  readonly table: MonomialTable;
  readonly inputMons: Int32Array[];
}

export function multiModularProblem(polys: readonly Polynomial<Rational>[]): MultiModularProblem {
  const ring = polys[0].ring;
  const integer = polys.filter((p) => p.coeffs.length > 0).map((p) => clearDenominators(toEngine(p)));
  return { n: ring.n, order: ring.order, polys: integer.map((f) => ({ coeffs: f.coeffs, exps: f.exps })) };
}

const isGradedSpec = (order: OrderSpec): boolean => order.length === 1 && (order[0].kind === "grlex" || order[0].kind === "grevlex");

export function imageWorkspace(problem: MultiModularProblem): ImageWorkspace {
  const T = new MonomialTable(problem.n);
  const inputMons = problem.polys.map((f) => {
    const mons = new Int32Array(f.coeffs.length);
    for (let t = 0; t < mons.length; t++) mons[t] = T.intern(f.exps, t * (problem.n + 1));
    return mons;
  });
  return { table: T, inputMons };
}

/**
 * Step one of a multi-modular run, for one prime p < 2^26: the reduced basis of the inputs modulo p
 * by F4 (selection by sugar for orders that are not degree-compatible). Null when p divides a
 * leading coefficient (the leading monomial would change: such a prime is skipped, not counted).
 * `workspace` (optional) keeps the monomial table between calls in one process.
 */
export function imageModPrime(
  problem: MultiModularProblem,
  p: number,
  options: { readonly limits?: Limits; readonly prime?: { readonly k: number; readonly of: number }; readonly stats?: F4Stats } = {},
  workspace: ImageWorkspace = imageWorkspace(problem),
): PrimeImage | null {
  if (!(p < F4_MAX_PRIME) || !isPrime(p)) throw new AlgebraError("domain", `imageModPrime: ${p} is not a prime below 2^26`);
  const P = BigInt(p);
  if (problem.polys.some((f) => f.coeffs[0] % P === 0n)) return null;
  const T = workspace.table;
  const input: F4Poly[] = problem.polys.map((f, i) => {
    const coeffs = new Int32Array(f.coeffs.length);
    for (let t = 0; t < coeffs.length; t++) {
      let c = Number(f.coeffs[t] % P);
      if (c < 0) c += p;
      coeffs[t] = c;
    }
    return dropZeros(workspace.inputMons[i], coeffs);
  });
  const cmp = makeComparator(problem.order, problem.n);
  const Gp = f4ModP(input, T, p, cmp, { limits: options.limits, sugared: !isGradedSpec(problem.order), prime: options.prime }, options.stats);
  return { p, basis: Gp.map((g) => ({ exps: T.packed(g.mons), coeffs: g.coeffs })) };
}

/**
 * Step two: Chinese remaindering of prime images and rational reconstruction. Images are grouped
 * by their leading-monomial sets; the most frequent set wins and the others count as unlucky
 * (Arnold 2003: a lucky prime's leading monomials are those of the basis over Q, and all but
 * finitely many primes are lucky — recalled from memory). `add` returns the lifted basis once a candidate
 * reconstructed from the earlier images agrees with the new image (a fresh prime), else null.
 */
export class ImageLifter {
  private readonly groups = new Map<string, Group>();
  private readonly T: MonomialTable;
  private count = 0;
  /** Images added, and how many of them are outside the winning group (unlucky so far). */
  images = 0;
  unlucky = 0;

  constructor(private readonly n: number, private readonly tick: () => void = () => {}) {
    this.T = new MonomialTable(n);
  }

  add(image: PrimeImage): LiftedBasis | null {
    const T = this.T, S = this.n + 1;
    this.images = ++this.count;
    const Gp: F4Poly[] = image.basis.map((g) => {
      const mons = new Int32Array(g.coeffs.length);
      for (let t = 0; t < mons.length; t++) mons[t] = T.intern(g.exps, t * S);
      return { mons, coeffs: g.coeffs };
    });
    const key = Gp.map((g) => g.mons[0]).join(",");
    let group = this.groups.get(key);
    if (group && group.candidate && agreesModP(group.candidate, Gp, image.p, T)) return group.candidate;
    if (!group) {
      group = { count: 0, M: 1n, elems: Gp.map(() => ({ mons: [], index: new Map(), vals: [] })), candidate: null, failedAt: [0, 0] };
      this.groups.set(key, group);
    }
    combine(group, Gp, image.p);
    let best: Group = group;
    for (const g of this.groups.values()) if (g.count > best.count) best = g;
    this.unlucky = this.count - best.count;
    if (best === group) group.candidate = reconstruct(group, T, this.tick);
    return null;
  }
}

/**
 * Reduced Gröbner basis over Q by multi-modular F4 (Arnold, "Modular algorithms for computing
 * Gröbner bases", J. Symbolic Comput. 35, 2003; Idrees, Pfister and Steidel, "Parallelization of
 * modular algorithms", J. Symbolic Comput. 46, 2011): the reduced basis modulo primes p < 2^21 by
 * F4 (imageModPrime); primes whose leading-monomial set is not the most frequent one are unlucky
 * and set aside; the coefficients of the others are combined by the Chinese remainder theorem and
 * lifted to Q by maximal-quotient rational reconstruction (ImageLifter); the lift counts once it
 * agrees with the basis modulo a fresh prime. Then it is **proven**, exactly (proveLiftedBasis):
 *  1. G is a Gröbner basis: Buchberger's criterion with the Gebauer–Möller (chain) criteria,
 *     every remaining S-polynomial top-reduces to zero over Z (groebner/verify.ts);
 *  2. ⟨F⟩ ⊆ ⟨G⟩: every input reduces to zero modulo G;
 *  3. ⟨G⟩ ⊆ ⟨F⟩, by Hilbert functions (graded orders): for the homogenised inputs F^h in
 *     Q[x, h] (degree, then the ring's order on the x-part: grevlex with h last for grevlex) and every degree d, dim_Q ⟨F^h⟩_d ≥ dim_{Z/p} ⟨F^h mod p⟩_d, since
 *     the degree-d Macaulay matrix has integer entries and its rank can only drop modulo p; the
 *     latter is the number of degree-d monomials in LM(⟨F^h mod p⟩), computed by one more F4 run
 *     modulo p (hilbertLeads). If every LM(g), g ∈ G, is a multiple of an h-free leading monomial of that basis,
 *     this number is at least #{monomials of degree ≤ d in ⟨LM(G)⟩} = dim ⟨G⟩_{≤d} (G a Gröbner
 *     basis in a degree-compatible order). Dehomogenising maps ⟨F^h⟩_d injectively into
 *     ⟨F⟩_{≤d}, so dim ⟨F⟩_{≤d} ≥ dim ⟨G⟩_{≤d}; with ⟨F⟩ ⊆ ⟨G⟩ (step 2) both are equal for
 *     every d, hence ⟨F⟩ = ⟨G⟩. (The homogeneous case of this argument is Arnold 2003, Thm. 5.6 —
 *     theorem number recalled from memory; the inhomogeneous extension is worked out here.)
 *     For lex and block orders, given `reference` (a proven Gröbner basis R of ⟨F⟩ in grevlex):
 *     every g ∈ G reduces to zero modulo R, i.e. g ∈ ⟨R⟩ = ⟨F⟩ (Cox, Little, O'Shea, ch. 2 §6,
 *     Corollary 2: the remainder on division by a Gröbner basis decides membership).
 * Step 3 cannot be skipped for inhomogeneous ideals even when G modulo a lucky-looking prime is
 * that prime's reduced basis: F = {x*y^2 + p*y^3 + y, x} generates ⟨x, y^3 + y/p⟩ over Q, while
 * modulo p it gives ⟨x, y⟩ and G = {x, y} passes steps 1 and 2 (worked out here).
 * Returns null when a step cannot be completed (the caller then uses the traced Buchberger path,
 * which is proven by construction); `stats.failed` says which.
 *
 * Example: katsura-7 (8 variables, grevlex, 74 elements) lifts from 18 primes below 2^21; cyclic-5
 * declines at step 3 (its homogenised ideal is not saturated).
 */
export function multiModularGroebnerQQ(
  polys: readonly Polynomial<Rational>[],
  limits: Limits,
  options: MultiModularOptions = {},
): Polynomial<Rational>[] | null {
  const ring = polys[0].ring;
  const stats: MultiModularStats = options.stats ?? { primes: 0, unlucky: 0, modularMs: 0, liftMs: 0, proofMs: 0 };
  const maxPrimes = options.maxPrimes ?? 1000;
  const graded = isGradedOrder(ring as Polynomial<unknown>["ring"]);
  if (!graded && !options.reference) return null;
  const problem = multiModularProblem(polys);
  const workspace = imageWorkspace(problem);
  const lifter = new ImageLifter(ring.n, () => limits.checkTime());
  const f4stats: F4Stats = { matrices: 0, rows: 0, maxRows: 0, maxColumns: 0 };
  let result: LiftedBasis | null = null;
  let hFree: HFreeLeads | null = null;
  let k = 0;
  for (const p of primesBelow(LIFT_PRIME_LIMIT)) {
    if (k >= maxPrimes) { stats.failed = "primes"; return null; }
    limits.checkTime();
    const t0 = Date.now();
    const image = imageModPrime(problem, p, { limits, prime: { k: k + 1, of: maxPrimes }, stats: f4stats }, workspace);
    if (image === null) continue;
    k++;
    stats.primes = k;
    if (graded && hFree === null) {
      // Step 3 first, as it needs only residues: when it cannot succeed, do not lift at all.
      const th = Date.now();
      hFree = hilbertLeads(problem, p, limits);
      stats.proofMs += Date.now() - th;
      if (!leadsCovered(image.basis.map((g) => g.exps), hFree)) { stats.failed = "hilbert"; return null; }
    }
    stats.modularMs += Date.now() - t0;
    const t1 = Date.now();
    result = lifter.add(image);
    stats.unlucky = lifter.unlucky;
    stats.liftMs += Date.now() - t1;
    if (result) break;
  }
  if (!result) return null;

  const t2 = Date.now();
  const proven = proveLiftedBasis(problem, result, graded ? { hFree: hFree! } : { reference: options.reference! }, limits, stats);
  stats.proofMs += Date.now() - t2;
  if (!proven) return null;
  return proven.map((g) => normalizeTerms(ring, g.coeffs as Rational[], g.exps.slice()));
}

function dropZeros(mons: Int32Array, coeffs: Int32Array): F4Poly {
  let nz = 0;
  for (let t = 0; t < coeffs.length; t++) if (coeffs[t] !== 0) nz++;
  if (nz === coeffs.length) return { mons, coeffs };
  const m = new Int32Array(nz), c = new Int32Array(nz);
  for (let t = 0, k = 0; t < coeffs.length; t++) if (coeffs[t] !== 0) { m[k] = mons[t]; c[k] = coeffs[t]; k++; }
  return { mons: m, coeffs: c };
}

/** Adds the residues of G mod p to the group's lifted coefficients (CRT). */
function combine(group: Group, Gp: readonly F4Poly[], p: number): void {
  const M = group.M;
  const mInv = group.count === 0 ? 0 : invModP(Number(M % BigInt(p)), p);
  Gp.forEach((g, e) => {
    const L = group.elems[e];
    const seen = new Set<number>();
    for (let t = 0; t < g.mons.length; t++) {
      const m = g.mons[t];
      seen.add(m);
      let i = L.index.get(m);
      if (i === undefined) { i = L.mons.length; L.index.set(m, i); L.mons.push(m); L.vals.push(0n); }
      L.vals[i] = group.count === 0 ? BigInt(g.coeffs[t]) : crtStep(L.vals[i], M, g.coeffs[t], p, mInv);
    }
    if (group.count > 0) {
      for (let i = 0; i < L.mons.length; i++) if (!seen.has(L.mons[i])) L.vals[i] = crtStep(L.vals[i], M, 0, p, mInv);
    }
  });
  group.M = M * BigInt(p);
  group.count++;
}

function reconstruct(group: Group, T: MonomialTable, tick: () => void): LiftedBasis | null {
  const M = group.M, logm = bitLength(M);
  // Start where the last attempt failed: the coefficients before it reconstructed then and
  // usually do again, so a run of failing attempts costs about one pass in all, not one each.
  const [fe, ft] = group.failedAt;
  const E = group.elems.length;
  const out: PackedPoly<Rational[]>[] = new Array(E);
  let work = 0;
  for (let s = 0; s < E; s++) {
    const e = (fe + s) % E;
    const L = group.elems[e];
    const len = L.vals.length;
    const r0 = s === 0 ? ft : 0;
    const rec: (Rational | null)[] = new Array(len);
    for (let i0 = 0; i0 < len; i0++) {
      const i = (r0 + i0) % len;
      if ((++work & 255) === 0) tick();
      const r = mqrr(L.vals[i], M, logm);
      if (r === null) { group.failedAt = [e, i]; return null; }
      rec[i] = r;
    }
    const coeffs: Rational[] = [];
    const mons: number[] = [];
    for (let i = 0; i < len; i++) {
      if (rec[i]!.num === 0n) continue;
      coeffs.push(rec[i]!);
      mons.push(L.mons[i]);
    }
    out[e] = { exps: T.packed(mons), coeffs };
  }
  return out;
}

function agreesModP(cand: LiftedBasis, Gp: readonly F4Poly[], p: number, T: MonomialTable): boolean {
  if (cand.length !== Gp.length) return false;
  const P = BigInt(p), S = T.S;
  for (let e = 0; e < Gp.length; e++) {
    const g = Gp[e], c = cand[e];
    const got = new Map<number, number>();
    for (let t = 0; t < c.coeffs.length; t++) {
      const v = rationalModP(c.coeffs[t], p, P);
      if (v === null) return false;
      if (v !== 0) got.set(T.intern(c.exps, t * S), v);
    }
    if (got.size !== g.mons.length) return false;
    for (let t = 0; t < g.mons.length; t++) if (got.get(g.mons[t]) !== g.coeffs[t]) return false;
  }
  return true;
}

/**
 * Step three: the proof of multiModularGroebnerQQ's docblock, exactly. Returns the proven reduced
 * basis (monic, sorted by increasing leading monomial) or null when a step fails (`stats.failed`).
 * `containment`: the h-free leads of hilbertLeads (graded orders) or a proven grevlex basis.
 */
export function proveLiftedBasis(
  problem: MultiModularProblem,
  lifted: LiftedBasis,
  containment: { hFree: HFreeLeads } | { reference: readonly Polynomial<Rational>[] },
  limits: Limits,
  stats?: MultiModularStats,
): LiftedBasis | null {
  const n = problem.n, cmp = makeComparator(problem.order, n), K = integerCoefficients, S = n + 1;
  const fail = (step: NonNullable<MultiModularStats["failed"]>) => { if (stats) stats.failed = step; return null; };
  const G = lifted.map((g) => {
    // Terms in decreasing order, monic.
    const order = Array.from(g.coeffs.keys()).sort((a, b) => cmp(g.exps, b * S, g.exps, a * S));
    const exps = new Int32Array(g.exps.length);
    order.forEach((t, k) => exps.set(g.exps.subarray(t * S, t * S + S), k * S));
    const lc = g.coeffs[order[0]];
    return { exps, coeffs: order.map((t) => divQ(g.coeffs[t], lc)) };
  });
  G.sort((a, b) => cmp(a.exps, 0, b.exps, 0));
  const Gz = G.map((g) => {
    const z = integerMultiple(g.coeffs);
    K.normalize(z, () => limits.checkTime()); // primitive: smaller numbers in the reductions
    return { coeffs: z, exps: g.exps };
  });
  const tv = Date.now();
  if (!verifyGroebner(Gz, K, n, cmp, limits)) return fail("groebner");
  if (stats) stats.criterionMs = Date.now() - tv;
  const reducers = Gz.map((g) => toReducer(g, n));
  const top = new ReductionKernel(K, n, cmp, () => limits.checkTime(), false);
  for (const f of problem.polys) {
    const coeffs = f.coeffs.slice();
    if (top.reduce({ coeffs, exps: f.exps }, reducers, false).coeffs.length !== 0) return fail("inputs");
  }
  if ("hFree" in containment) {
    if (!leadsCovered(G.map((g) => g.exps), containment.hFree)) return fail("hilbert");
  } else if (!allMembers(Gz, containment.reference, limits)) return fail("membership");
  return G;
}

function divQ(a: Rational, b: Rational): Rational {
  return rational(a.num * b.den, a.den * b.num);
}

/** The rationals times the lcm of their denominators (integers). */
function integerMultiple(cs: readonly Rational[]): bigint[] {
  let L = 1n;
  for (const c of cs) L = (L / gcdBig(L, c.den)) * c.den;
  return cs.map((c) => c.num * (L / c.den));
}

/** Does every polynomial of `polys` (engine form, this ring's order) lie in the ideal of the Gröbner basis `reference`? */
function allMembers(polys: readonly EPoly<bigint>[], reference: readonly Polynomial<Rational>[], limits: Limits): boolean {
  const refRing = reference[0].ring;
  const n = refRing.n, S = n + 1, K = integerCoefficients;
  const reducers = reference.map((r) => {
    const z = clearDenominators(toEngine(r));
    K.normalize(z.coeffs, () => limits.checkTime());
    return toReducer(z, n);
  });
  const top = new ReductionKernel(K, n, refRing.cmp, () => limits.checkTime(), false);
  for (const g of polys) {
    // The same polynomial with its terms in the reference's order.
    const order = Array.from(g.coeffs.keys()).sort((a, b) => refRing.cmp(g.exps, b * S, g.exps, a * S));
    const exps = new Int32Array(g.exps.length);
    order.forEach((t, k) => exps.set(g.exps.subarray(t * S, t * S + S), k * S));
    if (top.reduce({ coeffs: order.map((t) => g.coeffs[t]), exps }, reducers, false).coeffs.length !== 0) return false;
  }
  return true;
}

/** The h-free leading monomials of the reduced basis of F^h mod p (grevlex, h last), as packed x-monomials. */
export interface HFreeLeads {
  readonly n: number;
  readonly leads: Int32Array[];
}

/** Step 3: is every leading monomial (packed, at offset 0) a multiple of an h-free leading monomial? */
export function leadsCovered(lms: readonly Int32Array[], h: HFreeLeads): boolean {
  const n = h.n;
  return lms.every((lm) => h.leads.some((m) => {
    for (let k = 1; k <= n; k++) if (m[k] > lm[k]) return false;
    return true;
  }));
}

/** The data of proof step 3 for graded orders: one F4 run of the homogenised inputs modulo p. */
export function hilbertLeads(problem: MultiModularProblem, p: number, limits: Limits): HFreeLeads {
  const integer = problem.polys, grlex = problem.order[0].kind === "grlex";
  const n = problem.n;
  const S = n + 1, Sh = n + 2;
  const T = new MonomialTable(n + 1);
  const P = BigInt(p);
  const e = new Int32Array(Sh);
  const homog: F4Poly[] = [];
  for (const f of integer) {
    let D = 0;
    for (let t = 0; t < f.coeffs.length; t++) D = Math.max(D, f.exps[t * S]);
    const mons: number[] = [], coeffs: number[] = [];
    for (let t = 0; t < f.coeffs.length; t++) {
      let c = Number(f.coeffs[t] % P);
      if (c < 0) c += p;
      if (c === 0) continue;
      for (let k = 0; k < S; k++) e[k] = f.exps[t * S + k];
      e[0] = D;
      e[n + 1] = D - f.exps[t * S];
      mons.push(T.intern(e, 0));
      coeffs.push(c);
    }
    if (mons.length === 0) continue;
    // Terms are re-sorted below in the homogenised order.
    homog.push({ mons: Int32Array.from(mons), coeffs: Int32Array.from(coeffs) });
  }
  // The homogenised order: degree, then the ring's order on the x-part (for grevlex this is grevlex with h last).
  const cmpH: MonomialComparator = grlex
    ? (a, ia, b, ib) => {
      const dd = a[ia] - b[ib];
      if (dd !== 0) return dd;
      const dx = (a[ia] - a[ia + n + 1]) - (b[ib] - b[ib + n + 1]);
      if (dx !== 0) return dx;
      for (let k = 1; k <= n; k++) if (a[ia + k] !== b[ib + k]) return a[ia + k] - b[ib + k];
      return 0;
    }
    : makeComparator([{ kind: "grevlex" }], n + 1);
  const mcmp = T.comparator(cmpH);
  for (const f of homog) {
    const order = Array.from(f.mons.keys()).sort((a, b) => mcmp(f.mons[b], f.mons[a]));
    const mons = order.map((i) => f.mons[i]), coeffs = order.map((i) => f.coeffs[i]);
    (f as { mons: Int32Array }).mons = Int32Array.from(mons);
    (f as { coeffs: Int32Array }).coeffs = Int32Array.from(coeffs);
  }
  const H = f4ModP(homog, T, p, cmpH, { limits });
  const leads = H.map((h) => h.mons[0]).filter((m) => T.exps[m * Sh + n + 1] === 0).map((m) => T.exps.slice(m * Sh, m * Sh + S));
  return { n, leads };
}
