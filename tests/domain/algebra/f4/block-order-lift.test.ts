import { describe, expect, it } from "vitest";
import { PolynomialRing, QQ, groebnerBasis } from "@domain/algebra/index";
import { Limits } from "@domain/algebra/groebner/limits";
import { blockOrderBasisQQ } from "@domain/algebra/f4/block-order-lift";
import { seriesRoute } from "@domain/algebra/f4/distribution";
import type { LiftCandidate, MultiModularStats } from "@domain/algebra/f4/multimodular";
import { EARLY_PROOF_PRIMES, ImageLifter, imageModPrime, liftPrimes, multiModularInput, provesDehomogenised } from "@domain/algebra/f4/multimodular";
import { randomIdeal } from "../../../fixtures/algebra/systems";

/**
 * Lex and block orders over Q through I^h against the reference implementation (plain
 * fraction-free Buchberger of this project in the order itself, checked against SymPy 1.11 and
 * Singular 4.3 in sympy.test.ts / singular.test.ts). Reduced bases are unique (Cox, Little,
 * O'Shea, ch. 2 §7, Prop. 6), so "same basis" is exact.
 */
function setUp(vars: string[], order: string, polys: string[]) {
  const R = new PolynomialRing(vars, QQ, order);
  const F = polys.map((s) => R.parse(s));
  const grevlex = R.withOrder("grevlex");
  const G = groebnerBasis(F.map((f) => grevlex.parse(R.format(f))), { method: "buchberger" });
  return { R, F, G, want: groebnerBasis(F, { method: "buchberger" }).map((g) => R.format(g)) };
}
const fresh = (): MultiModularStats => ({ primes: 0, unlucky: 0, modularMs: 0, liftMs: 0, proofMs: 0 });

describe("block and lex orders over Q through I^h", () => {
  const orders = ["lex", "lex(2), grevlex(1)", "lex(1), grevlex(2)"];
  for (let seed = 1; seed <= 6; seed++) {
    const big = seed > 3;
    const order = orders[seed % 3];
    it(`random ideal ${seed} in ${order}${big ? " with 40-digit coefficients (both lifts and the proof against I^h)" : " (small: h = 1 over Q)"}`, () => {
      const s = randomIdeal(seed * 101, {
        nvars: 3, npolys: 2, maxDegree: 2, minTerms: 2, minDegree: 1, maxTerms: 3, coeffBound: big ? 10n ** 40n : 50n, fractions: true,
      });
      const { R, F, G, want } = setUp(s.vars, order, s.polys);
      const stats = fresh();
      const ours = blockOrderBasisQQ(F, G, new Limits(), { primeLimit: 2 ** 26, stats });
      expect(stats.failed).toBeUndefined();
      expect(ours?.map((g) => R.format(g))).toEqual(want);
      if (big) expect(stats.primes).toBeGreaterThan(EARLY_PROOF_PRIMES);
    });
  }

  it("is what groebnerBasis answers in a block order (method f4 skips the traced trial)", () => {
    const { R, F, want } = setUp(["x", "y", "k"], "lex(2), grevlex(1)", ["k*x^2 - y", "x + y - 1", "3/7*x*y*k - 2*y^2 + 1"]);
    expect(groebnerBasis(F, { method: "f4" }).map((g) => R.format(g))).toEqual(want);
  });

  it("the proof against I^h rejects a basis with a wrong lead, a non-reduced one and one that leaves I", () => {
    const s = randomIdeal(4242, { nvars: 3, npolys: 2, maxDegree: 2, minTerms: 2, minDegree: 1, maxTerms: 3, coeffBound: 10n ** 30n, fractions: true });
    const { R, F, G, want } = setUp(s.vars, "lex(1), grevlex(2)", s.polys);
    const route = seriesRoute(R, G, 2 ** 26);
    const hInput = route.input(), gInput = multiModularInput(F, G, 2 ** 26);
    const hLifter = new ImageLifter(hInput), gLifter = new ImageLifter(gInput);
    let h: LiftCandidate | null = null, g: LiftCandidate | null = null;
    for (const p of liftPrimes(hInput)) {
      const image = imageModPrime(hInput, p, new Limits());
      h ??= hLifter.add(image);
      g ??= gLifter.add(imageModPrime(gInput, p, new Limits()));
      if (h && g) break;
    }
    expect(g!.basis).toEqual(want);
    const check = (basis: readonly string[]) => provesDehomogenised(gInput, { ...g!, basis }, hInput, h!, new Limits());
    expect(check(want)).toBe(true);
    expect(want.length).toBeGreaterThan(1);
    expect(check(want.slice(1))).toBe(false); // a lead missing
    // Not reduced: the largest element plus a multiple of the smallest (still in I, same lead).
    const top = want.length - 1;
    const sum = R.format(R.parse(`${want[top]} + 2*(${want[0]})`));
    expect(check([...want.slice(0, top), sum])).toBe(false);
    // Leaves I: one tail coefficient changed.
    const last = R.parse(want[top]);
    const bent = R.format({ ...last, coeffs: last.coeffs.map((c, t) => (t === last.coeffs.length - 1 ? { num: c.num + c.den, den: c.den } : c)) });
    expect(check([...want.slice(0, top), bent])).toBe(false);
  });
});
