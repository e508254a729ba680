import { describe, expect, it } from "vitest";
import { add, compare, formatRational, sub } from "@domain/algebra/rational";
import {
  approximateRoot,
  compareRootWithRational,
  floatToRational,
  fromIntegerCoefficients,
  fromRoots,
  isExactRoot,
  isolateRealRoots,
  mulInt,
  rationalIntervalToFloat,
  refineRootInterval,
  signAt,
  subInt,
} from "@domain/algebra/univariate";
import { prng, q } from "./helpers";

const sqrt2 = fromIntegerCoefficients([-2, 0, 1]);

describe("refineRootInterval (quadratic interval refinement, exact signs)", () => {
  it("narrows (1, 2) around √2 to the requested width", () => {
    const [, pos] = isolateRealRoots(sqrt2);
    const r = refineRootInterval(sqrt2, pos, { width: q(1, 10n ** 40n) });
    expect(compare(sub(r.hi, r.lo), q(1, 10n ** 40n))).toBeLessThanOrEqual(0);
    expect(signAt(sqrt2, r.lo)).toBe(-1);
    expect(signAt(sqrt2, r.hi)).toBe(1);
    // √2 = 1.41421356237309504880168872420969807856967187537694… (recalled from memory)
    const digits = q(141421356237309504880168872420969807856967187537694n, 10n ** 50n);
    // √2 lies in (digits, digits + 10^-50), so the interval must reach into that window
    expect(compare(r.hi, digits)).toBe(1);
    expect(compare(r.lo, add(digits, q(1, 10n ** 50n)))).toBe(-1);
  });

  it("meets a relative width on roots of every size, and keeps exact roots", () => {
    const p = mulInt(fromRoots([q(1, 10n ** 12n), q(10n ** 12n), q(-7, 3)]), [-3n, 0n, 1n]);
    for (const iv of isolateRealRoots(p)) {
      const r = refineRootInterval(p, iv, { relativeWidth: q(1, 10n ** 20n) });
      expect(r.multiplicity).toBe(iv.multiplicity);
      if (isExactRoot(r)) continue;
      const small = compare(r.lo, q(0)) > 0 ? r.lo : q(-r.hi.num, r.hi.den);
      expect(compare(sub(r.hi, r.lo), { num: small.num, den: small.den * 10n ** 20n })).toBeLessThanOrEqual(0);
      expect(signAt(p, r.lo) * signAt(p, r.hi)).toBe(-1);
    }
  });

  it("settles an interval straddling a root at 0", () => {
    const p = fromIntegerCoefficients([0, 1, 0, 1]); // x(x^2 + 1)
    const r = refineRootInterval(p, { lo: q(-1), hi: q(3), multiplicity: 1 }, { relativeWidth: q(1, 100) });
    expect(isExactRoot(r) && r.lo.num === 0n).toBe(true);
  });

  it("refuses intervals that isolate nothing and missing targets", () => {
    const iv = { lo: q(2), hi: q(3), multiplicity: 1 };
    expect(() => refineRootInterval(sqrt2, iv, { width: q(1, 10) })).toThrow(expect.objectContaining({ code: "domain", reason: "invalid-interval" }));
    expect(() => refineRootInterval(sqrt2, { lo: q(1), hi: q(2), multiplicity: 1 }, {})).toThrow(
      expect.objectContaining({ code: "domain", reason: "invalid-argument" }),
    );
    expect(() => approximateRoot(sqrt2, { lo: q(1), hi: q(1), multiplicity: 1 })).toThrow(
      expect.objectContaining({ code: "domain", reason: "invalid-interval" }),
    );
  });

  it("honours a past deadline", () => {
    const [, pos] = isolateRealRoots(sqrt2);
    expect(() => refineRootInterval(sqrt2, pos, { width: q(1, 10n ** 50n), deadline: Date.now() - 1 })).toThrow(
      expect.objectContaining({ code: "timeout", reason: "deadline" }),
    );
  });
});

