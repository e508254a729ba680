import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { acrText } from "@domain/steady-state/acr";
import { Budget } from "@domain/steady-state/budget";
import { expressionTex } from "@domain/steady-state/rational-expression";
import { parametrisationStage } from "@domain/steady-state/stages/parametrisation";
import { robustnessNeedsBases, robustnessStage } from "@domain/steady-state/stages/robustness";
import { structureStage } from "@domain/steady-state/stages/structure";

describe("stage 6: robustness", () => {
  it("finds A = k2/k1 in A + B -> 2B, B -> A (Shinar & Feinberg, Science 327, 2010) as an exact expression", () => {
    const net = parseNetworkCsv("reaction,rate\nA + B -> 2B,k1\nB -> A,k2\n");
    const budget = new Budget({ timeoutMs: 20_000 });
    const s = structureStage(net, {});
    const p = parametrisationStage(s, budget);
    const r = robustnessStage(net, s, p, budget);
    expect(r.acr.map(acrText)).toEqual([{ species: "A", value: "k2/k1" }]);
    expect(expressionTex(r.acr[0]!.value, r.acr[0]!.factors)).toBe("\\frac{\\mathrm{k2}}{\\mathrm{k1}}");
    expect(robustnessNeedsBases(p)).toBe(false);
    expect(r.unfinished).toEqual([]);
  });
});
