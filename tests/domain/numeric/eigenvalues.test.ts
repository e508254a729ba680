import { describe, expect, it } from "vitest";
import { eigenvalues } from "@domain/numeric/eigenvalues";
import { seededRandom } from "@domain/numeric/multistart";

describe("eigenvalues", () => {
  it("finds real eigenvalues of a companion matrix (x² + 3x + 2 = (x+1)(x+2))", () => {
    const ev = eigenvalues([[0, 1], [-2, -3]]);
    expect(ev[0].re).toBeCloseTo(-1, 12);
    expect(ev[1].re).toBeCloseTo(-2, 12);
    expect(ev.every((e) => e.im === 0)).toBe(true);
  });

  it("finds a complex pair of a rotation", () => {
    const ev = eigenvalues([[0, 1], [-1, 0]]);
    expect(ev.map((e) => Math.abs(e.im))).toEqual([1, 1]);
    expect(ev.every((e) => Math.abs(e.re) < 1e-15)).toBe(true);
  });

  it("handles a nilpotent (defective) matrix and the empty matrix", () => {
    expect(eigenvalues([[0, 1, 0], [0, 0, 1], [0, 0, 0]]).every((e) => Math.abs(e.re) < 1e-12)).toBe(true);
    expect(eigenvalues([])).toEqual([]);
  });

  it("matches the spectrum of the tridiagonal [-2,1] matrix: −2 + 2cos(kπ/(n+1)) (Golub & Van Loan, §4.8 — recalled from memory)", () => {
    const n = 6;
    const a = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (i === j ? -2 : Math.abs(i - j) === 1 ? 1 : 0)));
    const expected = Array.from({ length: n }, (_, k) => -2 + 2 * Math.cos(((k + 1) * Math.PI) / (n + 1))).sort((x, y) => y - x);
    eigenvalues(a).forEach((e, i) => expect(e.re).toBeCloseTo(expected[i], 10));
  });

  it("property: on 1000 seeded random non-symmetric matrices, Σλ = tr A and Σλ² = tr A² (mathjs eigs fails on ~10% of these)", () => {
    const random = seededRandom(7);
    for (let t = 0; t < 1000; t++) {
      const n = 1 + (t % 9);
      const a = Array.from({ length: n }, () => Array.from({ length: n }, () => (t % 3 === 0 && random() < 0.5 ? 0 : random() - 0.5)));
      const ev = eigenvalues(a);
      expect(ev).toHaveLength(n);
      let tr = 0, tr2 = 0, s = 0, s2 = 0;
      for (let i = 0; i < n; i++) {
        tr += a[i][i];
        for (let j = 0; j < n; j++) tr2 += a[i][j] * a[j][i];
      }
      for (const e of ev) {
        s += e.re;
        s2 += e.re * e.re - e.im * e.im;
      }
      expect(Math.abs(s - tr)).toBeLessThan(1e-9);
      expect(Math.abs(s2 - tr2)).toBeLessThan(1e-9);
    }
  });
});