describe("approximateRoot", () => {
  it("√2, ∛5 and the roots of a degree-20 polynomial to ~1e-15 relative", () => {
    const [neg, pos] = isolateRealRoots(sqrt2);
    expect(approximateRoot(sqrt2, pos)).toBe(Math.SQRT2);
    expect(approximateRoot(sqrt2, neg)).toBe(-Math.SQRT2);
    const cube = fromIntegerCoefficients([-5, 0, 0, 1]);
    expect(Math.abs(approximateRoot(cube, isolateRealRoots(cube)[0]) / Math.cbrt(5) - 1)).toBeLessThan(1e-15);
    const roots = Array.from({ length: 20 }, (_, i) => q(2 * i + 1, 3));
    const p = fromRoots(roots);
    isolateRealRoots(p).forEach((iv, i) => {
      const exact = Number(roots[i].num) / Number(roots[i].den);
      expect(Math.abs(approximateRoot(p, iv) / exact - 1)).toBeLessThan(1e-15);
    });
  });

  it("is monotone and within the isolating interval on random polynomials (seeded)", () => {
    const rnd = prng(91);
    for (let t = 0; t < 25; t++) {
      const p = fromIntegerCoefficients([...Array.from({ length: rnd.int(1, 10) }, () => rnd.int(-99, 99)), rnd.int(1, 5)]);
      let last = -Infinity;
      for (const iv of isolateRealRoots(p)) {
        const x = approximateRoot(p, iv);
        const box = rationalIntervalToFloat(iv);
        expect(x).toBeGreaterThanOrEqual(box.lo);
        expect(x).toBeLessThanOrEqual(box.hi);
        expect(x).toBeGreaterThan(last);
        last = x;
        // agrees with the midpoint of a far tighter exact enclosure to within one rounding
        const tiny = refineRootInterval(p, iv, { relativeWidth: q(1, 10n ** 30n) });
        const exactMid = rationalIntervalToFloat(tiny).mid;
        expect(Math.abs(x - exactMid)).toBeLessThanOrEqual(Math.abs(exactMid) * 2e-16);
      }
    }
  });
});

describe("compareRootWithRational and float helpers", () => {
  it("orders √2 against rationals exactly", () => {
    const [, pos] = isolateRealRoots(sqrt2);
    expect(compareRootWithRational(sqrt2, pos, q(7, 5))).toBe(1);
    expect(compareRootWithRational(sqrt2, pos, q(99, 70))).toBe(-1); // 99/70 = 1.41428…
    expect(compareRootWithRational(sqrt2, pos, q(0))).toBe(1);
    expect(compareRootWithRational(sqrt2, pos, q(5))).toBe(-1);
    const p = fromRoots([q(1, 3), q(2)]);
    const [third] = isolateRealRoots(p);
    expect(compareRootWithRational(p, third, q(1, 3))).toBe(0);
    expect(compareRootWithRational(p, third, q(1, 4))).toBe(1);
  });

  it("works through even multiplicity (no sign change of p itself)", () => {
    const p = mulInt(sqrt2, sqrt2);
    const [, pos] = isolateRealRoots(p);
    expect(pos.multiplicity).toBe(2);
    expect(compareRootWithRational(p, pos, q(141, 100))).toBe(1);
    expect(approximateRoot(p, pos)).toBe(Math.SQRT2);
  });

  it("floatToRational is exact and rationalIntervalToFloat rounds outwards", () => {
    expect(formatRational(floatToRational(0.375))).toBe("3/8");
    expect(formatRational(floatToRational(-3))).toBe("-3");
    expect(floatToRational(0.1).den).toBe(2n ** 55n);
    const box = rationalIntervalToFloat({ lo: q(1, 3), hi: q(2, 3) });
    expect(compare(floatToRational(box.lo), q(1, 3))).toBe(-1);
    expect(compare(floatToRational(box.hi), q(2, 3))).toBe(1);
    expect(box.mid).toBe(0.5);
    const exact = rationalIntervalToFloat({ lo: q(1, 4), hi: q(1, 2) });
    expect([exact.lo, exact.hi]).toEqual([0.25, 0.5]);
    const neg = rationalIntervalToFloat({ lo: q(-2, 3), hi: q(-1, 3) });
    expect(compare(floatToRational(neg.lo), q(-2, 3))).toBe(-1);
    expect(compare(floatToRational(neg.hi), q(-1, 3))).toBe(1);
  });

  it("a degree-20 Wilkinson perturbation: largest real root ≈ 20.8469 (recalled from memory)", () => {
    const w = fromRoots(Array.from({ length: 20 }, (_, i) => q(i + 1)));
    const p = subInt(w.map((c) => c << 23n), fromIntegerCoefficients([...Array(19).fill(0), 1]));
    const roots = isolateRealRoots(p);
    expect(Math.abs(approximateRoot(p, roots[roots.length - 1]) - 20.8469)).toBeLessThan(1e-4);
  });
});
