import { describe, expect, it } from "vitest";
import { PolynomialRing, QQ, primeField, terms } from "@domain/algebra/index";
import { assertInvariants } from "@domain/algebra/polynomial";
import { rational } from "@domain/algebra/rational";

describe("PolynomialRing", () => {
  const R = new PolynomialRing(["x", "y", "k1"], QQ, "lex");

  it("names its variables, their indices and its order", () => {
    expect([R.n, R.stride]).toEqual([3, 4]);
    expect(["x", "y", "k1", "z"].map((v) => R.indexOf(v))).toEqual([0, 1, 2, -1]);
    expect(R.orderName).toBe("lex");
  });

  it("refuses an empty, a malformed or a repeated variable list with the ring error", () => {
    expect(() => new PolynomialRing([], QQ)).toThrow(/at least one variable/);
    expect(() => new PolynomialRing(["2x"], QQ)).toThrow(/'2x' is not a valid variable name/);
    expect(() => new PolynomialRing(["x", "x"], QQ)).toThrow(/variable 'x' is listed twice/);
    expect(() => R.variable("z")).toThrow(/unknown variable 'z'/);
  });

  it("keeps variables and order when the field changes, and variables and field when the order does", () => {
    const P = R.withField(primeField(7));
    expect([P.vars, P.orderName]).toEqual([R.vars, "lex"]);
    const G = R.withOrder("grevlex");
    expect([G.vars, G.field, G.orderName]).toEqual([R.vars, QQ, "grevlex"]);
  });

  it("builds constants, variables and polynomials from terms in any order, sorted with no zeros", () => {
    expect(terms(R.one())).toEqual([{ coeff: rational(1n), exponents: [0, 0, 0] }]);
    expect(terms(R.zero())).toEqual([]);
    expect(terms(R.variable(1))).toEqual([{ coeff: rational(1n), exponents: [0, 1, 0] }]);
    const p = R.fromTerms([
      { coeff: rational(3n), exponents: [0, 1, 0] },
      { coeff: rational(1n, 2n), exponents: [2, 0, 0] },
      { coeff: rational(-3n), exponents: [0, 1, 0] },
    ]);
    // 3y - 3y cancels; lex puts x^2 first.
    expect(terms(p)).toEqual([{ coeff: rational(1n, 2n), exponents: [2, 0, 0] }]);
    assertInvariants(p);
  });
});
