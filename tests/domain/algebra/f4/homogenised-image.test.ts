import { describe, expect, it } from "vitest";
import { PolynomialRing, groebnerBasis, primeField } from "@domain/algebra/index";
import { homogenisedF4ModP } from "@domain/algebra/f4/homogenised-image";
import { MonomialTable } from "@domain/algebra/f4/monomial-table";
import { toF4 } from "@domain/algebra/f4/prime-field";
import { Limits } from "@domain/algebra/groebner/limits";

/**
 * The reduced basis mod p through F^h in "degree, then the order" (homogenised-image.ts), against
 * Buchberger's algorithm directly in the order (this project's reference implementation, itself
 * checked against SymPy and Singular in sympy.test.ts / singular.test.ts). Reduced bases are
 * unique (Cox, Little, O'Shea, "Ideals, Varieties, and Algorithms", ch. 2 §7, Prop. 6).
 */
const F = primeField(32003);

function viaHomogenised(vars: string[], order: string, polys: string[]): string[] {
  const R = new PolynomialRing(vars, F, order);
  const T = new MonomialTable(R.n);
  const input = polys.map((s) => R.parse(s)).map((f) => toF4(T, f.exps, f.coeffs));
  const G = homogenisedF4ModP(input, T, F.p, R.order, R.cmp, { limits: new Limits() });
  return G.map((g) => R.format({ ring: R, coeffs: Array.from(g.coeffs), exps: T.packed(g.mons) } as never));
}

function direct(vars: string[], order: string, polys: string[]): string[] {
  const R = new PolynomialRing(vars, F, order);
  return groebnerBasis(polys.map((s) => R.parse(s)), { method: "buchberger", fglm: false }).map((g) => R.format(g));
}

describe("homogenisedF4ModP", () => {
  it("handles h-torsion in lex: {x^2 - y, x^3 - x} gives x*y - x and y^2 - y, which F^h reaches only times h", () => {
    // By hand: x^3 - x - x*(x^2 - y) = x*y - x; x*(x*y - x) - y*(x^2 - y) = y^2 - x^2, minus (x^2 - y) = y^2 - y.
    const G = viaHomogenised(["x", "y"], "lex", ["x^2 - y", "x^3 - x"]);
    expect(G).toEqual(["y^2 - y", "x*y - x", "x^2 - y"]);
    expect(G).toEqual(direct(["x", "y"], "lex", ["x^2 - y", "x^3 - x"]));
  });

  it("gives [1] for an ideal containing 1 (x*y - 1, x in lex)", () => {
    expect(viaHomogenised(["x", "y"], "lex", ["x*y - 1", "x"])).toEqual(["1"]);
  });

  it("agrees with Buchberger on a positive-dimensional block-order ideal with parameters below (a one-site cycle, k symbolic)", () => {
    // Mass-action one-site cycle with the binding constant k symbolic (invented constants):
    // species C, E, S, P in lex above k; dimension one (k free).
    const vars = ["C", "E", "S", "P", "k"];
    const polys = ["k*E*S - 2*C", "C - 3*P", "C + E - 1", "C + S + P - 2"];
    for (const order of ["lex(4), grevlex(1)", "lex"]) {
      expect(viaHomogenised(vars, order, polys), order).toEqual(direct(vars, order, polys));
    }
  });

  it("agrees with Buchberger in a weighted order and in grevlex blocks", () => {
    const polys = ["x^2*y - z^2 + 1", "x*z^2 - y^3 + x", "y*z - x^2 + 3"];
    for (const order of ["weighted(1,2,3)", "grevlex(2), grevlex(1)", "lex(1), grevlex(2)"]) {
      expect(viaHomogenised(["x", "y", "z"], order, polys), order).toEqual(direct(["x", "y", "z"], order, polys));
    }
  });
});
