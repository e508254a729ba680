import { describe, expect, it } from "vitest";
import { packMonomial } from "@domain/algebra/index";
import { updatePairs } from "@domain/algebra/groebner/pairs";
import type { BasisEntry, CriticalPair } from "@domain/algebra/groebner/pairs";

const entry = (e: number[]): BasisEntry => ({ lm: packMonomial(e), sugar: e.reduce((a, b) => a + b, 0), live: true });

/** Adds leading monomials one at a time, as the algorithm does. */
function build(lms: number[][], n: number) {
  const basis: BasisEntry[] = [];
  let pairs: CriticalPair[] = [];
  for (const e of lms) {
    basis.push(entry(e));
    pairs = updatePairs(basis, pairs, basis.length - 1, n);
  }
  return { basis, pairs };
}

describe("Gebauer–Möller update", () => {
  it("drops coprime pairs (product criterion) and keeps the others", () => {
    const { basis, pairs: p0 } = build([[1, 0], [0, 1]], 2);
    let pairs = p0;
    expect(pairs).toEqual([]); // x and y are coprime
    basis.push(entry([1, 1]));
    pairs = updatePairs(basis, pairs, 2, 2);
    // x*y is divisible by both earlier leading monomials: they stay, the new one is not live.
    expect(basis[2].live).toBe(true);
    expect(basis[0].live && basis[1].live).toBe(true);
  });
  it("marks elements whose leading monomial the new one divides as not live", () => {
    const { basis, pairs: p0 } = build([[2, 1], [0, 3]], 2);
    let pairs = p0;
    expect(pairs.map((p) => [p.i, p.j])).toEqual([[0, 1]]);
    basis.push(entry([1, 1]));
    pairs = updatePairs(basis, pairs, 2, 2);
    expect(basis[0].live).toBe(false);
    // The old pair (0,1) has lcm x^2y^3; LM x*y divides it and both new lcms differ from it: removed (B_k criterion).
    expect(pairs.some((p) => p.i === 0 && p.j === 1)).toBe(false);
    // Among the new pairs (0,2) lcm x^2y and (1,2) lcm xy^3 both survive.
    expect(pairs.map((p) => [p.i, p.j]).sort()).toEqual([[0, 2], [1, 2]]);
  });
  it("keeps one pair per lcm (chain criterion)", () => {
    const { basis, pairs: p0 } = build([[1, 1, 0], [1, 0, 1]], 3);
    let pairs = p0;
    basis.push(entry([0, 1, 1]));
    pairs = updatePairs(basis, pairs, 2, 3);
    // Three pairs share the lcm x*y*z; one of them is redundant (chain criterion): two remain.
    const lcms = pairs.map((p) => Array.from(p.lcm).join(","));
    expect(lcms.every((l) => l === "3,1,1,1")).toBe(true);
    expect(pairs.map((p) => [p.i, p.j]).sort()).toEqual([[0, 1], [1, 2]]);
  });
});
