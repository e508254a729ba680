import type { GroebnerOptions } from "../algebra/index";
import { groebnerBasis } from "../algebra/index";
import { eliminate, fromTerms, leadingMonomial, mul as mulPoly, sub, terms } from "../algebra/index";
import type { Rational } from "../algebra/index";
import { ZERO, add as addQ, div as divQ, fromInt, rational, sign, sub as subQ, toNumber } from "../algebra/rational";
import { PolynomialRing } from "../algebra/index";
import { AlgebraError, QQ } from "../algebra/index";
import {
  type RatPoly,
  evaluate as evaluateUni,
  fromRationalCoefficients,
  isExactRoot,
  isolateRealRoots,
  refineRootInterval,
  squareFreePart,
  toRationalCoefficients,
} from "../algebra/univariate/index";
import type { QPoly, QRing } from "./kinetics";
import { monomialOf, saturate } from "./ideal";
import { seededRandom } from "../numeric/multistart";

export interface ZeroDimensionalSolution {
  /** "finite": points lists every positive solution; "empty": none at all; "positive-dimensional": infinitely many complex solutions. */
  readonly status: "finite" | "empty" | "positive-dimensional";
  /** Positive real solutions, coordinates aligned with the ring's variables, increasing in the last coordinate. */
  readonly points: number[][];
  /** The lex basis of the saturated ideal. */
  readonly basis: QPoly[];
  /** The univariate polynomial whose roots were isolated (text), and its variable. */
  readonly eliminant: { variable: string; polynomial: string } | null;
}

/**
 * Every solution with all coordinates positive of a polynomial system over Q (no parameters),
 * found exactly: saturate by the product of the variables (and `extraSaturation`), lex Gröbner
 * basis, check zero-dimensionality, bring the ideal into shape position (x_i − g_i(t), p(t))
 * — directly, or after passing to the radical (Seidenberg's lemma) and, if needed, a separating
 * linear form t = x_n + Σ cᵢxᵢ (shape lemma: Gianni & Mora 1989, "Algebraic solution of systems of
 * polynomial equations using Gröbner bases"; Rouillier 1999 for separating forms) —
 * then exact real-root isolation of p (Collins & Akritas 1976), refinement, and exact evaluation
 * of g_i at both interval ends until every coordinate has a certain sign and ≥ 1e-14 relative accuracy.
 * Example: {x·y − 2, x + y − 3} gives the points (1, 2) and (2, 1).
 */
export function positiveSolutions(polys: readonly QPoly[], options: GroebnerOptions & { extraSaturation?: QPoly; saturated?: boolean } = {}): ZeroDimensionalSolution {
  const ring = polys[0].ring;
  const all = ring.vars.map((_, i) => i);
  let sat = monomialOf(ring, all);
  if (options.extraSaturation) sat = mulPoly(sat, options.extraSaturation);
  const lexRing = ring.orderName === "lex" ? ring : ring.withOrder("lex");
  const gens = ring === lexRing ? polys : polys.map((p) => fromTerms(lexRing, terms(p)));
  const satLex = ring === lexRing ? sat : fromTerms(lexRing, terms(sat));
  // `saturated`: the input already is the reduced lex basis of a saturated ideal (no second pass).
  const basis = options.saturated && ring === lexRing ? [...gens] : saturate(gens, satLex, options);
  if (basis.length === 0) return { status: "positive-dimensional", points: [], basis, eliminant: null };
  if (basis.length === 1 && terms(basis[0]).length === 1 && basis[0].exps[0] === 0) return { status: "empty", points: [], basis, eliminant: null };
  if (!isZeroDimensional(basis)) return { status: "positive-dimensional", points: [], basis, eliminant: null };
  const n = lexRing.n;
  let shape = shapeOf(basis, n - 1);
  let coordinateOf: (point: number[]) => number[] = (pt) => pt;
  let shapeRing = lexRing;
  let radical = basis;
  if (!shape) {
    // Seidenberg's lemma: adding the square-free part of each variable's eliminant gives the radical
    // (Kreuzer & Robbiano, "Computational Commutative Algebra 1", 2000, Cor. 3.7.16 — recalled from memory),
    // and a radical zero-dimensional ideal is in shape position after a generic linear change.
    const extra = lexRing.vars.flatMap((v) => {
      const others = lexRing.vars.filter((w) => w !== v);
      const [mu] = others.length > 0 ? eliminate(basis, others, options) : [basis[0]];
      const uni = mu ? univariateOf(mu, lexRing.indexOf(v)) : null;
      return uni ? [fromUnivariate(lexRing, lexRing.indexOf(v), toRationalCoefficients(squareFreePart(uni)))] : [];
    });
    radical = groebnerBasis([...basis, ...extra], options);
    shape = shapeOf(radical, n - 1);
  }
  if (!shape) {
    const random = seededRandom(12345);
    for (let attempt = 0; attempt < 5 && !shape; attempt++) {
      const cs = all.slice(0, n - 1).map(() => 1 + Math.floor(random() * (attempt + 2) * 3));
      let t = "_u";
      while (lexRing.indexOf(t) >= 0) t = `_${t}`;
      const big = new PolynomialRing([...lexRing.vars, t], QQ, "lex");
      const lift = (p: QPoly) => fromTerms(big, terms(p).map((x) => ({ coeff: x.coeff, exponents: [...x.exponents, 0] })));
      const form = fromTerms(big, [
        { coeff: fromInt(1), exponents: all.map((i) => (i === n - 1 ? 1 : 0)).concat([0]) },
        ...cs.map((c, i) => ({ coeff: fromInt(c), exponents: all.map((j) => (j === i ? 1 : 0)).concat([0]) })),
      ]);
      const linear = sub(big.variable(n), form);
      let g = groebnerBasis([...radical.map(lift), linear], options);
      const eliminant = g[0];
      const uni = univariateOf(eliminant, n);
      if (!uni) continue;
      const sqf = squareFreePart(uni);
      g = groebnerBasis([...g, fromUnivariate(big, n, toRationalCoefficients(sqf))], options);
      shape = shapeOf(g, n);
      if (shape) {
        shapeRing = big;
        coordinateOf = (pt) => pt.slice(0, n);
      }
    }
    if (!shape) throw new AlgebraError("domain", "positive solutions: no separating linear form found in 5 attempts");
  }
  const last = shapeRing.n - 1;
  const points: number[][] = [];
  const roots = isolateRealRoots(shape.eliminant, { positiveOnly: true, deadline: options.deadline, signal: options.signal });
  for (const root of roots) {
    // Refining a root costs up to 1024-bit evaluations: look at the deadline between roots.
    if (options.signal?.aborted) throw new AlgebraError("cancelled", "positive solutions: cancelled");
    if (options.deadline !== undefined && Date.now() > options.deadline) throw new AlgebraError("timeout", "positive solutions: deadline exceeded while refining the roots");
    const coords = coordinatesAt(shape, root, last);
    if (!coords) throw new AlgebraError("budget", "positive solutions: a coordinate's sign was not certified after refining a root to 1024 bits");
    if (coords.every((v) => v > 0)) points.push(coordinateOf(coords));
  }
  points.sort((a, b) => a[n - 1] - b[n - 1]);
  return {
    status: "finite",
    points,
    basis,
    eliminant: { variable: shapeRing.vars[last], polynomial: shapeRing.format(fromUnivariate(shapeRing, last, toRationalCoefficients(shape.eliminant))) },
  };
}


