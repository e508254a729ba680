import { AlgebraError } from "./errors";
import { fglm } from "./fglm";
import { fieldCoefficients } from "./groebner/coefficients";
import { toEngine } from "./groebner/convert";
import { Limits } from "./groebner/limits";
import type { LimitOptions } from "./groebner/limits";
import { ReductionKernel, toReducer } from "./groebner/reduce";
import { verifyGroebner } from "./groebner/verify";
import { QQ, isPrime, primeField } from "./field";
import { packMonomial } from "./monomial";
import type { Polynomial } from "./polynomial";
import { normalizeTerms } from "./polynomial";
import type { Rational } from "./rational";
import { rational } from "./rational";
import { PolynomialRing } from "./ring";

/**
 * FGLM over Q by images modulo word-size primes (Faugère, Gianni, Lazard, Mora, J. Symbolic
 * Comput. 16, 1993, run in Z/p), combined by the Chinese remainder theorem and lifted by rational
 * reconstruction (Wang, Guy and Davenport, "p-adic reconstruction of rational numbers", SIGSAM
 * Bull. 16, 1982; von zur Gathen and Gerhard, "Modern Computer Algebra", 3rd ed. 2013, §5.10),
 * then PROVEN exactly, so a wrong lift can never be returned:
 *  (1) every candidate h lies in I: its normal form modulo the exact basis G, assembled from
 *      exact normal-form vectors of its monomials (as FGLM builds them), is zero,
 *  (2) H is a Gröbner basis (Buchberger's criterion, verify.ts), monic and reduced,
 *  (3) H has as many standard monomials as G: dim_Q Q[x]/⟨H⟩ = dim_Q Q[x]/I.
 * Then ⟨H⟩ ⊆ I and the quotients have equal finite dimension, so ⟨H⟩ = I, and the reduced basis is unique
 * (Cox, Little, O'Shea, "Ideals, Varieties, and Algorithms", 4th ed., ch. 2 §7, Prop. 6; ch. 5 §3).
 * Returns null when the primes run out, the proof fails, or Q[x]/I has fewer than
 * `minDimension` standard monomials; the caller then runs FGLM over Q.
 *
 * Example: G = [y^2 - x, x^2 - 1/4] (grevlex x > y) gives the lex basis [y^4 - 1/4, x - y^2].
 */
export function fglmModularQQ(
  G: readonly Polynomial<Rational>[],
  target: PolynomialRing<Rational>,
  options: LimitOptions & { minDimension?: number } = {},
): Polynomial<Rational>[] | null {
  const limits = new Limits(options, "FGLM");
  const src = G[0].ring;
  const D = countStandard(G);
  if (D < (options.minDimension ?? 0)) return null;
  let reference: string | null = null;
  let residues: bigint[] = []; // CRT images of every coefficient, in reference layout
  let layout: Polynomial<number>[] = [];
  let modulus = 1n;
  let used = 0, mismatches = 0, nextAttempt = 1, tried = 0;
  let candidate: Rational[] | null = null;
  for (const p of primesBelow(2 ** 26)) {
    limits.checkTime();
    // Bounded either way: too many primes needed, or too many unlucky ones (then FGLM over Q).
    if (used >= MAX_PRIMES || ++tried > 2 * MAX_PRIMES) return null;
    const image = imageModP(G, src, target, p, options);
    if (image === null) continue; // a denominator vanishes mod p, or the image is degenerate
    const key = structureKey(image);
    if (reference !== key) {
      // An unlucky prime changes the support; after several disagreements in a row the first was the odd one.
      if (reference !== null && ++mismatches < 3) continue;
      reference = key;
      residues = image.flatMap((h) => h.coeffs.map((c) => BigInt(c)));
      layout = image;
      modulus = BigInt(p);
      used = 1;
      mismatches = 0;
      nextAttempt = 1;
      candidate = null;
    } else {
      mismatches = 0;
      // A lift that also matches a prime it was not built from is almost surely right: prove it.
      if (candidate !== null) {
        if (agreesModP(candidate, image, p)) {
          const H = assemble(candidate, layout, target);
          if (provesReducedBasis(H, G, D, limits)) return H;
        }
        candidate = null;
      }
      const P = BigInt(p);
      const mInv = BigInt(invModNumber(Number(modulus % P), p));
      let k = 0;
      for (const h of image) for (const c of h.coeffs) {
        const x = residues[k];
        const t = ((((BigInt(c) - x) % P) + P) * mInv) % P;
        residues[k++] = x + modulus * t;
      }
      modulus *= P;
      used++;
    }
    if (used < nextAttempt) continue;
    // Reconstruction stops at the first coefficient that does not lift, so failed attempts are cheap.
    nextAttempt = Math.ceil(used * 1.1) + 1;
    candidate = liftAll(residues, modulus, limits);
  }
  return null;
}

