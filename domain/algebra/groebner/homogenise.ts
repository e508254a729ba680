import { AlgebraError } from "../errors";
import { primeField } from "../field";
import { f4GroebnerModP } from "../f4/prime-field";
import { rationalModP } from "../f4/reconstruction";
import type { OrderSpec } from "../order";
import type { Polynomial } from "../polynomial";
import { normalizeTerms } from "../polynomial";
import type { Rational } from "../rational";
import { PolynomialRing } from "../ring";
import { reduceBasis } from "./buchberger";
import { integerCoefficients } from "./coefficients";
import { clearDenominators, fromEngine, monicRational, toEngine } from "./convert";
import type { Limits } from "./limits";
import { MODULAR_PRIMES } from "./modular";
import { ReductionKernel } from "./reduce";

/**
 * The homogenised route to a grevlex Gröbner basis over Q (Cox, Little, O'Shea, "Ideals,
 * Varieties, and Algorithms", 4th ed. 2015, ch. 8 §4: homogenisation of ideals and the order
 * >_h, Theorem 4 there being "G a Gröbner basis of I in a graded order ⇒ G^h a basis of I^h" —
 * section and numbering recalled from memory; step 3's converse argument is worked out here):
 *  1. F^h in Q[x_1..x_n, h]: each f times h^(deg f − deg term) per term, with h a new last
 *     (smallest) variable, grevlex. For monomials of one total degree grevlex with h last
 *     compares the h-exponents first (smaller wins), i.e. the x-degrees, then grevlex on the
 *     x-part: this is CLO's >_h built from grevlex.
 *  2. G^h, the reduced basis of ⟨F^h⟩, computed by any engine (a homogeneous input).
 *  3. Dehomogenise, h = 1: every g(x, 1) lies in ⟨F⟩ (substitute h = 1 in a combination of F^h).
 *     They form a Gröbner basis of ⟨F⟩: for f ∈ ⟨F⟩ some h^k·f^h ∈ ⟨F^h⟩ (dehomogenise then
 *     homogenise; the h^k comes from cancelled top degrees), so some LM(g) divides LM(h^k·f^h);
 *     under >_h leading monomials commute with h = 1 (LM(g)(x,1) = LM(g(x,1)), since grevlex with
 *     h last picks the term with the least h-power, the one of highest x-degree, and breaks ties
 *     by grevlex on x), so LM(g(x,1)) divides LM(f).
 *  4. Inter-reduction to the reduced basis (reduceBasis), which is unique: the same as any
 *     other route's.
 * Unlike the Hilbert proof of f4/multimodular.ts (which needs ⟨F^h⟩ saturated w.r.t. h), this
 * is sound for every input: h-torsion in ⟨F^h⟩ only makes G^h larger than needed.
 */

/** A name for the homogenising variable that none of `vars` uses: h, else h_1, h_2, ... */
export function freshVariable(vars: readonly string[]): string {
  const taken = new Set(vars);
  if (!taken.has("h")) return "h";
  for (let k = 1; ; k++) if (!taken.has(`h_${k}`)) return `h_${k}`;
}

/**
 * F^h in Q[vars, h] (grevlex, h last). Zero polynomials are dropped. The input ring must be
 * grevlex in one block (the route's correctness rests on grevlex, see above).
 *
 * Example: homogenise([x^2 - y, x^3 - x]) in Q[x, y] is [x^2 - y*h, x^3 - x*h^2] in Q[x, y, h].
 */
export function homogenise(polys: readonly Polynomial<Rational>[]): { ring: PolynomialRing<Rational>; polys: Polynomial<Rational>[] } {
  if (polys.length === 0) throw new AlgebraError("domain", "homogenise: needs at least one polynomial");
  if (!isPlainGrevlex(polys[0].ring)) throw new AlgebraError("domain", "homogenise: only for grevlex in one block");
  return homogeniseInto(polys, "grevlex");
}

/**
 * F^h in Q[vars, h] (h a new last variable) under `order` on all n + 1 variables; the ring of
 * `polys` may have any order. With `order` = the blocks of an order > followed by lex(1) for h,
 * a homogeneous polynomial's terms are ordered as > orders their dehomogenisations (the x-parts
 * of its terms are distinct and compared first), which is Cox, Little, O'Shea's >_h (ch. 8 §4)
 * for any >; f4/multimodular.ts's Hilbert-series proof lifts bases of I^h in it.
 */
export function homogeniseInto(polys: readonly Polynomial<Rational>[], order: OrderSpec | string): { ring: PolynomialRing<Rational>; polys: Polynomial<Rational>[] } {
  if (polys.length === 0) throw new AlgebraError("domain", "homogenise: needs at least one polynomial");
  const base = polys[0].ring;
  const ring = new PolynomialRing([...base.vars, freshVariable(base.vars)], base.field, order);
  const n = base.n, S = n + 1, T = n + 2;
  const out = polys.filter((p) => p.coeffs.length > 0).map((p) => {
    const len = p.coeffs.length;
    let d = 0;
    for (let t = 0; t < len; t++) d = Math.max(d, p.exps[t * S]);
    const exps = new Int32Array(len * T);
    for (let t = 0; t < len; t++) {
      exps[t * T] = d;
      for (let k = 1; k <= n; k++) exps[t * T + k] = p.exps[t * S + k];
      exps[t * T + n + 1] = d - p.exps[t * S];
    }
    return normalizeTerms(ring, p.coeffs, exps);
  });
  return { ring, polys: out };
}

