import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { Budget } from "@domain/steady-state/budget";
import { parametrisationStage } from "@domain/steady-state/stages/parametrisation";
import { structureStage } from "@domain/steady-state/stages/structure";
import { systemStage } from "@domain/steady-state/stages/system";
import { triangularStage, wantsFullBasis } from "@domain/steady-state/stages/triangular";
import { fixture, initial } from "../helpers";

describe("stage 4: the triangular form, only where it is wanted", () => {
  it("a numeric class wants the basis; the cubic switch's basis is the cubic with roots 1, 2, 3", () => {
    const net = parseNetworkCsv(fixture("cubic-autocatalysis"));
    const options = { initial: initial("X=1") };
    const s = structureStage(net, options);
    const sys = systemStage(net, options, s);
    const budget = new Budget({ timeoutMs: 20_000 });
    const p = parametrisationStage(s, budget);
    expect(wantsFullBasis(options, sys, p)).toBe(true);
    const t = triangularStage(options, sys, p, true, budget);
    expect(t.basisStatus).toBe("complete");
    // dX/dt = k1 - 11X + 6X^2 - X^3 with the fixture's values: (X - 1)(X - 2)(X - 3) (expanded by hand).
    expect(t.basis!.map((g) => sys.kinT.ring.format(g))).toEqual(["X^3 - 6*X^2 + 11*X - 6"]);
    expect(t.wholeRing).toBe(false);
  });

  it("a parametrisation without a class skips the basis and says why", () => {
    const net = parseNetworkCsv("reaction,rate,reverse_rate\nA <-> B,k1,k2\n");
    const s = structureStage(net, {});
    const sys = systemStage(net, {}, s);
    const budget = new Budget({ timeoutMs: 20_000 });
    const p = parametrisationStage(s, budget);
    expect(p.param?.parametrisation?.free).toEqual(["B"]);
    expect(wantsFullBasis({}, sys, p)).toBe(false);
    const t = triangularStage({}, sys, p, false, budget);
    expect(t.basis).toBeNull();
    expect(t.basisStatus).toBe("skipped");
    expect(t.warnings).toEqual([expect.stringMatching(/^The full lex Gröbner basis was not computed/)]);
  });
});
