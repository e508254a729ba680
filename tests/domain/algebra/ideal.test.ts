import { describe, expect, it } from "vitest";
import { PolynomialRing, QQ, add, equals, groebnerBasis, idealMembership, isZeroPoly, mul, normalForm, primeField, zeroPoly } from "@domain/algebra/index";
import type { Field, Polynomial } from "@domain/algebra/index";
import { prng, randomPolyText } from "../../fixtures/algebra/systems";

const expand = <C>(cof: Polynomial<C>[], gens: Polynomial<C>[]) => cof.reduce((acc, c, j) => add(acc, mul(c, gens[j])), zeroPoly(gens[0].ring));

describe("normal forms", () => {
  it("reduces modulo a Gröbner basis (lex, G = [x - y^2, y^3 - 1])", () => {
    const R = new PolynomialRing(["x", "y"], QQ, "lex");
    const G = [R.parse("x - y^2"), R.parse("y^3 - 1")];
    expect(R.format(normalForm(R.parse("x^2 + y"), G))).toBe("2*y");
    expect(R.format(normalForm(R.parse("3/2*x^2 + y"), G))).toBe("5/2*y"); // keeps the scale (no monic rescaling)
  });
});

describe("ideal membership with cofactors", () => {
  // Cox, Little, O'Shea, "Ideals, Varieties, and Algorithms", 4th ed., ch. 2 §8: with
  // I = <x*z - y^2, x^3 - z^2> (grlex), f = -4*x^2*y^2*z^2 + y^6 + 3*z^5 lies in I (recalled from memory).
  it("CLO ch. 2 §8: f is in I, cofactors expand back to f", () => {
    const R = new PolynomialRing(["x", "y", "z"], QQ, "grlex");
    const gens = [R.parse("x*z - y^2"), R.parse("x^3 - z^2")];
    const f = R.parse("-4*x^2*y^2*z^2 + y^6 + 3*z^5");
    const res = idealMembership(f, gens);
    expect(res.member).toBe(true);
    expect(equals(expand(res.cofactors!, gens), f)).toBe(true);
    // ... and x*y - 5*z^2 + x is not in I (same source, recalled from memory).
    const g = idealMembership(R.parse("x*y - 5*z^2 + x"), gens);
    expect(g.member).toBe(false);
    expect(isZeroPoly(g.remainder)).toBe(false);
  });

  it("random combinations are members with verified cofactors (seeded, Q and Z/p)", () => {
    const rnd = prng(5);
    for (const field of [QQ, primeField(101)] as Field<unknown>[]) {
      const R = new PolynomialRing(["x", "y", "z"], field, "grevlex");
      for (let t = 0; t < 6; t++) {
        const opts = { nvars: 3, npolys: 1, maxDegree: 2, maxTerms: 3, coeffBound: 20n };
        const gens = [0, 1].map(() => R.parse(randomPolyText(rnd, R.vars, opts)));
        if (gens.some(isZeroPoly)) continue;
        const f = add(mul(R.parse(randomPolyText(rnd, R.vars, opts)), gens[0]), mul(R.parse(randomPolyText(rnd, R.vars, opts)), gens[1]));
        const res = idealMembership(f, gens);
        expect(res.member).toBe(true);
        expect(equals(expand(res.cofactors!, gens), f)).toBe(true);
        // Consistent with the reduced basis.
        expect(isZeroPoly(normalForm(f, groebnerBasis(gens)))).toBe(true);
      }
    }
  });
});
