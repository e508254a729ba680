import { describe, expect, it } from "vitest";
import { hilbertNumerator, sameNumerator } from "@domain/algebra/hilbert-series";
import { prng, randInt } from "../../fixtures/algebra/systems";

/**
 * Hilbert series numerators against the definition: HS(k[x]/M) = Σ_d #{monomials of degree d
 * outside M} t^d, counted here by enumerating monomials, and N(t) = HS·(1 − t)^m.
 */
function standardMonomialsByDegree(gens: readonly number[][], m: number, D: number): number[] {
  const counts = new Array<number>(D + 1).fill(0);
  const e = new Array<number>(m).fill(0);
  const visit = (k: number, left: number, d: number) => {
    if (k === m - 1) {
      e[k] = left;
      if (!gens.some((g) => g.every((x, i) => x <= e[i]))) counts[d]++;
      return;
    }
    for (let x = 0; x <= left; x++) {
      e[k] = x;
      visit(k + 1, left - x, d);
    }
  };
  for (let d = 0; d <= D; d++) visit(0, d, d);
  return counts;
}

/** The first D + 1 coefficients of N(t)/(1 − t)^m. */
function expand(N: readonly bigint[], m: number, D: number): number[] {
  let s = Array.from({ length: D + 1 }, (_, i) => (i < N.length ? Number(N[i]) : 0));
  for (let k = 0; k < m; k++) {
    const out: number[] = [];
    let acc = 0;
    for (const c of s) out.push((acc += c));
    s = out;
  }
  return s;
}

describe("Hilbert series numerators of monomial ideals", () => {
  it("⟨x^2, xy⟩ in k[x, y] gives 1 − 2t^2 + t^3 (worked by hand: dimensions 1, 2, 1, 1, …)", () => {
    expect(hilbertNumerator([[2, 0], [1, 1]], 2)).toEqual([1n, 0n, -2n, 1n]);
  });

  it("the zero ideal gives 1, the unit ideal 0, a regular sequence the product of (1 − t^d)", () => {
    expect(hilbertNumerator([], 3)).toEqual([1n]);
    expect(hilbertNumerator([[0, 0]], 2)).toEqual([0n]);
    expect(hilbertNumerator([[2, 0, 0], [0, 3, 0]], 3)).toEqual([1n, 0n, -1n, -1n, 0n, 1n]);
  });

  it("does not depend on redundant generators or their order", () => {
    const a = hilbertNumerator([[1, 2, 0], [0, 1, 3], [2, 2, 2], [1, 2, 0]], 3);
    const b = hilbertNumerator([[0, 1, 3], [1, 2, 0]], 3);
    expect(sameNumerator(a, b)).toBe(true);
    expect(sameNumerator(a, hilbertNumerator([[0, 1, 3]], 3))).toBe(false);
  });

  it("matches counting standard monomials on 60 random ideals in 2–5 variables", () => {
    const rnd = prng(4242);
    for (let rep = 0; rep < 60; rep++) {
      const m = randInt(rnd, 2, 5);
      const gens = Array.from({ length: randInt(rnd, 1, 7) }, () => Array.from({ length: m }, () => randInt(rnd, 0, 4)));
      const D = 12;
      const N = hilbertNumerator(gens, m);
      expect(expand(N, m, D), JSON.stringify(gens)).toEqual(standardMonomialsByDegree(gens, m, D));
    }
  });

  it("rejects a generator of the wrong length", () => {
    expect(() => hilbertNumerator([[1, 2]], 3)).toThrow(/expected 3/);
  });
});
