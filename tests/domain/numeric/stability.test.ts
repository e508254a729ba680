import { describe, expect, it } from "vitest";
import { restrictedJacobian, stabilityOnClass, stabilityVerdict } from "@domain/numeric/stability";

describe("stability on the stoichiometric class", () => {
  it("A <-> B with k1 = 2, k2 = 3: Jacobian [[-2, 3], [2, -3]] restricted to im N = span(-1, 1) has the eigenvalue −(k1 + k2) = −5", () => {
    const j = [[-2, 3], [2, -3]];
    const n = [[-1, 1], [1, -1]];
    const r = restrictedJacobian(j, n);
    expect(r).toHaveLength(1);
    expect(r[0][0]).toBeCloseTo(-5, 12);
    const report = stabilityOnClass(j, n);
    expect(report.verdict).toBe("stable");
  });

  it("drops the zero eigenvalue of the conservation law but keeps a genuine one", () => {
    // Full Jacobian has eigenvalues 0 (conservation) and −5; the restriction only −5.
    expect(stabilityOnClass([[-2, 3], [2, -3]], [[-1], [1]]).eigenvalues).toHaveLength(1);
    expect(stabilityVerdict([{ re: -1, im: 0 }, { re: 1e-13, im: 0 }])).toBe("undecided");
    expect(stabilityVerdict([{ re: -1, im: 0 }, { re: 0.5, im: 2 }])).toBe("unstable");
  });

  it("an empty stoichiometric subspace gives no eigenvalues and the vacuous verdict stable", () => {
    expect(stabilityOnClass([[0]], [[0]]).eigenvalues).toEqual([]);
  });
});