/** `ring`'s order followed by lex(1) for a new last variable h (>_h, see homogeniseInto). */
export function orderWithH(ring: PolynomialRing<unknown>): OrderSpec {
  return [...ring.order, { kind: "lex", size: 1 }];
}

/**
 * The reduced grevlex basis of ⟨F⟩ in `ring` (F's ring) from the reduced basis `Gh` of ⟨F^h⟩
 * (last variable h): h = 1 in every element, then inter-reduction over Z (fraction-free, each
 * element primitive) and monic over Q; sorted by increasing leading monomial, [1] for the whole
 * ring. Any Gröbner basis of ⟨F^h⟩ will do, reduced or not.
 */
export function dehomogenisedBasis(Gh: readonly Polynomial<Rational>[], ring: PolynomialRing<Rational>, limits: Limits): Polynomial<Rational>[] {
  const n = ring.n, S = n + 1, T = n + 2;
  const tick = () => limits.checkTime();
  const integer = Gh.filter((g) => g.coeffs.length > 0).map((g) => {
    if (g.ring.n !== n + 1) throw new AlgebraError("ring", "dehomogenisedBasis: the basis must have one variable more than the ring");
    const len = g.coeffs.length;
    const exps = new Int32Array(len * S);
    for (let t = 0; t < len; t++) {
      exps[t * S] = g.exps[t * T] - g.exps[t * T + n + 1];
      for (let k = 1; k <= n; k++) exps[t * S + k] = g.exps[t * T + k];
    }
    // Terms of a homogeneous g stay distinct under h = 1; normalizeTerms also sorts and merges
    // should a non-homogeneous basis be passed.
    return clearDenominators(toEngine(normalizeTerms(ring, g.coeffs, exps)));
  });
  const kernel = new ReductionKernel(integerCoefficients, n, ring.cmp, tick);
  const reduced = reduceBasis(integer, integerCoefficients, n, ring.cmp, kernel);
  return reduced.map((g) => fromEngine(ring, monicRational(g, tick)));
}

/**
 * How much larger the reduced basis of ⟨F^h⟩ is than that of ⟨F⟩, both modulo one word-size
 * prime, from ONE F4 run (f4/f4.ts) on F^h mod p: `homogenised` = #G^h_p, `dehomogenised` = the
 * number of minimal leading monomials after h = 1, which is #G_p by the argument above (applied
 * over Z/p). A saturated ⟨F^h⟩ gives equal counts (G^h is then the homogenised G, CLO ch. 8 §4);
 * extra elements come from h-torsion, i.e. degree falls that the inhomogeneous run meets and
 * whose exact replay swells coefficients (equal counts do not prove saturation: {x^2 − y,
 * x^3 − x} has torsion and 3 elements either way). `terms` is the number of terms of G^h_p, a
 * measure of the route's work. `hFreeLeads`: the leading monomials of G^h_p free of h
 * (packed [degree, x-exponents]), which multi-modular F4's Hilbert step at p needs, so that step
 * need not compute G^h_p again; `saturated`: every minimal lead after h = 1 is divisible by one of
 * them, which is that step at p (f4/multimodular.ts, `leadsCovered`), so F4 can be lifted on F
 * itself. Null when the prime divides a denominator or a leading coefficient (the image would not
 * be F's).
 */
export function homogenisedGrowth(
  Fh: readonly Polynomial<Rational>[],
  limits: Limits,
  p: number = MODULAR_PRIMES[0],
): { homogenised: number; dehomogenised: number; terms: number; saturated: boolean; hFreeLeads: Int32Array[] } | null {
  const P = BigInt(p);
  const ring = Fh[0].ring.withField(primeField(p));
  const images: Polynomial<number>[] = [];
  for (const f of Fh) {
    const coeffs: number[] = [];
    const keep: number[] = [];
    for (let t = 0; t < f.coeffs.length; t++) {
      const c = rationalModP(f.coeffs[t], p, P);
      if (c === null || (t === 0 && c === 0)) return null;
      if (c !== 0) { coeffs.push(c); keep.push(t); }
    }
    const S = ring.stride, exps = new Int32Array(keep.length * S);
    keep.forEach((t, i) => exps.set(f.exps.subarray(t * S, t * S + S), i * S));
    images.push({ ring, coeffs, exps });
  }
  const Gp = f4GroebnerModP(images, limits);
  const n = ring.n - 1;
  const leads = Gp.map((g) => g.exps.subarray(1, n + 1)); // x-part of each leading monomial
  const divides = (a: Int32Array, b: Int32Array) => a.every((e, k) => e <= b[k]);
  const minimal = leads.filter((a, i) => !leads.some((b, j) => j !== i && divides(b, a) && (!divides(a, b) || j < i)));
  const free = Gp.filter((g) => g.exps[n + 1] === 0);
  const hFree = free.map((g) => g.exps.subarray(1, n + 1));
  const saturated = minimal.every((a) => hFree.some((b) => divides(b, a)));
  const hFreeLeads = free.map((g) => g.exps.slice(0, n + 1));
  return { homogenised: Gp.length, dehomogenised: minimal.length, terms: Gp.reduce((sum, g) => sum + g.coeffs.length, 0), saturated, hFreeLeads };
}

export function isPlainGrevlex(ring: PolynomialRing<unknown>): boolean {
  return ring.order.length === 1 && ring.order[0].kind === "grevlex";
}
