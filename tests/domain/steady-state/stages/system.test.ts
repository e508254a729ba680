import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { structureStage } from "@domain/steady-state/stages/structure";
import { systemStage } from "@domain/steady-state/stages/system";
import { initial } from "../helpers";

const numeric = parseNetworkCsv("reaction,rate,reverse_rate,rate_value,reverse_rate_value\nA <-> B,k1,k2,2,1\n");

describe("stage 2: steady-state system", () => {
  it("with initial concentrations the class is given and the totals are numbers", () => {
    const options = { initial: initial("A=1,B=1/2") };
    const sys = systemStage(numeric, options, structureStage(numeric, options));
    expect(sys.numericRates).toBe(true);
    expect(sys.classGiven).toBe(true);
    expect(sys.totals).toEqual([{ num: 3n, den: 2n }]);
    // One kept ODE row and one conservation equation A + B - 3/2: square.
    expect(sys.withTotals.equations.map((p) => sys.kinT.ring.format(p))).toEqual(["-2*A + B", "A + B - 3/2"]);
    expect(sys.warnings[0]).toMatch(/^Only positive steady states are analysed/);
  });

  it("without them the totals stay symbolic (T1) and no class is given", () => {
    const sys = systemStage(numeric, {}, structureStage(numeric, {}));
    expect(sys.classGiven).toBe(false);
    expect(sys.kinT.totals).toEqual(["T1"]);
  });
});