/** Upper bound on primes (26 bits each): beyond ~10 000 bits FGLM over Q is the better road. */
const MAX_PRIMES = 400;

function* primesBelow(limit: number): Generator<number> {
  for (let p = limit - 1; p > 3; p -= 2) if (isPrime(p)) yield p;
}

function countStandard(G: readonly Polynomial<Rational>[]): number {
  const n = G[0].ring.n;
  const lms = G.map((g) => Array.from(g.exps.subarray(1, n + 1)));
  return countStandardOf(lms, n);
}

/** Number of monomials divisible by none of `lms` (finite for a zero-dimensional ideal). */
function countStandardOf(lms: readonly number[][], n: number): number {
  const queue: number[][] = [new Array<number>(n).fill(0)];
  const seen = new Set<string>([queue[0].join(",")]);
  const divisible = (e: readonly number[]) => lms.some((l) => l.every((x, k) => x <= e[k]));
  for (let q = 0; q < queue.length; q++) {
    for (let k = 0; k < n; k++) {
      const e = queue[q].slice();
      e[k]++;
      const key = e.join(",");
      if (seen.has(key) || divisible(e)) continue;
      seen.add(key);
      queue.push(e);
    }
  }
  return queue.length;
}

/** FGLM of G mod p; null when p divides a denominator or FGLM fails on the image. */
function imageModP(
  G: readonly Polynomial<Rational>[],
  src: PolynomialRing<Rational>,
  target: PolynomialRing<Rational>,
  p: number,
  options: LimitOptions,
): Polynomial<number>[] | null {
  const F = primeField(p);
  const P = BigInt(p);
  const srcP = new PolynomialRing(src.vars, F, src.order);
  const Gp: Polynomial<number>[] = [];
  for (const g of G) {
    const coeffs: number[] = [];
    for (const c of g.coeffs) {
      const den = Number(((c.den % P) + P) % P);
      if (den === 0) return null;
      coeffs.push(F.mul(Number(((c.num % P) + P) % P), invModNumber(den, p)));
    }
    if (coeffs[0] === 0) return null;
    Gp.push(normalizeTerms(srcP, coeffs, g.exps));
  }
  try {
    return fglm(Gp, new PolynomialRing(target.vars, F, target.order), options);
  } catch (e) {
    if (e instanceof AlgebraError && (e.code === "timeout" || e.code === "cancelled")) throw e;
    return null; // e.g. a different number of standard monomials: an unlucky prime
  }
}

function agreesModP(candidate: readonly Rational[], image: readonly Polynomial<number>[], p: number): boolean {
  const P = BigInt(p);
  let k = 0;
  for (const h of image)
    for (const c of h.coeffs) {
      const r = candidate[k++];
      const den = Number(r.den % P);
      if (den === 0) return false;
      const num = Number(((r.num % P) + P) % P);
      if (Number((BigInt(num) * BigInt(invModNumber(den, p))) % P) !== c) return false;
    }
  return true;
}

function structureKey(H: readonly Polynomial<number>[]): string {
  return H.map((h) => Array.from(h.exps).join(",")).join(";");
}

function invModNumber(a: number, p: number): number {
  let r0 = p, r1 = a % p, t0 = 0, t1 = 1;
  while (r1 !== 0) {
    const q = Math.floor(r0 / r1);
    [r0, r1] = [r1, r0 - q * r1];
    [t0, t1] = [t1, t0 - q * t1];
  }
  return t0 < 0 ? t0 + p : t0;
}

