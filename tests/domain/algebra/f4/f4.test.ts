import { describe, expect, it } from "vitest";
import { AlgebraError, PolynomialRing, groebnerBasis, primeField } from "@domain/algebra/index";
import type { Progress } from "@domain/algebra/groebner/limits";
import { cyclic, katsura, randomIdeal } from "../../../fixtures/algebra/systems";

/**
 * F4 modulo a prime against the reference implementation (Buchberger's algorithm in this
 * project, itself checked against SymPy 1.11 and Singular 4.3 in sympy.test.ts / singular.test.ts):
 * reduced bases are unique (Cox, Little, O'Shea, ch. 2 §7, Prop. 6), so the sets must be equal.
 */
const F = primeField(32003);
const orders = ["grevlex", "grlex", "lex", "lex(1), grevlex(2)", "grevlex(2), grevlex(1)", "weighted(1,2,3)"];

function both(vars: string[], order: string, polys: string[]) {
  const R = new PolynomialRing(vars, F, order);
  const ps = polys.map((s) => R.parse(s));
  const f4 = groebnerBasis(ps, { method: "f4", fglm: false }).map((g) => R.format(g));
  const ref = groebnerBasis(ps, { method: "buchberger", fglm: false }).map((g) => R.format(g));
  return { f4, ref };
}

describe("F4 over Z/32003 agrees with Buchberger (reference implementation)", () => {
  for (let seed = 1; seed <= 24; seed++) {
    const order = orders[seed % orders.length];
    it(`random ideal ${seed} in ${order}`, () => {
      const s = randomIdeal(seed * 7, { nvars: 3, npolys: 2 + (seed % 3), maxDegree: 3, minTerms: 2, minDegree: 1, maxTerms: 4, coeffBound: 32002n });
      const { f4, ref } = both(s.vars, order, s.polys);
      expect(f4).toEqual(ref); // same elements in the same (increasing) order
    });
  }

  it("katsura-5 and cyclic-5 in grevlex", () => {
    for (const sys of [katsura(5), cyclic(5)]) {
      const { f4, ref } = both(sys.vars, "grevlex", sys.polys);
      expect(f4.length).toBeGreaterThan(10);
      expect(f4).toEqual(ref);
    }
  });

  it("an ideal containing 1 gives [1]; the zero ideal gives []", () => {
    const R = new PolynomialRing(["x", "y"], F, "grevlex");
    expect(groebnerBasis([R.parse("x*y - 1"), R.parse("x^2"), R.parse("y + x")], { method: "f4" }).map((g) => R.format(g))).toEqual(["1"]);
    expect(groebnerBasis([R.parse("0")], { method: "f4" })).toEqual([]);
  });

  it("a positive-dimensional ideal (a surface and a line) in a block order", () => {
    const { f4, ref } = both(["x", "y", "z", "w"], "lex(2), grevlex(2)", ["x*z - y*w", "x*y - z^2 + w", "y^2*z - w^3"]);
    expect(f4).toEqual(ref);
  });
});

describe("limits through the F4 path", () => {
  const R = new PolynomialRing(katsura(6).vars, F, "grevlex");
  const polys = katsura(6).polys.map((s) => R.parse(s));

  it("reports progress with the matrix size", () => {
    const seen: Progress[] = [];
    groebnerBasis(polys, { onProgress: (p) => seen.push(p) });
    const matrices = seen.filter((p) => p.matrixRows !== undefined);
    expect(matrices.length).toBeGreaterThan(3);
    expect(Math.max(...matrices.map((p) => p.matrixColumns!))).toBeGreaterThan(100);
    expect(seen.some((p) => p.degree > 2 && p.pairsLeft >= 0)).toBe(true);
  });

  it("stops on cancellation, on the basis-size budget and at the deadline", () => {
    const ac = new AbortController();
    let calls = 0;
    const cancelled = (() => { try { groebnerBasis(polys, { signal: ac.signal, onProgress: () => { if (++calls === 3) ac.abort(); } }); } catch (e) { return e; } })();
    expect(cancelled).toBeInstanceOf(AlgebraError);
    expect((cancelled as AlgebraError).code).toBe("cancelled");
    const budget = (() => { try { groebnerBasis(polys, { maxBasisSize: 5 }); } catch (e) { return e; } })();
    expect((budget as AlgebraError).code).toBe("budget");
    const late = (() => { try { groebnerBasis(polys, { deadline: Date.now() - 1 }); } catch (e) { return e; } })();
    expect((late as AlgebraError).code).toBe("timeout");
  });
});
