import { describe, expect, it } from "vitest";
import { AlgebraError } from "@domain/algebra/index";
import { parseNetworkCsv } from "@domain/network/index";
import { analyseNetwork, type AnalysisProgress } from "@domain/steady-state/index";
import { TWO_SITE_SYMBOLIC } from "./helpers";

describe("analyseNetwork: budget, progress and cancellation", () => {
  const network = parseNetworkCsv(TWO_SITE_SYMBOLIC);

  it("reports progress by phase", () => {
    const seen: AnalysisProgress[] = [];
    analyseNetwork(network, { onProgress: (p) => seen.push(p), skipFullBasis: true });
    expect(seen.map((p) => p.phase)).toEqual(expect.arrayContaining(["structure", "linear-elimination"]));
  });

  it("a size budget on Gröbner bases turns the full basis into a warning, not a failure", () => {
    const r = analyseNetwork(network, { maxBasisSize: 3, timeoutMs: 30_000, fullBasis: true });
    expect(r.groebnerBasis).toBeNull();
    expect(r.warnings.some((w) => w.includes("not finished within the budget"))).toBe(true);
    expect(r.parametrisation?.positive).toBe(true);
  });

  it("a tight deadline ends with warnings and no exception", () => {
    const r = analyseNetwork(network, { timeoutMs: 1 });
    expect(r.warnings.some((w) => /not finished|deadline/.test(w))).toBe(true);
  });

  it("an aborted signal throws a cancellation error", () => {
    const controller = new AbortController();
    controller.abort();
    expect(() => analyseNetwork(network, { signal: controller.signal })).toThrow(AlgebraError);
  });
});
