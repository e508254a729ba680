import type { MonomialComparator } from "../order";
import { makeComparator } from "../order";
import type { Polynomial } from "../polynomial";
import { normalizeTerms } from "../polynomial";
import type { Rational } from "../rational";
import { integerCoefficients } from "../groebner/coefficients";
import { clearDenominators, toEngine } from "../groebner/convert";
import type { Limits } from "../groebner/limits";
import type { EPoly } from "../groebner/reduce";
import { verifyGroebner } from "../groebner/verify";
import { ZeroTest } from "../groebner/zero-test";
import type { F4Poly, F4Stats } from "./f4";
import { f4ModP } from "./f4";
import { invModP } from "./modp";
import { primesBelow } from "./modp";
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
  /**
   * Prove a reconstructed candidate at once instead of first checking it against the basis modulo
   * one more prime (a wrong candidate fails the proof, and more primes follow). Pays when the proof
   * costs less than an image, as in block orders (two-site cycle, k3 and k6 symbolic: an image
   * ~60 ms, the proof with `reference` ~100 ms, but the check prime is one of six images).
   */
  readonly proveEarly?: boolean;
  /** Primes below this bound (default LIFT_PRIME_LIMIT, at most 2^26 for f4.ts). */
  readonly primeLimit?: number;
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
  candidate: { mons: number[]; coeffs: Rational[] }[] | null;
  /** Where reconstruction failed last time: tried first next time (cheap early exit). */
  failedAt: [number, number];
}

