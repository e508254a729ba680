import { describe, expect, it } from "vitest";
import { PolynomialRing, QQ } from "@domain/algebra/index";
import { isPrime } from "@domain/algebra/field";
import { MODULAR_PRIMES, modularGroebnerQQ, plainFractionFree } from "@domain/algebra/groebner/modular";
import { Limits } from "@domain/algebra/groebner/limits";
import { clearDenominators, toEngine } from "@domain/algebra/groebner/convert";
import { cyclic } from "../../../fixtures/algebra/systems";

describe("modularGroebnerQQ (traced modular run replayed over Z)", () => {
  it("uses primes below 2^26, so products of residues stay exact in a double", () => {
    expect(MODULAR_PRIMES.length).toBeGreaterThan(1);
    for (const p of MODULAR_PRIMES) {
      expect(isPrime(p)).toBe(true);
      expect(p < 2 ** 26 && (p - 1) * (p - 1) < 2 ** 53).toBe(true);
    }
  });

  it("gives the plain fraction-free algorithm's basis on cyclic-4 (grevlex)", () => {
    const sys = cyclic(4);
    const R = new PolynomialRing(sys.vars, QQ, "grevlex");
    const F = sys.polys.map((s) => R.parse(s));
    const modular = modularGroebnerQQ(F, "sugar", new Limits()).map((g) => R.format(g));
    const plain = plainFractionFree(F.map((f) => clearDenominators(toEngine(f))), R, "sugar", new Limits()).map((g) => R.format(g));
    expect(modular).toEqual(plain);
    expect(modular.length).toBeGreaterThan(4);
  });

  it("gives the lex basis {x - y, y^2 - 1/2} of x^2 + y^2 - 1, x - y (SymPy groebner: [x - y, 2*y**2 - 1])", () => {
    const R = new PolynomialRing(["x", "y"], QQ, "lex");
    const G = modularGroebnerQQ([R.parse("x^2 + y^2 - 1"), R.parse("x - y")], "normal", new Limits()).map((g) => R.format(g));
    expect(G.sort()).toEqual(["x - y", "y^2 - 1/2"].sort());
  });
});
