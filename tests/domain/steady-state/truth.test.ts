import { existsSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { checkCase, randomCase, reproduction, SINGULAR } from "../../../bench/lib/steady-state-truth";
import { analyseCsv, initial } from "./helpers";

/**
 * The steady-state pipeline is right and bounded. The two networks below are the reproductions of a
 * defect report (an independent check against another computer-algebra system and a 2,000-start
 * Newton search); their steady states are the report's values. The random part is a CI-sized subset
 * of `npm run bench -- --truth` (bench/lib/steady-state-truth.ts names its references).
 */
describe("steady states that once came out wrong or never came", () => {
  it("a deficiency-one network whose leftover after linear elimination looked like a continuum has exactly one positive state", () => {
    const csv = [
      "reaction,label,rate,reverse_rate,rate_value,reverse_rate_value",
      "A + C <-> C + G,r1,k1,km1,2,3",
      "2B <-> A + D,r2,k2,km2,5/2,1/10",
      "A + G <-> B + D,r3,k3,km3,20,20",
      "D + G <-> 2G,r4,k4,km4,1/2,2",
    ].join("\n");
    const r = analyseCsv(csv, { initial: initial("A=1,B=1/2,C=1/2,D=3,G=3") });
    expect(r.steadyStateSet).toBe("finite");
    expect(r.steadyStates).toHaveLength(1);
    const x = r.steadyStates![0];
    const expected = { A: 1.796834, B: 0.505124, C: 0.5, D: 4.061416, G: 1.136626 };
    for (const [s, v] of Object.entries(expected)) expect(x.concentrations[s]).toBeCloseTo(v, 5);
    expect(x.stable).toBe(true);
    expect(r.contradictions).toEqual([]);
    expect(r.unfinished).toEqual([]);
  });

  it("a deficiency-zero weakly reversible network with no conservation law ends, with its one state and no initial values", () => {
    const csv = [
      "reaction,label,rate,reverse_rate,rate_value,reverse_rate_value",
      "A <-> B,r1,k1,km1,1/2,1/3",
      "2C <-> C,r2,k2,km2,3,1",
      "2C <-> A + B,r3,k3,km3,5,3",
    ].join("\n");
    const r = analyseCsv(csv, { timeoutMs: 5000 });
    expect(r.structure.deficiency).toBe(0);
    expect(r.steadyStateSet).toBe("finite");
    expect(r.steadyStates).toHaveLength(1);
    const x = r.steadyStates![0].concentrations;
    expect(x.A).toBeCloseTo(0.351364, 5);
    expect(x.B).toBeCloseTo(0.527046, 5);
    expect(x.C).toBeCloseTo(1 / 3, 12);
    expect(r.positiveSteadyStatesExist).toBe(true);
    expect(r.contradictions).toEqual([]);
  });

  it("with conservation laws and no initial values it names the totals it needs instead of listing nothing", () => {
    const r = analyseCsv("reaction,rate,reverse_rate,rate_value,reverse_rate_value\nA <-> B,k1,k2,1,2\n");
    expect(r.steadyStates).toBeNull();
    expect(r.steadyStatesReason).toContain("A + B");
    expect(r.steadyStateSet).toBeNull();
  });

  it("an analysis out of budget says which stage it was in and keeps what it has", () => {
    const r = analyseCsv("reaction,rate,reverse_rate,rate_value,reverse_rate_value\nA + B <-> C,k1,k2,1,2\n2C <-> A,k3,k4,3,1\n", {
      initial: initial("A=1,B=2,C=1"),
      deadline: Date.now() - 1,
    });
    expect(r.unfinished.length).toBeGreaterThan(0);
    expect(r.unfinished[0].stage).toBe("parametrisation");
    expect(r.structure.species).toEqual(["A", "B", "C"]);
  });
});

describe("positive steady-state counts on seeded random networks agree with independent evidence", () => {
  const singular = existsSync(SINGULAR);
  it(`30 networks: multistart Newton${singular ? " and Singular's saturated ideal" : ""}, theorems, budget`, () => {
    const outcomes = Array.from({ length: 30 }, (_, i) => checkCase(randomCase(7000 + i), { timeoutMs: 10_000, singular, starts: 60 }));
    const bad = outcomes.filter((o) => o.problems.length > 0);
    expect(bad.map(reproduction)).toEqual([]);
    // The subset must exercise the pipeline, not skip it.
    expect(outcomes.filter((o) => typeof o.ours === "number" && o.ours > 0).length).toBeGreaterThanOrEqual(10);
  }, 300_000);
});
