import { describe, expect, it } from "vitest";
import { PolynomialRing, primeField } from "@domain/algebra/index";
import { buchberger } from "@domain/algebra/groebner/buchberger";
import { primeCoefficients } from "@domain/algebra/groebner/coefficients";
import { fromEngine, toEngine } from "@domain/algebra/groebner/convert";
import { f4GroebnerModP, f4SupportsPrime, isGradedOrder } from "@domain/algebra/f4/prime-field";
import { Limits } from "@domain/algebra/groebner/limits";
import { cyclic } from "../../../fixtures/algebra/systems";

const GF = primeField(32003);

describe("F4 over Z/p", () => {
  it("gives the file's example: [x^2 - y, x*y - 1] → [y^2 - x, x*y - 1, x^2 - y] (grevlex, GF(32003))", () => {
    const R = new PolynomialRing(["x", "y"], GF, "grevlex");
    const G = f4GroebnerModP([R.parse("x^2 - y"), R.parse("x*y - 1")], new Limits());
    expect(G.map((g) => R.format(g))).toEqual(["y^2 - x", "x*y - 1", "x^2 - y"]);
  });

  it("agrees with Buchberger's basis on cyclic-4 in grevlex and in lex", () => {
    const sys = cyclic(4);
    for (const order of ["grevlex", "lex"]) {
      const R = new PolynomialRing(sys.vars, GF, order);
      const F = sys.polys.map((s) => R.parse(s));
      const f4 = f4GroebnerModP(F, new Limits()).map((g) => R.format(g));
      const classic = buchberger(F.map(toEngine), primeCoefficients(32003), R.n, R.cmp).map((g) => R.format(fromEngine(R, g)));
      expect(f4, order).toEqual(classic);
    }
  });

  it("runs for primes below 2^26 and selects by degree only in graded orders", () => {
    expect([f4SupportsPrime(67108859), f4SupportsPrime(2 ** 26 + 15)]).toEqual([true, false]);
    expect(isGradedOrder(new PolynomialRing(["x"], GF, "grevlex"))).toBe(true);
    expect(isGradedOrder(new PolynomialRing(["x", "y"], GF, "lex"))).toBe(false);
  });
});
