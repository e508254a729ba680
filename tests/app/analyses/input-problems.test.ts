import { describe, expect, it } from "vitest";
import { SteadyStateInputError } from "@domain/steady-state/index";
import { jobErrorText } from "~/analyses/input-problems";
import { computeJob } from "~/jobs/compute";
import { analysisParams } from "../jobs/fixtures";

const MM = "reaction,rate,reverse_rate,rate_value,reverse_rate_value\nE + S <-> C,kon,koff,2,1\nC -> E + P,kcat,,3,\n";

describe("input problems on the web: the form's words, never a command-line option", () => {
  it("an unknown species in the initial concentrations names the form field", () => {
    let caught: unknown;
    try {
      computeJob({ kind: "analysis", csv: MM, params: analysisParams({ initial: { Z: "1" } }) }, { engineTimeoutMs: 5_000 });
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(SteadyStateInputError);
    const text = jobErrorText(caught);
    expect(text).toBe("Initial concentrations: 'Z' is not a species of the network (species: E, S, C, P)");
    expect(text).not.toContain("--");
  });

  it("scan problems too; other errors keep their message", () => {
    expect(jobErrorText(new SteadyStateInputError({ kind: "scan-range", problem: "from-not-below-to" }))).toBe("From must be below To");
    expect(jobErrorText(new SteadyStateInputError({ kind: "scan-totals-needed", totals: ["T1"] }))).toBe(
      "the network has conservation laws (T1): give Initial concentrations so their totals are known",
    );
    expect(jobErrorText(new Error("boom"))).toBe("boom");
  });
});