/**
 * Reduced Gröbner basis over Q by multi-modular F4 (Arnold, "Modular algorithms for computing
 * Gröbner bases", J. Symbolic Comput. 35, 2003; Idrees, Pfister and Steidel, "Parallelization of
 * modular algorithms", J. Symbolic Comput. 46, 2011): the reduced basis modulo primes p < 2^21 by
 * F4 (f4.ts); primes whose leading-monomial set is not the most frequent one are unlucky and set
 * aside; the coefficients of the others are combined by the Chinese remainder theorem and lifted
 * to Q by maximal-quotient rational reconstruction (reconstruction.ts); the lift counts once it
 * agrees with the basis modulo a fresh prime. Then it is **proven**, exactly:
 *  1. G is a Gröbner basis: Buchberger's criterion with the Gebauer–Möller (chain) criteria,
 *     every remaining S-polynomial top-reduces to zero over Z (groebner/verify.ts);
 *  2. ⟨F⟩ ⊆ ⟨G⟩: every input reduces to zero modulo G;
 *  3. ⟨G⟩ ⊆ ⟨F⟩, by Hilbert functions (graded orders): for the homogenised inputs F^h in
 *     Q[x, h] (degree, then the ring's order on the x-part: grevlex with h last for grevlex) and every degree d, dim_Q ⟨F^h⟩_d ≥ dim_{Z/p} ⟨F^h mod p⟩_d, since
 *     the degree-d Macaulay matrix has integer entries and its rank can only drop modulo p; the
 *     latter is the number of degree-d monomials in LM(⟨F^h mod p⟩), computed by one more F4 run
 *     modulo p. If every LM(g), g ∈ G, is a multiple of an h-free leading monomial of that basis,
 *     this number is at least #{monomials of degree ≤ d in ⟨LM(G)⟩} = dim ⟨G⟩_{≤d} (G a Gröbner
 *     basis in a degree-compatible order). Dehomogenising maps ⟨F^h⟩_d injectively into
 *     ⟨F⟩_{≤d}, so dim ⟨F⟩_{≤d} ≥ dim ⟨G⟩_{≤d}; with ⟨F⟩ ⊆ ⟨G⟩ (step 2) both are equal for
 *     every d, hence ⟨F⟩ = ⟨G⟩. (The homogeneous case of this argument is Arnold 2003, Thm. 5.6 —
 *     theorem number recalled from memory; the inhomogeneous extension is worked out here.)
 *     For lex and block orders, given `reference` (a proven Gröbner basis R of ⟨F⟩ in grevlex):
 *     every g ∈ G reduces to zero modulo R, i.e. g ∈ ⟨R⟩ = ⟨F⟩ (Cox, Little, O'Shea, ch. 2 §6,
 *     Corollary 2: the remainder on division by a Gröbner basis decides membership).
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
  const n = ring.n, cmp = ring.cmp;
  const stats: MultiModularStats = options.stats ?? { primes: 0, unlucky: 0, modularMs: 0, liftMs: 0, proofMs: 0 };
  const maxPrimes = options.maxPrimes ?? 1000;
  const graded = isGradedOrder(ring as Polynomial<unknown>["ring"]);
  if (!graded && !options.reference) return null;
  const integer = polys.filter((p) => p.coeffs.length > 0).map((p) => clearDenominators(toEngine(p)));
  const T = new MonomialTable(n);
  const inputMons = integer.map((f) => {
    const mons = new Int32Array(f.coeffs.length);
    for (let t = 0; t < mons.length; t++) mons[t] = T.intern(f.exps, t * (n + 1));
    return mons;
  });
  const groups = new Map<string, Group>();
  const f4stats: F4Stats = { matrices: 0, rows: 0, maxRows: 0, maxColumns: 0 };
  let result: { mons: number[]; coeffs: Rational[] }[] | null = null;
  let hFree: HFreeLeads | null = null;
  let k = 0;
  const finish = (lifted: { mons: number[]; coeffs: Rational[] }[]): Polynomial<Rational>[] | null => {
    const t2 = Date.now();
    const G: Polynomial<Rational>[] = lifted.map((g) => normalizeTerms(ring, g.coeffs, T.packed(g.mons)));
    const proven = prove(G, integer, graded ? { hFree: hFree! } : { reference: options.reference! }, limits, stats);
    stats.proofMs += Date.now() - t2;
    if (!proven) return null;
    G.sort((a, b) => cmp(a.exps, 0, b.exps, 0));
    return G;
  };
  for (const p of primesBelow(options.primeLimit ?? LIFT_PRIME_LIMIT)) {
    if (k >= maxPrimes) { stats.failed = "primes"; return null; }
    limits.checkTime();
    const P = BigInt(p);
    // A prime dividing a leading coefficient changes a leading monomial: unlucky, skip it.
    if (integer.some((f) => f.coeffs[0] % P === 0n)) continue;
    k++;
    stats.primes = k;
    const t0 = Date.now();
    const input: F4Poly[] = integer.map((f, i) => {
      const coeffs = new Int32Array(f.coeffs.length);
      for (let t = 0; t < coeffs.length; t++) {
        let c = Number(f.coeffs[t] % P);
        if (c < 0) c += p;
        coeffs[t] = c;
      }
      return dropZeros(inputMons[i], coeffs);
    });
    const Gp = f4ModP(input, T, p, cmp, { limits, sugared: !graded, prime: { k, of: maxPrimes } }, f4stats);
    if (graded && hFree === null) {
      // Step 3 first, as it needs only residues: when it cannot succeed, do not lift at all.
      const th = Date.now();
      hFree = homogenisedLeads(integer, p, ring.order[0].kind === "grlex", limits);
      stats.proofMs += Date.now() - th;
      if (!leadsCovered(Gp.map((g) => T.packed([g.mons[0]])), hFree)) { stats.failed = "hilbert"; return null; }
    }
    stats.modularMs += Date.now() - t0;
    const t1 = Date.now();
    const key = Gp.map((g) => g.mons[0]).join(",");
    let group = groups.get(key);
    if (group && group.candidate && agreesModP(group.candidate, Gp, p)) {
      result = group.candidate;
      stats.liftMs += Date.now() - t1;
      break;
    }
    if (!group) {
      group = { count: 0, M: 1n, elems: Gp.map(() => ({ mons: [], index: new Map(), vals: [] })), candidate: null, failedAt: [0, 0] };
      groups.set(key, group);
    }
    combine(group, Gp, p);
    let best: Group = group;
    for (const g of groups.values()) if (g.count > best.count) best = g;
    stats.unlucky = k - best.count;
    if (best === group) group.candidate = reconstruct(group, () => limits.checkTime());
    stats.liftMs += Date.now() - t1;
    if (options.proveEarly && best === group && group.candidate) {
      const G = finish(group.candidate);
      if (G) return G;
      group.candidate = null; // wrong: reconstructed from too few primes
      stats.failed = undefined;
    }
  }
  return result ? finish(result) : null;
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

function reconstruct(group: Group, tick: () => void): { mons: number[]; coeffs: Rational[] }[] | null {
  const M = group.M, logm = bitLength(M);
  const [fe, ft] = group.failedAt;
  const first = group.elems[fe]?.vals[ft];
  if (first !== undefined && mqrr(first, M, logm) === null) return null;
  const out: { mons: number[]; coeffs: Rational[] }[] = [];
  for (let e = 0; e < group.elems.length; e++) {
    const L = group.elems[e];
    const coeffs: Rational[] = [];
    const mons: number[] = [];
    for (let i = 0; i < L.vals.length; i++) {
      if ((i & 255) === 0) tick();
      const r = mqrr(L.vals[i], M, logm);
      if (r === null) { group.failedAt = [e, i]; return null; }
      if (r.num === 0n) continue;
      coeffs.push(r);
      mons.push(L.mons[i]);
    }
    out.push({ mons, coeffs });
  }
  return out;
}

function agreesModP(cand: readonly { mons: number[]; coeffs: Rational[] }[], Gp: readonly F4Poly[], p: number): boolean {
  if (cand.length !== Gp.length) return false;
  const P = BigInt(p);
  for (let e = 0; e < Gp.length; e++) {
    const g = Gp[e], c = cand[e];
    const got = new Map<number, number>();
    for (let t = 0; t < c.mons.length; t++) {
      const v = rationalModP(c.coeffs[t], p, P);
      if (v === null) return false;
      if (v !== 0) got.set(c.mons[t], v);
    }
    if (got.size !== g.mons.length) return false;
    for (let t = 0; t < g.mons.length; t++) if (got.get(g.mons[t]) !== g.coeffs[t]) return false;
  }
  return true;
}

/** The three proof steps of multiModularGroebnerQQ's docblock; false when one fails. */
function prove(
  G: readonly Polynomial<Rational>[],
  integer: readonly EPoly<bigint>[],
  containment: { hFree: HFreeLeads } | { reference: readonly Polynomial<Rational>[] },
  limits: Limits,
  stats: MultiModularStats,
): boolean {
  const ring = G[0].ring;
  const n = ring.n, cmp = ring.cmp, K = integerCoefficients;
  const Gz = G.map((g) => {
    const z = clearDenominators(toEngine(g));
    K.normalize(z.coeffs, () => limits.checkTime()); // primitive: smaller numbers in the reductions
    return z;
  });
  Gz.sort((a, b) => cmp(a.exps, 0, b.exps, 0));
  const tv = Date.now();
  if (!verifyGroebner(Gz, K, n, cmp, limits)) { stats.failed = "groebner"; return false; }
  stats.criterionMs = Date.now() - tv;
  const rows = new ZeroTest(Gz, K, n, cmp, () => limits.checkTime());
  if (!integer.every((f) => rows.reducesToZero(f))) { stats.failed = "inputs"; return false; }
  if ("hFree" in containment) {
    if (!leadsCovered(G.map((g) => g.exps), containment.hFree)) { stats.failed = "hilbert"; return false; }
  } else if (!allMembers(Gz, containment.reference, limits)) { stats.failed = "membership"; return false; }
  return true;
}

