import { describe, expect, it } from "vitest";
import { answerOf } from "~/analyses/answer";
import type { AnalysisResult } from "~/analyses/result-types";
import { analysisResultJson } from "@domain/steady-state/result";
import { parseNetworkCsv } from "@domain/network/index";
import { analyseNetwork } from "@domain/steady-state/index";
import { parseRational } from "@domain/algebra/rational";

/** The answer sentence comes from the engine's own result, checked on networks whose answers are known. */
const result = (csv: string, initial?: Record<string, string>) =>
  analysisResultJson(
    analyseNetwork(parseNetworkCsv(csv), { initial: initial ? new Map(Object.entries(initial).map(([k, v]) => [k, parseRational(v)!])) : undefined }),
  ) satisfies AnalysisResult;

describe("the answer an analysis opens with", () => {
  it("counts the states of the cubic switch: -(X - 1)(X - 2)(X - 3) has two stable and one unstable", () => {
    const a = answerOf(result("reaction,rate,reverse_rate,rate_value,reverse_rate_value\n0 <-> X,k1,k2,6,11\n2X <-> 3X,k3,k4,6,1\n", { X: "1" }));
    expect(a.headline).toBe("3 positive steady states in this class: 2 stable, 1 unstable.");
    expect(a.tone).toBe("states");
  });

  it("says at once when there is none (Michaelis–Menten without product return: the substrate runs out)", () => {
    const a = answerOf(result("reaction,rate,reverse_rate\nE + S <-> C,k1,k2\nC -> E + P,k3,\n"));
    expect(a.tone).toBe("none");
    expect(a.headline).toMatch(/^No positive steady state/);
  });

  it("names the free species of a positive parametrisation and the robust species", () => {
    const a = answerOf(result("reaction,rate\nA + B -> 2B,k1\nB -> A,k2\n"));
    expect(a.details.join(" ")).toContain("free species B");
    expect(a.details.join(" ")).toContain("A = k2/k1");
  });
});