function liftAll(residues: readonly bigint[], modulus: bigint, limits: Limits): Rational[] | null {
  const bound = sqrtFloor(modulus / 2n);
  const out: Rational[] = [];
  for (const x of residues) {
    limits.checkTime();
    const r = rationalReconstruction(x, modulus, bound);
    if (r === null) return null;
    out.push(r);
  }
  return out;
}

/**
 * The fraction a/b with |a| ≤ bound, 0 < b ≤ bound and a ≡ b·x (mod m), if any (unique when
 * 2·bound² < m), by the extended Euclidean algorithm stopped halfway (von zur Gathen and Gerhard,
 * §5.10). Example: rationalReconstruction(4n, 7n, 1n) is 1/2 (2·4 ≡ 1 mod 7).
 */
export function rationalReconstruction(x: bigint, m: bigint, bound: bigint): Rational | null {
  let r0 = m, r1 = ((x % m) + m) % m, t0 = 0n, t1 = 1n;
  while (r1 > bound) {
    const q = r0 / r1;
    [r0, r1] = [r1, r0 - q * r1];
    [t0, t1] = [t1, t0 - q * t1];
  }
  if (t1 === 0n || (t1 < 0n ? -t1 : t1) > bound) return null;
  const r = rational(r1, t1);
  // gcd(r1, t1) ≠ 1 means no fraction with these bounds exists.
  if (r.den !== (t1 < 0n ? -t1 : t1)) return null;
  return r;
}

/** ⌊√n⌋ by Newton's iteration from above. */
export function sqrtFloor(n: bigint): bigint {
  if (n < 2n) return n;
  let x = 1n << BigInt(Math.ceil(n.toString(2).length / 2));
  for (;;) {
    const y = (x + n / x) >> 1n;
    if (y >= x) return x;
    x = y;
  }
}

function assemble(values: readonly Rational[], layout: readonly Polynomial<number>[], target: PolynomialRing<Rational>): Polynomial<Rational>[] {
  let k = 0;
  return layout.map((h) => ({ ring: target, coeffs: h.coeffs.map(() => values[k++]), exps: h.exps }));
}

/** The three proof obligations of the docblock, exactly over Q. */
function provesReducedBasis(H: readonly Polynomial<Rational>[], G: readonly Polynomial<Rational>[], D: number, limits: Limits): boolean {
  const target = H[0].ring, src = G[0].ring, n = target.n, S = n + 1;
  // Monic, and reduced: no term of h is divisible by the leading monomial of another element.
  for (const h of H) if (h.coeffs[0].num !== 1n || h.coeffs[0].den !== 1n) return false;
  for (let i = 0; i < H.length; i++)
    for (let j = 0; j < H.length; j++) {
      if (i === j) continue;
      for (let t = 0; t < H[i].coeffs.length; t++) {
        let divides = true;
        for (let k = 1; k <= n && divides; k++) if (H[j].exps[k] > H[i].exps[t * S + k]) divides = false;
        if (divides) return false;
      }
    }
  // (3) as many standard monomials as the grevlex basis has.
  if (countStandardOf(H.map((h) => Array.from(h.exps.subarray(1, S))), n) !== D) return false;
  // (1) H ⊆ I: NF_G(h) = Σ c_t·NF_G(m_t) = 0, with exact normal-form vectors of the monomials.
  const normalForms = new NormalFormVectors(G, limits);
  for (const h of H) {
    // Only "is it zero?" matters: fractions are added without gcds (num/den, den ≠ 0), which is far
    // cheaper than normalising thousands of sums of numbers with thousands of digits.
    const num = new Array<bigint>(D).fill(0n), den = new Array<bigint>(D).fill(1n);
    for (let t = 0; t < h.coeffs.length; t++) {
      limits.checkTime();
      const v = normalForms.of(Array.from(h.exps.subarray(t * S + 1, t * S + S)));
      const c = h.coeffs[t];
      for (let r = 0; r < D; r++) {
        if (v[r].num === 0n) continue;
        const tn = c.num * v[r].num, td = c.den * v[r].den;
        if (td === den[r]) num[r] += tn;
        else {
          num[r] = num[r] * td + tn * den[r];
          den[r] *= td;
        }
      }
    }
    if (num.some((x) => x !== 0n)) return false;
  }
  // (2) Buchberger's criterion in the target order (cheap in shape position: coprime leading monomials).
  return verifyGroebner(H.map(toEngine), fieldCoefficients(QQ), n, target.cmp, limits);
}