/** Does every polynomial of `polys` (engine form, this ring's order) lie in the ideal of the Gröbner basis `reference`? */
function allMembers(polys: readonly EPoly<bigint>[], reference: readonly Polynomial<Rational>[], limits: Limits): boolean {
  const refRing = reference[0].ring;
  const n = refRing.n, K = integerCoefficients;
  const reducers = reference.map((r) => {
    const z = clearDenominators(toEngine(r));
    K.normalize(z.coeffs, () => limits.checkTime());
    return z;
  });
  // ZeroTest sorts the terms in the reference's order itself.
  const rows = new ZeroTest(reducers, K, n, refRing.cmp, () => limits.checkTime());
  return polys.every((g) => rows.reducesToZero(g));
}

/** The h-free leading monomials of the reduced basis of F^h mod p (grevlex, h last), as packed x-monomials. */
interface HFreeLeads {
  readonly n: number;
  readonly leads: Int32Array[];
}

/** Step 3: is every leading monomial (packed, at offset 0) a multiple of an h-free leading monomial? */
function leadsCovered(lms: readonly Int32Array[], h: HFreeLeads): boolean {
  const n = h.n;
  return lms.every((lm) => h.leads.some((m) => {
    for (let k = 1; k <= n; k++) if (m[k] > lm[k]) return false;
    return true;
  }));
}

function homogenisedLeads(integer: readonly EPoly<bigint>[], p: number, grlex: boolean, limits: Limits): HFreeLeads {
  const n = (integer[0].exps.length / integer[0].coeffs.length) - 1;
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
