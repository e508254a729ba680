import { describe, expect, it } from "vitest";
import { PolynomialRing, QQ } from "@domain/algebra/index";
import { fieldCoefficients } from "@domain/algebra/groebner/coefficients";
import { fromEngine, toEngine } from "@domain/algebra/groebner/convert";
import { maskOf, ReductionKernel, toReducer } from "@domain/algebra/groebner/reduce";
import { divMask } from "@domain/algebra/monomial";

const R = new PolynomialRing(["x", "y"], QQ, "lex");
const K = fieldCoefficients(QQ);
const reducers = (...ps: string[]) => ps.map((p) => toReducer(toEngine(R.parse(p)), 2));

describe("ReductionKernel", () => {
  it("computes the normal form of x^2*y + x*y^2 + y^2 by {x*y - 1, y^2 - 1}: remainder x + y + 1 (Cox, Little & O'Shea, ch. 2 §3, Example 5; SymPy reduced gives the same remainder)", () => {
    const kernel = new ReductionKernel(K, 2, R.cmp, () => {}, false);
    const r = kernel.reduce(toEngine(R.parse("x^2*y + x*y^2 + y^2")), reducers("x*y - 1", "y^2 - 1"), true);
    expect(R.format(fromEngine(R, r))).toBe("x + y + 1");
    expect(kernel.steps).toBeGreaterThan(0);
  });

  it("reduces only the head when not asked for the full normal form", () => {
    const kernel = new ReductionKernel(K, 2, R.cmp, () => {}, false);
    // x^2 + y^3 by x - y: the head x^2 goes (→ x*y → y^2), the tail y^3 is not divisible by x anyway.
    const head = kernel.reduce(toEngine(R.parse("x^2 + y^3")), reducers("x - y"), false);
    expect(R.format(fromEngine(R, head))).toBe("y^3 + y^2");
    // A head no reducer divides stays as it is.
    const kept = kernel.reduce(toEngine(R.parse("y^2 + x")), reducers("x^2"), false);
    expect(R.format(fromEngine(R, kept))).toBe("x + y^2");
  });

  it("normalises results to monic when asked", () => {
    const kernel = new ReductionKernel(K, 2, R.cmp);
    const r = kernel.reduce(toEngine(R.parse("2*x + 4*y")), [], true);
    expect(R.format(fromEngine(R, r))).toBe("x + 2*y");
  });

  it("caches the same divisibility mask as the monomial layer", () => {
    const p = toEngine(R.parse("x*y^2 + 1"));
    expect(maskOf(p.exps, 0, 2)).toBe(divMask(p.exps, 0, 2));
  });
});
