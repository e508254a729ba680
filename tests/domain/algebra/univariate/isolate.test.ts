import { describe, expect, it } from "vitest";
import { type Rational, compare, formatRational } from "@domain/algebra/rational";
import {
  type IntPoly,
  type RootInterval,
  compareRootWithRational,
  countRealRootsSturm,
  fromIntegerCoefficients,
  fromRoots,
  isExactRoot,
  isolateRealRoots,
  mulInt,
  rootBoundExponent,
  signAt,
  squareFreePart,
  subInt,
} from "@domain/algebra/univariate";
import { AlgebraError } from "@domain/algebra/errors";
import { UnivariateError } from "@domain/algebra/univariate";
import { expectValidIsolation, prng, q } from "./helpers";

const text = (ivs: readonly RootInterval[]) =>
  ivs.map((iv) => `[${formatRational(iv.lo)}, ${formatRational(iv.hi)}]x${iv.multiplicity}`);

/** Index of the interval holding the root r exactly, or -1. */
const holding = (p: IntPoly, ivs: readonly RootInterval[], r: Rational) =>
  ivs.findIndex((iv) => compareRootWithRational(p, iv, r) === 0);

/** Intervals across which the factor vanishes or changes sign: where its roots lie. */
const holdingRootsOf = (factor: IntPoly, ivs: readonly RootInterval[]) =>
  ivs.filter((iv) => (isExactRoot(iv) ? signAt(factor, iv.lo) === 0 : signAt(factor, iv.lo) * signAt(factor, iv.hi) < 0)).length;

function power(p: IntPoly, e: number): IntPoly {
  let r: IntPoly = [1n];
  for (let i = 0; i < e; i++) r = mulInt(r, p);
  return r;
}

