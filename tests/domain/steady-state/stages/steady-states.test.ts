import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { Budget } from "@domain/steady-state/budget";
import { parametrisationStage } from "@domain/steady-state/stages/parametrisation";
import { steadyStatesStage } from "@domain/steady-state/stages/steady-states";
import { structureStage } from "@domain/steady-state/stages/structure";
import { systemStage } from "@domain/steady-state/stages/system";
import { triangularStage, wantsFullBasis } from "@domain/steady-state/stages/triangular";
import type { AnalyseOptions } from "@domain/steady-state/analyse";
import { fixture, initial } from "../helpers";

const run = (csv: string, options: AnalyseOptions) => {
  const net = parseNetworkCsv(csv);
  const budget = new Budget({ timeoutMs: 20_000 });
  const s = structureStage(net, options);
  const sys = systemStage(net, options, s);
  const p = parametrisationStage(s, budget);
  const t = triangularStage(options, sys, p, wantsFullBasis(options, sys, p), budget);
  return steadyStatesStage(net, options, s, sys, p, t, budget);
};

describe("stage 5: steady states", () => {
  it("lists the cubic switch's three positive steady states X = 1, 2, 3 (roots of (X-1)(X-2)(X-3), by hand)", () => {
    const st = run(fixture("cubic-autocatalysis"), { initial: initial("X=1") });
    expect(st.steadyStateSet).toBe("finite");
    expect(st.steadyStates!.map((x) => x.concentrations.X)).toEqual([1, 2, 3]);
    expect(st.zeroDimensionalBasis).toBe(true);
  });

  it("without values for the rate constants it gives the reason instead of a list", () => {
    const st = run("reaction,rate,reverse_rate\nA <-> B,k1,k2\n", {});
    expect(st.steadyStates).toBeNull();
    expect(st.steadyStatesReason).toBe("Listing steady states needs a value for every rate constant; missing: k1, k2.");
    expect(st.warnings).toEqual([]);
  });

  it("with numeric constants but no class it names the conservation law to fix", () => {
    const st = run("reaction,rate,reverse_rate,rate_value,reverse_rate_value\nA <-> B,k1,k2,2,1\n", {});
    expect(st.steadyStatesReason).toBe("The steady states depend on the totals of the conservation laws (A + B): give the initial concentrations to fix them.");
  });
});