/**
 * Normal forms modulo the reduced basis G as vectors over its standard monomials, built as in
 * FGLM: NF(x_k·m) = Σ_b NF(m)_b · NF(x_k·b), since m − NF(m) ∈ I (Faugère et al. 1993, §2).
 */
class NormalFormVectors {
  private readonly standard: number[][] = [];
  private readonly index = new Map<string, number>();
  private readonly byMonomial = new Map<string, Rational[]>();
  private readonly reducers;
  private readonly kernel;
  private readonly n: number;

  constructor(G: readonly Polynomial<Rational>[], private readonly limits: Limits) {
    const ring = G[0].ring;
    this.n = ring.n;
    const lms = G.map((g) => Array.from(g.exps.subarray(1, ring.n + 1)));
    const divisible = (e: readonly number[]) => lms.some((l) => l.every((x, k) => x <= e[k]));
    this.standard.push(new Array<number>(this.n).fill(0));
    this.index.set(this.standard[0].join(","), 0);
    for (let q = 0; q < this.standard.length; q++)
      for (let k = 0; k < this.n; k++) {
        const e = this.standard[q].slice();
        e[k]++;
        const key = e.join(",");
        if (this.index.has(key) || divisible(e)) continue;
        this.index.set(key, this.standard.length);
        this.standard.push(e);
      }
    this.reducers = G.map((g) => toReducer(toEngine(g), ring.n));
    this.kernel = new ReductionKernel(fieldCoefficients(QQ), ring.n, ring.cmp, () => limits.checkTime(), false);
  }

  of(e: readonly number[]): Rational[] {
    const key = e.join(",");
    const known = this.byMonomial.get(key);
    if (known) return known;
    const D = this.standard.length;
    let v: Rational[];
    const j = this.index.get(key);
    if (j !== undefined) {
      v = new Array<Rational>(D).fill(QQ.zero);
      v[j] = QQ.one;
    } else {
      const k = e.findIndex((x) => x > 0);
      const parent = e.slice();
      parent[k]--;
      const pv = this.of(parent);
      v = new Array<Rational>(D).fill(QQ.zero);
      for (let b = 0; b < D; b++) {
        if (QQ.isZero(pv[b])) continue;
        this.limits.checkTime();
        const eb = this.standard[b].slice();
        eb[k]++;
        const col = this.ofStandardTimesVariable(eb);
        for (let r = 0; r < D; r++) if (!QQ.isZero(col[r])) v[r] = QQ.add(v[r], QQ.mul(pv[b], col[r]));
      }
    }
    this.byMonomial.set(key, v);
    return v;
  }

  /** NF(x_k·b) for a standard monomial b: a unit vector, or one reduction by G. */
  private ofStandardTimesVariable(e: number[]): Rational[] {
    const key = e.join(",");
    const known = this.byMonomial.get(key);
    if (known) return known;
    const D = this.standard.length, S = this.n + 1;
    const v = new Array<Rational>(D).fill(QQ.zero);
    const j = this.index.get(key);
    if (j !== undefined) v[j] = QQ.one;
    else {
      const nf = this.kernel.reduce({ coeffs: [QQ.one], exps: packMonomial(e) }, this.reducers, true);
      for (let t = 0; t < nf.coeffs.length; t++) {
        const r = this.index.get(Array.from(nf.exps.subarray(t * S + 1, t * S + S)).join(","));
        if (r === undefined) throw new AlgebraError("domain", "fglm: normal form outside the standard monomials");
        v[r] = nf.coeffs[t];
      }
    }
    this.byMonomial.set(key, v);
    return v;
  }
}