describe("isolateRealRoots (Collins & Akritas 1976, bisection with Descartes' rule)", () => {
  it("x^3 - 2x: ±√2 in intervals, 0 exact", () => {
    const p = fromIntegerCoefficients([0, -2, 0, 1]);
    const ivs = isolateRealRoots(p);
    expect(text(ivs)).toEqual(["[-2, -1]x1", "[0, 0]x1", "[1, 2]x1"]);
    expect(expectValidIsolation(p, ivs)).toEqual([]);
  });

  it("positiveOnly keeps the strictly positive roots", () => {
    const p = mulInt(fromRoots([q(-3), q(0), q(5, 2), q(1, 7)]), [-2n, 0n, 1n]);
    const all = isolateRealRoots(p);
    const pos = isolateRealRoots(p, { positiveOnly: true });
    expect(all).toHaveLength(6);
    expect(pos).toHaveLength(3);
    for (const iv of pos) expect(iv.lo.num >= 0n && iv.hi.num > 0n).toBe(true);
    for (const r of [q(5, 2), q(1, 7)]) expect(holding(p, pos, r)).toBeGreaterThanOrEqual(0);
    expect(holdingRootsOf([-2n, 0n, 1n], pos)).toBe(1);
  });

  it("reports multiplicities from the square-free factorisation", () => {
    const p = mulInt(fromRoots([q(1, 2), q(1, 2), q(3), q(-1, 3), q(0), q(0), q(0)]), [-2n, 0n, 1n]);
    const ivs = isolateRealRoots(p);
    expect(ivs.map((iv) => iv.multiplicity)).toEqual([1, 1, 3, 2, 1, 1]);
    expect(holding(p, ivs, q(0))).toBe(2);
    expect(holding(p, ivs, q(1, 2))).toBe(3);
    expect(expectValidIsolation(p, ivs)).toEqual([]);
    const squared = power(fromIntegerCoefficients([-2, 0, 1]), 4);
    expect(isolateRealRoots(squared).map((iv) => iv.multiplicity)).toEqual([4, 4]);
  });

  it("no real roots, constants, and the zero polynomial", () => {
    expect(isolateRealRoots([1n, 0n, 1n])).toEqual([]);
    expect(isolateRealRoots([q(5, 3)])).toEqual([]);
    expect(() => isolateRealRoots([])).toThrow(expect.objectContaining({ code: "domain", reason: "zero-polynomial" }));
  });

  it("separates clustered roots 1/1000 apart and a pair 10^-12 apart", () => {
    const cluster = Array.from({ length: 10 }, (_, k) => q(1000 + k, 1000));
    const tight = [q(1, 3), q(10n ** 12n + 3n, 3n * 10n ** 12n)];
    const p = mulInt(fromRoots([...cluster, ...tight]), [-2n, 0n, 1n]);
    const ivs = isolateRealRoots(p);
    expect(ivs).toHaveLength(14);
    expect(expectValidIsolation(p, ivs)).toEqual([]);
    const idx = [...cluster, ...tight].map((r) => holding(p, ivs, r));
    expect(new Set(idx).size).toBe(12);
    expect(idx.every((i) => i >= 0)).toBe(true);
  });

  it("Wilkinson's polynomial Π_{i=1..20} (x - i): all twenty integers, in order", () => {
    const roots = Array.from({ length: 20 }, (_, i) => q(i + 1));
    const w = fromRoots(roots);
    const ivs = isolateRealRoots(w);
    expect(ivs).toHaveLength(20);
    roots.forEach((r, i) => expect(compareRootWithRational(w, ivs[i], r)).toBe(0));
    expect(expectValidIsolation(w, ivs)).toEqual([]);
  });

  it("Wilkinson's perturbed polynomial (x^19 coefficient - 2^-23) has 10 real roots", () => {
    // Wilkinson 1959, "The evaluation of the zeros of ill-conditioned polynomials": the perturbation
    // turns ten of the roots into five complex pairs (recalled from memory; SymPy cross-check in
    // isolate-sympy.test.ts). Integer form: 2^23·W(x) - x^19.
    const w = fromRoots(Array.from({ length: 20 }, (_, i) => q(i + 1)));
    const x19 = fromIntegerCoefficients([...Array(19).fill(0), 1]);
    const p = subInt(w.map((c) => c << 23n), x19);
    const ivs = isolateRealRoots(p);
    expect(ivs).toHaveLength(10);
    expect(countRealRootsSturm(p)).toBe(10);
    expect(expectValidIsolation(p, ivs)).toEqual([]);
    // the largest real root lies between 20.84 and 20.85 (recalled from memory: 20.8469…)
    const last = ivs[9];
    expect(compareRootWithRational(p, last, q(2084, 100))).toBe(1);
    expect(compareRootWithRational(p, last, q(2085, 100))).toBe(-1);
  });

  it("Mignotte-like x^n - 2(ax - 1)^2 with two roots about 2a^-(n+2)/2 apart", () => {
    // Mignotte 1981, "Some inequalities about univariate polynomials" (recalled from memory).
    for (const [n, a] of [[10, 10], [20, 100], [30, 10]] as const) {
      const lin = [-1n, BigInt(a)];
      const p = subInt(fromIntegerCoefficients([...Array(n).fill(0), 1]), mulInt([2n], mulInt(lin, lin)));
      const ivs = isolateRealRoots(p);
      expect(ivs.length).toBe(countRealRootsSturm(p));
      expect(expectValidIsolation(p, ivs)).toEqual([]);
      // two distinct roots inside (1/a - 1/a^2, 1/a + 1/a^2)
      const near = countRealRootsSturm(p, q(a - 1, a * a), q(a + 1, a * a));
      expect(near).toBe(2);
      const inside = ivs.filter((iv) => compare(iv.lo, q(a - 1, a * a)) >= 0 && compare(iv.hi, q(a + 1, a * a)) <= 0);
      expect(inside).toHaveLength(2);
    }
  });

  it("seeded random products: never misses a known root; count = Sturm = grid sign changes", () => {
    const rnd = prng(2024);
    for (let t = 0; t < 60; t++) {
      // distinct rational roots on a 1/8 lattice (so a 1/64 grid separates them), some repeated
      const distinct = new Map<string, Rational>();
      while (distinct.size < rnd.int(1, 7)) {
        const r = q(rnd.int(-80, 80), 8);
        distinct.set(formatRational(r), r);
      }
      const roots = [...distinct.values()].flatMap((r) => Array(rnd.pick([1, 1, 1, 2, 3])).fill(r));
      let p = fromRoots(roots);
      const quadratic: IntPoly = rnd.pick([[-2n, 0n, 1n], [-3n, 0n, 1n], [1n, 1n, 1n], [5n, 0n, 1n]]);
      p = mulInt(p, quadratic);
      const ivs = isolateRealRoots(p);
      expect(expectValidIsolation(p, ivs)).toEqual([]);
      expect(ivs).toHaveLength(countRealRootsSturm(p));
      for (const r of distinct.values()) expect(holding(p, ivs, r)).toBeGreaterThanOrEqual(0);
      const irrational = quadratic[0] < 0n ? 2 : 0; // x^2 - 2, x^2 - 3 have two real roots
      expect(holdingRootsOf(quadratic, ivs)).toBe(irrational);
      expect(ivs).toHaveLength(distinct.size + irrational);
      for (const iv of ivs) expect(countRealRootsSturm(p, iv.lo, iv.hi)).toBe(1);
      // Grid check where it applies (rational roots only, 1/8 apart): the square-free part sampled at
      // the off-lattice points (2k + 1)/128 over the root bound changes sign once per root.
      if (irrational === 0) {
        const f = squareFreePart(p);
        const s = rootBoundExponent(f);
        let zeros = 0;
        let changes = 0;
        let prev = 0;
        for (let k = -(64 << s) + 1; k < 64 << s; k++) {
          const sg = signAt(f, q(2 * k + 1, 128)); // off-lattice points: never a root
          if (prev !== 0 && sg !== prev) changes++;
          prev = sg;
          if (sg === 0) zeros++;
        }
        expect(zeros).toBe(0);
        expect(changes).toBe(ivs.length);
      }
    }
  });

  it("random integer polynomials: valid isolation, count = Sturm (seeded)", () => {
    const rnd = prng(77);
    for (let t = 0; t < 60; t++) {
      const deg = rnd.int(1, 14);
      const big = rnd.int(0, 1) === 1;
      const p = fromIntegerCoefficients([
        ...Array.from({ length: deg }, () => (big ? rnd.int(-1e9, 1e9) : rnd.int(-5, 5))),
        rnd.int(1, 9),
      ]);
      const ivs = isolateRealRoots(p);
      expect(expectValidIsolation(p, ivs)).toEqual([]);
      expect(ivs).toHaveLength(countRealRootsSturm(p));
      const pos = isolateRealRoots(p, { positiveOnly: true });
      expect(pos).toHaveLength(countRealRootsSturm(p, q(1, 10n ** 30n)));
    }
  });

  it("accepts rational coefficients and finds tiny, huge and linear roots", () => {
    const p = [q(-1, 2), q(0), q(1, 4)]; // x^2/4 - 1/2: roots ±√2
    expect(text(isolateRealRoots(p))).toEqual(["[-2, -1]x1", "[1, 2]x1"]);
    expect(text(isolateRealRoots([q(-3, 7), q(2)]))).toHaveLength(1);
    expect(compareRootWithRational([-3n, 14n], isolateRealRoots([-3n, 14n])[0], q(3, 14))).toBe(0);
    for (const r of [q(1, 10n ** 30n), q(10n ** 30n), q(-7, 10n ** 40n), q(-(10n ** 25n), 3)]) {
      const f = mulInt(fromRoots([r]), [-2n, 0n, 1n]);
      const ivs = isolateRealRoots(f);
      expect(ivs).toHaveLength(3);
      expect(holding(f, ivs, r)).toBeGreaterThanOrEqual(0);
      expect(expectValidIsolation(f, ivs)).toEqual([]);
    }
  });

  it("honours a past deadline and an aborted signal", () => {
    const p = fromRoots(Array.from({ length: 20 }, (_, i) => q(i + 1, 7)));
    expect(() => isolateRealRoots(p, { deadline: Date.now() - 1 })).toThrow(expect.objectContaining({ code: "timeout", reason: "deadline" }));
    const controller = new AbortController();
    controller.abort();
    expect(() => isolateRealRoots(p, { signal: controller.signal })).toThrow(expect.objectContaining({ code: "cancelled", reason: "aborted" }));
  });
});

describe("errors", () => {
  it("belong to the engine's AlgebraError family", () => {
    try {
      isolateRealRoots([]);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(AlgebraError);
      expect(e).toBeInstanceOf(UnivariateError);
      expect((e as UnivariateError).message).toMatch(/zero polynomial/);
    }
  });
});
