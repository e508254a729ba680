import { describe, expect, it } from "vitest";
import { parseRational } from "@domain/algebra/rational";
import { parseNetworkCsv } from "@domain/network/index";
import { analyseNetwork, type SteadyStateAnalysis } from "@domain/steady-state/index";
import { NOT_REACHED } from "@domain/steady-state/analyse";

describe("partial results as stages finish (onPartial)", () => {
  it("reports what each stage left, and the final result is unchanged by listening", () => {
    // A futile cycle with numeric constants: parametrisation first, then the class's steady states.
    const network = parseNetworkCsv(
      "reaction,rate,reverse_rate,rate_value,reverse_rate_value\nS0 + K <-> S0K,a1,d1,1,1/2\nS0K -> S1 + K,c1,,2,\nS1 + F <-> S1F,a2,d2,1,1\nS1F -> S0 + F,c2,,3/2,\n",
    );
    const initial = new Map(Object.entries({ S0: "1", K: "1/10", F: "1/10" }).map(([k, v]) => [k, parseRational(v)!]));
    const partials: SteadyStateAnalysis[] = [];
    const heard = analyseNetwork(network, { initial, onPartial: (p) => partials.push(p) });
    const plain = analyseNetwork(network, { initial });
    expect(heard).toEqual(plain);
    expect(partials.length).toBeGreaterThanOrEqual(1);
    // The first partial comes after the parametrisation: it is there, the class's steady states are not yet.
    expect(partials[0]!.parametrisation).toBeNull();
    const first = partials[1]!;
    expect(first.parametrisation).toEqual(plain.parametrisation);
    expect(first.steadyStates).toBeNull();
    expect(first.unfinished).toContainEqual({ stage: "steady-states", reason: NOT_REACHED });
    // Later partials never lose a part an earlier one had.
    for (const p of partials) expect(p.structure).toEqual(plain.structure);
    // Nothing that finished is listed as unfinished in the final result.
    expect(plain.unfinished.filter((u) => u.reason === NOT_REACHED)).toEqual([]);
  });

  it("a run with nothing after the parametrisation sends one partial, before it (the result itself follows)", () => {
    const partials: SteadyStateAnalysis[] = [];
    // Symbolic constants, no class: nothing runs after the parametrisation.
    const done = analyseNetwork(parseNetworkCsv("reaction,rate,reverse_rate\nA <-> B,k1,k2\n"), { onPartial: (p) => partials.push(p) });
    expect(partials).toHaveLength(1);
    expect(partials[0]!.parametrisation).toBeNull();
    expect(partials[0]!.unfinished).toEqual([{ stage: "parametrisation", reason: NOT_REACHED }]);
    expect(partials[0]!.odes).toEqual(done.odes);
    expect(done.parametrisation).toEqual({ free: ["B"], expressions: { A: "B*k2/k1" }, positive: true, positiveSpecies: ["A"] });
  });
});
