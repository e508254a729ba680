import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { Budget } from "@domain/steady-state/budget";
import { parametrisationStage } from "@domain/steady-state/stages/parametrisation";
import { structureStage } from "@domain/steady-state/stages/structure";
import { fixture } from "../helpers";

describe("stage 3: parametrisation", () => {
  it("the reversible A <-> B: B free, A = B*k2/k1, nothing unfinished", () => {
    const s = structureStage(parseNetworkCsv("reaction,rate,reverse_rate\nA <-> B,k1,k2\n"), {});
    const p = parametrisationStage(s, new Budget({ timeoutMs: 20_000 }));
    expect(p.param?.parametrisation?.free).toEqual(["B"]);
    expect(p.unfinished).toEqual([]);
    expect(p.warnings).toEqual([]);
  });

  it("a parametrisation out of budget is reported by its stage, not thrown", () => {
    const s = structureStage(parseNetworkCsv(fixture("two-site-phosphorylation")), {});
    // A deadline already past: linear elimination checks it first thing.
    const p = parametrisationStage(s, new Budget({ deadline: Date.now() - 1000 }));
    expect(p.param).toBeNull();
    expect(p.unfinished).toEqual([{ stage: "parametrisation", reason: "linear elimination: deadline exceeded" }]);
    expect(p.warnings).toEqual(["Parametrisation not finished: linear elimination: deadline exceeded."]);
  });
});
