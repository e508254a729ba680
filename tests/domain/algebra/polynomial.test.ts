import { describe, expect, it } from "vitest";
import {
  PolynomialRing, QQ, add, assertInvariants, coefficientOf, equals, evaluate, fromTerms, leadingCoefficient,
  leadingMonomial, leadingTerm, mul, partialDerivative, pow, primeField, rational, scale, sub, substitute, terms,
} from "@domain/algebra/index";
import type { Polynomial, Rational } from "@domain/algebra/index";
import { prng, randomPolyText } from "../../fixtures/algebra/systems";

const R = new PolynomialRing(["x", "y", "z"], QQ, "grevlex");
const p = (s: string) => R.parse(s);
const f = (q: Polynomial<Rational>) => R.format(q);
const q = (n: number, d = 1) => rational(BigInt(n), BigInt(d));

describe("sparse polynomials", () => {
  it("keep invariants through arithmetic", () => {
    const a = p("x^2*y - 3/2*z + 1"), b = p("x*y + z^2 - 1");
    for (const r of [add(a, b), sub(a, b), mul(a, b), pow(b, 3), scale(a, q(2, 3)), sub(a, a)]) assertInvariants(r);
    expect(f(sub(a, a))).toBe("0");
    expect(f(mul(p("x - y"), p("x + y")))).toBe("x^2 - y^2");
  });

  it("report leading data in the ring's order", () => {
    const a = p("x*z^2 + y^3 + 2");
    // grevlex: y^3 > x*z^2 (ties in degree broken by the smaller power of the last variable)
    expect(leadingMonomial(a)).toEqual([0, 3, 0]);
    expect(f(leadingTerm(p("-5*x^2 + y")))).toBe("-5*x^2");
    expect(leadingCoefficient(p("-5*x^2 + y"))).toEqual(q(-5));
    const L = new PolynomialRing(["x", "y", "z"], QQ, "lex");
    expect(leadingMonomial(L.parse("x*z^2 + y^3 + 2"))).toEqual([1, 0, 2]);
    expect(() => leadingMonomial(R.zero())).toThrow(/zero polynomial/);
  });

  it("builds from (coefficient, exponent vector) terms, merging and dropping zeros", () => {
    const a = fromTerms(R, [
      { coeff: q(2), exponents: [1, 0, 0] },
      { coeff: q(3), exponents: [0, 0, 1] },
      { coeff: q(-2), exponents: [1, 0, 0] },
      { coeff: q(1, 2), exponents: [0, 0, 1] },
    ]);
    assertInvariants(a);
    expect(f(a)).toBe("7/2*z");
    expect(terms(p("x^2 - 1/3"))).toEqual([{ coeff: q(1), exponents: [2, 0, 0] }, { coeff: q(-1, 3), exponents: [0, 0, 0] }]);
    expect(coefficientOf(p("x^2 - 1/3*y"), [0, 1, 0])).toEqual(q(-1, 3));
  });

  it("evaluates, substitutes and differentiates", () => {
    const a = p("x^2*y - 1");
    expect(evaluate(a, [q(2), q(3), q(0)])).toEqual(q(11));
    expect(f(substitute(p("x*y + z"), new Map([[1, q(2)]])))).toBe("2*x + z");
    expect(f(substitute(p("x^2 + y"), new Map([[0, p("y + 1")]])))).toBe("y^2 + 3*y + 1");
    expect(f(partialDerivative(p("x^2*y + 3*x*z - y"), 0))).toBe("2*x*y + 3*z");
    expect(f(partialDerivative(p("x^2*y + 3*x*z - y"), 1))).toBe("x^2 - 1");
    const P = new PolynomialRing(["x"], primeField(3), "lex");
    expect(P.format(partialDerivative(P.parse("x^3 + x^2"), 0))).toBe("-x"); // 3x^2 = 0, 2x = -x mod 3
  });

  it("satisfies ring axioms on random polynomials (seeded), checked by evaluation", () => {
    const rnd = prng(20261201);
    const opts = { nvars: 3, npolys: 1, maxDegree: 4, maxTerms: 6, coeffBound: 50n, fractions: true };
    for (let t = 0; t < 40; t++) {
      const [a, b, c] = [0, 1, 2].map(() => p(randomPolyText(rnd, R.vars, opts)));
      expect(equals(mul(a, add(b, c)), add(mul(a, b), mul(a, c)))).toBe(true);
      expect(equals(mul(a, b), mul(b, a))).toBe(true);
      const pt = [q(3, 2), q(-2), q(5, 7)];
      expect(evaluate(mul(a, b), pt)).toEqual(QQ.mul(evaluate(a, pt), evaluate(b, pt)));
      expect(evaluate(sub(a, b), pt)).toEqual(QQ.sub(evaluate(a, pt), evaluate(b, pt)));
      assertInvariants(mul(a, b));
    }
  });

  it("assertInvariants catches broken representations", () => {
    const a = p("x + 1");
    expect(() => assertInvariants({ ring: R, coeffs: [q(1), q(0)], exps: a.exps })).toThrow(/zero coefficient/);
    expect(() => assertInvariants({ ring: R, coeffs: a.coeffs.slice().reverse(), exps: Int32Array.from([0, 0, 0, 0, 1, 1, 0, 0]) })).toThrow(/decreasing/);
  });
});
