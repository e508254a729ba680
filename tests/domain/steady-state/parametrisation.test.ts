import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { Budget } from "@domain/steady-state/budget";
import { kineticsRing } from "@domain/steady-state/kinetics";
import { computeParametrisation } from "@domain/steady-state/parametrisation";
import { formatExpression } from "@domain/steady-state/rational-expression";
import { steadyStateSystem } from "@domain/steady-state/system";

const run = (csv: string, order?: string[], definitePivotsOnly = false) => {
  const net = parseNetworkCsv(csv);
  const kin = kineticsRing(net, order ? { speciesOrder: order } : {});
  const sys = steadyStateSystem(net, kin, [], null);
  return { kin, p: computeParametrisation(kin, sys.keptRows.map((i) => sys.odes[i]), new Budget({ timeoutMs: 30_000 }), { definitePivotsOnly }) };
};

describe("parametrisation of the positive steady states", () => {
  it("A <-> B in the order B, A: free A, B = k1*A/k2, positive", () => {
    const { p } = run("reaction,rate,reverse_rate\nA <-> B,k1,k2\n", ["B", "A"]);
    expect(p.parametrisation!.free).toEqual(["A"]);
    expect(formatExpression(p.parametrisation!.expressions[0].expression)).toBe("A*k1/k2");
    expect(p.parametrisation!.positive).toBe(true);
  });

  it("when no rational parametrisation exists it names the polynomial to solve (cubic autocatalysis)", () => {
    const { kin, p } = run("reaction,rate,reverse_rate\n0 <-> X,k1,k2\n2X <-> 3X,k3,k4\n");
    expect(p.parametrisation).toBeNull();
    expect(p.rootsNeeded).toHaveLength(1);
    expect(p.rootsNeeded[0].species).toBe("X");
    expect(p.rootsNeeded[0].degree).toBe(3);
    expect(kin.ring.format(p.rootsNeeded[0].polynomial)).toContain("X^3");
  });

  it("a mixed-sign pivot is avoided on request: X stays unknown when its coefficient k1·Y² − k2·Z² has both signs", () => {
    // dX/dt = k1·X·Y² − k2·X·Z² + k3·Y² is linear only in X (Y and Z are catalysts, squared).
    const csv = "reaction,rate\n2Y + X -> 2Y + 2X,k1\n2Z + X -> 2Z,k2\n2Y -> 2Y + X,k3\n";
    const loose = run(csv);
    const strict = run(csv, undefined, true);
    expect(loose.p.eliminated.map((e) => e.species)).toContain("X");
    expect(strict.p.eliminated.map((e) => e.species)).not.toContain("X");
  });
});
