import { describe, expect, it } from "vitest";
import { PolynomialRing, QQ, groebnerBasis } from "@domain/algebra/index";
import type { Polynomial, Rational } from "@domain/algebra/index";
import { integerCoefficients } from "@domain/algebra/groebner/coefficients";
import { clearDenominators, toEngine } from "@domain/algebra/groebner/convert";
import { ReductionKernel, toReducer } from "@domain/algebra/groebner/reduce";
import type { EPoly } from "@domain/algebra/groebner/reduce";
import { ZeroTest } from "@domain/algebra/groebner/zero-test";
import { add, mul } from "@domain/algebra/polynomial";

// A block order with a parameter block, as in the steady-state ideals the class was written for.
const R = new PolynomialRing(["x", "y", "z", "a", "b"], QQ, [{ kind: "lex", size: 3 }, { kind: "grevlex", size: 2 }]);
const K = integerCoefficients;
const Z = (p: Polynomial<Rational>) => {
  const z = clearDenominators(toEngine(p));
  K.normalize(z.coeffs);
  return z;
};
const reversed = (f: EPoly<bigint>): EPoly<bigint> => {
  const S = 6, len = f.coeffs.length, exps = new Int32Array(f.exps.length);
  for (let t = 0; t < len; t++) exps.set(f.exps.subarray(t * S, t * S + S), (len - 1 - t) * S);
  return { coeffs: f.coeffs.slice().reverse(), exps };
};

// Seeded pseudo-random polynomials (xorshift), reproducible.
function randomPolys(count: number, seed: number): Polynomial<Rational>[] {
  let s = seed >>> 0;
  const next = (m: number) => { s ^= s << 13; s >>>= 0; s ^= s >>> 17; s ^= s << 5; s >>>= 0; return s % m; };
  const vars = ["x", "y", "z", "a", "b"];
  return Array.from({ length: count }, () => {
    const terms = Array.from({ length: 2 + next(3) }, () => {
      const mon = vars.map((v) => (next(3) === 0 ? `*${v}^${next(3)}` : "")).join("");
      return `${next(2) ? "-" : "+"} ${1 + next(9)}/${1 + next(4)}${mon}`;
    });
    return R.parse(terms.join(" ").replace(/^\+ /, ""));
  });
}

describe("ZeroTest (exact reduction to zero by dense rows)", () => {
  const F = [R.parse("x*a - y^2 + b"), R.parse("y*b - z*a - 1"), R.parse("z^2 - a*b + 2")];
  const G = groebnerBasis(F).map(Z);
  const rows = new ZeroTest(G, K, R.n, R.cmp);

  it("accepts every input and combinations of them, whatever the order of their terms", () => {
    for (const f of F) expect(rows.reducesToZero(reversed(Z(f)))).toBe(true);
    const combo = add(add(mul(F[0], R.parse("3*x*y - a")), mul(F[1], R.parse("z^3*b - 1/7"))), mul(F[2], R.parse("x^2")));
    expect(rows.reducesToZero(Z(combo))).toBe(true);
  });

  it("rejects polynomials outside the ideal, as the top-reduction kernel does", () => {
    const kernel = new ReductionKernel(K, R.n, R.cmp, () => {}, false);
    const reducers = G.map((g) => toReducer(g, R.n));
    const combo = add(mul(F[0], R.parse("x - b^2")), R.parse("a^3"));
    expect(rows.reducesToZero(Z(combo))).toBe(false);
    for (const f of randomPolys(40, 12345)) {
      if (f.coeffs.length === 0) continue;
      const viaKernel = kernel.reduce(Z(f), reducers, false).coeffs.length === 0;
      expect(rows.reducesToZero(Z(f))).toBe(viaKernel);
    }
  });

  it("reduces every S-polynomial of a reduced Gröbner basis to zero, and finds one that does not for the generators", () => {
    for (let i = 0; i < G.length; i++) for (let j = i + 1; j < G.length; j++) expect(rows.sPolynomialReducesToZero(i, j)).toBe(true);
    // Cox, Little, O'Shea, ch. 2 §7, Example 1 (grlex): {x^3 - 2xy, x^2y - 2y^2 + x} is not a Gröbner basis.
    const P = new PolynomialRing(["x", "y"], QQ, "grlex");
    const H = [P.parse("x^3 - 2*x*y"), P.parse("x^2*y - 2*y^2 + x")].map(Z);
    expect(new ZeroTest(H, K, 2, P.cmp).sPolynomialReducesToZero(0, 1)).toBe(false);
  });
});
