import { describe, expect, it } from "vitest";
import { compare, formatRational, sub } from "@domain/algebra/rational";
import { fromRoots, signAt } from "@domain/algebra/univariate";
import { refineByQir } from "@domain/algebra/univariate/qir";
import { q } from "./helpers";

describe("refineByQir (quadratic interval refinement, Abbott 2006, recalled from memory)", () => {
  it("reaches 3000 digits of √2 quickly (bisection alone would need ~10^4 steps)", () => {
    const f = [-2n, 0n, 1n];
    const started = performance.now();
    const r = refineByQir(f, q(1), q(2), -1, { width: q(1, 10n ** 3000n) }, {});
    expect(performance.now() - started).toBeLessThan(5000);
    expect(compare(sub(r.hi, r.lo), q(1, 10n ** 3000n))).toBeLessThanOrEqual(0);
    expect(signAt(f, r.lo)).toBe(-1);
    expect(signAt(f, r.hi)).toBe(1);
  });

  it("works from non-dyadic endpoints and lands exactly on grid-point roots", () => {
    const f = fromRoots([q(3, 8), q(5)]);
    const r = refineByQir(f, q(0), q(1), signAt(f, q(0)), { width: q(1, 10n ** 20n) }, {});
    expect(formatRational(r.lo)).toBe("3/8");
    expect(formatRational(r.hi)).toBe("3/8");
    const t = refineByQir(f, q(1, 3), q(7, 3), signAt(f, q(1, 3)), { width: q(1, 10n ** 20n) }, {});
    expect(compare(t.lo, q(3, 8))).toBe(-1);
    expect(compare(t.hi, q(3, 8))).toBe(1);
    expect(compare(sub(t.hi, t.lo), q(1, 10n ** 20n))).toBeLessThanOrEqual(0);
    const g = fromRoots([q(2, 7), q(-1)]);
    const s = refineByQir(g, q(1, 5), q(1, 3), signAt(g, q(1, 5)), { relativeWidth: q(1, 10n ** 30n) }, {});
    expect(signAt(g, s.lo) * signAt(g, s.hi)).toBe(-1);
    expect(compare(s.lo, q(2, 7))).toBe(-1);
    expect(compare(s.hi, q(2, 7))).toBe(1);
  });
});
