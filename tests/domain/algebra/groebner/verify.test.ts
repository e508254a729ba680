import { describe, expect, it } from "vitest";
import { PolynomialRing, QQ, groebnerBasis, primeField } from "@domain/algebra/index";
import type { Polynomial, Rational } from "@domain/algebra/index";
import { integerCoefficients, primeCoefficients } from "@domain/algebra/groebner/coefficients";
import { clearDenominators, toEngine } from "@domain/algebra/groebner/convert";
import { verifyGroebner } from "@domain/algebra/groebner/verify";
import { cyclic } from "../../../fixtures/algebra/systems";

const R = new PolynomialRing(["x", "y"], QQ, "grlex");
const Z = (ps: Polynomial<Rational>[]) => ps.map((p) => clearDenominators(toEngine(p)));

describe("verifyGroebner (Buchberger's criterion with Gebauer–Möller pairs)", () => {
  it("accepts a reduced basis and rejects the generators it came from", () => {
    // Cox, Little, O'Shea, ch. 2 §7, Example 1: {x^3 - 2xy, x^2y - 2y^2 + x} is not a Gröbner basis.
    const F = [R.parse("x^3 - 2*x*y"), R.parse("x^2*y - 2*y^2 + x")];
    expect(verifyGroebner(Z(F), integerCoefficients, 2, R.cmp)).toBe(false);
    expect(verifyGroebner(Z(groebnerBasis(F)), integerCoefficients, 2, R.cmp)).toBe(true);
  });
  it("rejects a basis with one element dropped (cyclic-5 over Z/32003)", () => {
    const sys = cyclic(5);
    const P = new PolynomialRing(sys.vars, primeField(32003), "grevlex");
    const G = groebnerBasis(sys.polys.map((s) => P.parse(s))).map(toEngine);
    const K = primeCoefficients(32003);
    expect(verifyGroebner(G, K, 5, P.cmp)).toBe(true);
    expect(verifyGroebner(G.filter((_, i) => i !== 7), K, 5, P.cmp)).toBe(false);
  });
});
