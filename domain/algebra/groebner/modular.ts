import { isPrime } from "../field";
import { lcm, monomialEquals } from "../monomial";
import type { MonomialComparator } from "../order";
import type { Polynomial } from "../polynomial";
import type { Rational } from "../rational";
import type { SelectionStrategy, TraceEvent } from "./buchberger";
import { buchberger, reduceBasis, sortInputs, sPolynomialHead } from "./buchberger";
import { integerCoefficients, primeCoefficients } from "./coefficients";
import { clearDenominators, fromEngine, monicRational, toEngine } from "./convert";
import type { Limits } from "./limits";
import type { EPoly, Kernel, Reducer } from "./reduce";
import { RowKernel } from "./row-kernel";
import { ReductionKernel, toReducer } from "./reduce";
import { verifyGroebner } from "./verify";

/** Primes just below 2^26: products of residues stay below 2^52, so Z/p arithmetic is one multiply. */
export const MODULAR_PRIMES: readonly number[] = (() => {
  const out: number[] = [];
  for (let p = 2 ** 26 - 1; out.length < 4; p -= 2) if (isPrime(p)) out.push(p);
  return out;
})();

/**
 * Reduced Gröbner basis over Q by a traced modular run (in the spirit of Traverso's "Gröbner trace
 * algorithms", ISSAC 1988): Buchberger's algorithm runs modulo a word-size prime and records which
 * steps produce new basis elements; those steps alone are replayed exactly over Z (fraction-free),
 * skipping the many S-polynomials that reduce to zero. The replay builds only elements of the
 * ideal, so it is then enough to prove (1) the inter-reduced result is a Gröbner basis —
 * Buchberger's criterion with Gebauer–Möller pairs, checked exactly (verify.ts) — and (2) every
 * input reduces to zero modulo it. If the prime was unlucky (a step's leading monomial differs
 * or a check fails) another prime is tried, then the plain fraction-free algorithm.
 *
 * `rows` reduces by dense rows (row-kernel.ts) in both runs: the same steps, faster on long
 * remainders (block orders); the merge kernel stays the default here.
 *
 * Example: for cyclic-6 (grevlex) this replays 124 of 469 reductions.
 */
export function modularGroebnerQQ(polys: readonly Polynomial<Rational>[], strategy: SelectionStrategy, limits: Limits, options: { rows?: boolean } = {}): Polynomial<Rational>[] {
  const ring = polys[0].ring;
  const n = ring.n, cmp = ring.cmp;
  const integer = polys.filter((p) => p.coeffs.length > 0).map((p) => clearDenominators(toEngine(p)));
  for (const p of MODULAR_PRIMES.slice(0, 2)) {
    const P = BigInt(p);
    const modular: EPoly<number>[] = [];
    let lucky = true;
    for (const f of integer) {
      if (f.coeffs[0] % P === 0n) { lucky = false; break; } // the leading monomial would change
      modular.push(reduceModP(f, P, n));
    }
    if (!lucky) continue;
    const trace: TraceEvent[] = [];
    buchberger(modular, primeCoefficients(p), n, cmp, { strategy, limits, trace, rows: options.rows });
    const G = replayOverZ(integer, trace, n, cmp, limits, options.rows === true);
    if (G) return G.map((g) => fromEngine(ring, monicRational(g, () => limits.checkTime())));
  }
  return plainFractionFree(integer, ring, strategy, limits);
}

export function plainFractionFree(integer: EPoly<bigint>[], ring: Polynomial<Rational>["ring"], strategy: SelectionStrategy, limits: Limits): Polynomial<Rational>[] {
  const basis = buchberger(integer, integerCoefficients, ring.n, ring.cmp, { strategy, limits });
  return basis.map((p) => fromEngine(ring, monicRational(p, () => limits.checkTime())));
}

function reduceModP(f: EPoly<bigint>, P: bigint, n: number): EPoly<number> {
  const S = n + 1;
  const coeffs: number[] = [];
  const exps: number[] = [];
  for (let t = 0; t < f.coeffs.length; t++) {
    let c = f.coeffs[t] % P;
    if (c < 0n) c += P;
    if (c === 0n) continue;
    coeffs.push(Number(c));
    for (let k = 0; k < S; k++) exps.push(f.exps[t * S + k]);
  }
  return { coeffs, exps: Int32Array.from(exps) };
}

/** Replays the useful steps over Z; null when the prime turns out unlucky or a proof obligation fails. */
function replayOverZ(
  integer: readonly EPoly<bigint>[],
  trace: readonly TraceEvent[],
  n: number,
  cmp: MonomialComparator,
  limits: Limits,
  rows: boolean,
): EPoly<bigint>[] | null {
  const K = integerCoefficients;
  const kernel: Kernel<bigint> = rows ? new RowKernel(K, n, cmp, () => limits.checkTime()) : new ReductionKernel(K, n, cmp, () => limits.checkTime());
  const inputs = integer.map((f) => {
    const coeffs = f.coeffs.slice();
    K.normalize(coeffs);
    return { coeffs, exps: f.exps };
  });
  sortInputs(inputs, cmp);
  const basis: EPoly<bigint>[] = [];
  const live: boolean[] = [];
  let reducers: Reducer<bigint>[] = [];
  for (const ev of trace) {
    limits.checkTime();
    const h = ev.kind === "input"
      ? kernel.reduce(inputs[ev.input], reducers, true)
      : kernel.reduce(sPolynomialHead(basis[ev.i], lcm(basis[ev.i].exps, 0, basis[ev.j].exps, 0, n), n), reducers, true, basis[ev.j]);
    if (h.coeffs.length === 0 || !monomialEquals(h.exps, 0, ev.lm, 0, n)) return null;
    if (h.exps[0] === 0) return [{ coeffs: [1n], exps: new Int32Array(n + 1) }]; // 1 is in the ideal, by construction
    for (let k = 0; k < basis.length; k++) if (live[k] && dividesLm(h, basis[k], n)) live[k] = false;
    basis.push(h);
    live.push(true);
    reducers = basis.filter((_, k) => live[k]).map((g) => toReducer(g, n));
  }
  const G = reduceBasis(basis.filter((_, k) => live[k]), K, n, cmp, kernel);
  if (!verifyGroebner(G, K, n, cmp, limits)) return null;
  const Gred = G.map((g) => toReducer(g, n));
  const top = new ReductionKernel(K, n, cmp, () => limits.checkTime(), false);
  for (const f of inputs) if (top.reduce(f, Gred, false).coeffs.length !== 0) return null;
  return G;
}

function dividesLm<C>(a: EPoly<C>, b: EPoly<C>, n: number): boolean {
  for (let k = 0; k <= n; k++) if (a.exps[k] > b.exps[k]) return false;
  return true;
}