/** Zero-dimensional iff every variable has a pure power among the leading monomials (CLO ch. 5 §3, Theorem 6). */
export function isZeroDimensional(basis: readonly QPoly[]): boolean {
  if (basis.length === 0) return false;
  const n = basis[0].ring.n;
  const lms = basis.map(leadingMonomial);
  for (let i = 0; i < n; i++) if (!lms.some((m) => m[i] > 0 && m.every((e, k) => k === i || e === 0))) return false;
  return true;
}

interface Shape {
  eliminant: RatPoly;
  /** For each non-last variable i: x_i = h_i(t). */
  coordinates: RatPoly[];
}

/** Recognises the shape form {x_i − h_i(x_last)} ∪ {p(x_last)} of a reduced lex basis. */
function shapeOf(basis: readonly QPoly[], last: number): Shape | null {
  if (basis.length !== last + 1) return null;
  const eliminant = univariateOf(basis[0], last);
  if (!eliminant) return null;
  const coordinates: RatPoly[] = [];
  for (let i = 0; i < last; i++) {
    const g = basis.find((p) => {
      const lm = leadingMonomial(p);
      return lm[i] === 1 && lm.every((e, k) => k === i || e === 0);
    });
    if (!g) return null;
    const rest = terms(g).slice(1);
    if (rest.some((t) => t.exponents.some((e, k) => e > 0 && k !== last))) return null;
    if (terms(g)[0].coeff.num !== 1n || terms(g)[0].coeff.den !== 1n) return null;
    const h = new Array<Rational>(1).fill(ZERO);
    for (const t of rest) {
      const d = t.exponents[last];
      while (h.length <= d) h.push(ZERO);
      h[d] = subQ(h[d], t.coeff);
    }
    coordinates.push(fromRationalCoefficients(h));
  }
  return { eliminant, coordinates };
}

function univariateOf(p: QPoly, k: number): RatPoly | null {
  const c: Rational[] = [];
  for (const t of terms(p)) {
    if (t.exponents.some((e, j) => e > 0 && j !== k)) return null;
    const d = t.exponents[k];
    while (c.length <= d) c.push(ZERO);
    c[d] = addQ(c[d], t.coeff);
  }
  return fromRationalCoefficients(c);
}

function fromUnivariate(ring: QRing, k: number, c: readonly Rational[]): QPoly {
  return fromTerms(
    ring,
    c.flatMap((coeff, d) => (coeff.num === 0n ? [] : [{ coeff, exponents: ring.vars.map((_, j) => (j === k ? d : 0)) }])),
  );
}

/**
 * Coordinates of the solution over one isolated root: refine until h_i(lo) and h_i(hi) agree in
 * sign and to 1e-14 relative for every i (exact rational evaluation at both ends).
 */
function coordinatesAt(shape: Shape, root: { lo: Rational; hi: Rational; multiplicity: number }, last: number): number[] | null {
  let iv = root;
  for (let bits = 64n; bits <= 1024n; bits *= 2n) {
    if (!isExactRoot(iv)) iv = refineRootInterval(shape.eliminant, iv, { relativeWidth: rational(1n, 1n << bits) });
    const mid = divQ(addQ(iv.lo, iv.hi), fromInt(2));
    const values: number[] = [];
    let ok = true;
    for (const h of shape.coordinates) {
      const a = evaluateUni(h, iv.lo);
      const b = evaluateUni(h, iv.hi);
      if (sign(a) !== sign(b) || sign(a) === 0) {
        ok = false;
        break;
      }
      const m = evaluateUni(h, mid);
      const spread = Math.abs(toNumber(subQ(a, b)));
      if (spread > 1e-15 * Math.abs(toNumber(m))) {
        ok = false;
        break;
      }
      values.push(toNumber(m));
    }
    if (ok) {
      const out = new Array<number>(last + 1);
      shape.coordinates.forEach((_, i) => (out[i] = values[i]));
      out[last] = toNumber(mid);
      return out;
    }
  }

  return null;
}
