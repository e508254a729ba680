import { describe, expect, it } from "vitest";
import {
  countRealRootsSturm,
  fromIntegerCoefficients,
  fromRoots,
  mulInt,
  sturmSequence,
} from "@domain/algebra/univariate";
import { prng, q } from "./helpers";

describe("Sturm sequences", () => {
  it("x^2 - 2 has the sequence x^2 - 2, x, 1 (Sturm 1829)", () => {
    expect(sturmSequence([-2n, 0n, 1n])).toEqual([[-2n, 0n, 1n], [0n, 1n], [1n]]);
  });

  it("counts distinct roots in closed intervals, endpoints included", () => {
    const p = fromIntegerCoefficients([0, -1, 0, 1]); // x^3 - x
    expect(countRealRootsSturm(p)).toBe(3);
    expect(countRealRootsSturm(p, q(0), q(1))).toBe(2);
    expect(countRealRootsSturm(p, q(1, 2), q(1))).toBe(1);
    expect(countRealRootsSturm(p, q(-1), q(-1))).toBe(1);
    expect(countRealRootsSturm(p, q(2), q(1))).toBe(0);
    expect(countRealRootsSturm([1n, 0n, 1n])).toBe(0); // x^2 + 1
    expect(countRealRootsSturm([7n])).toBe(0);
  });

  it("counts distinct roots, ignoring multiplicity", () => {
    const p = mulInt(fromRoots([q(1), q(1), q(1), q(-3, 2)]), [-2n, 0n, 1n]);
    expect(countRealRootsSturm(p)).toBe(4);
    expect(countRealRootsSturm(p, q(1), q(3, 2))).toBe(2);
  });

  it("matches known roots on seeded random cases and subintervals", () => {
    const rnd = prng(51);
    for (let t = 0; t < 40; t++) {
      const roots = Array.from({ length: rnd.int(1, 7) }, () => q(rnd.int(-40, 40), rnd.int(1, 6)));
      const p = mulInt(fromRoots(roots), [BigInt(rnd.int(1, 5)), 0n, 1n]); // an extra pair of complex roots
      const distinct = new Set(roots.map((r) => `${r.num}/${r.den}`));
      expect(countRealRootsSturm(p)).toBe(distinct.size);
      const lo = q(rnd.int(-40, 10), rnd.int(1, 4));
      const hi = q(rnd.int(-10, 40), rnd.int(1, 4));
      const inside = [...distinct].filter((s) => {
        const [n, d] = s.split("/").map(BigInt);
        return n * lo.den >= lo.num * d && n * hi.den <= hi.num * d;
      });
      expect(countRealRootsSturm(p, lo, hi)).toBe(inside.length);
    }
  });

  it("honours an aborted signal (Sturm sequence and gcd)", () => {
    const controller = new AbortController();
    controller.abort();
    const p = fromRoots([q(1), q(2), q(3)]);
    expect(() => sturmSequence(p, { signal: controller.signal })).toThrow(expect.objectContaining({ code: "cancelled", reason: "aborted" }));
    expect(() => countRealRootsSturm(p, undefined, undefined, { deadline: Date.now() - 1 })).toThrow(
      expect.objectContaining({ code: "timeout", reason: "deadline" }),
    );
  });

  it("refuses the zero polynomial", () => {
    expect(() => countRealRootsSturm([])).toThrow(expect.objectContaining({ code: "domain", reason: "zero-polynomial" }));
  });
});
