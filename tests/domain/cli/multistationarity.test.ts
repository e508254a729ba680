import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { cli } from "./run-cli";

const CUBIC = readFileSync("tests/fixtures/networks/cubic-autocatalysis.csv", "utf8");

describe("cli multistationarity", () => {
  it("--json prints the verdict object; a reversible pair A <-> B is monostationary (deficiency zero theorem)", async () => {
    const r = await cli(["multistationarity", "n.csv", "--json"], { "n.csv": "reaction,rate,reverse_rate\nA <-> B,k1,k2\n" });
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.verdict).toBe("monostationary");
    expect(Object.keys(j)).toEqual(["verdict", "method", "reason", "assumptions", "sources"]);
  });
  it("finds a witness for the cubic autocatalysis, whose values in the file give three steady states", async () => {
    const r = await cli(["multistationarity", "c.csv", "--json"], { "c.csv": CUBIC });
    const j = JSON.parse(r.out);
    expect(j.verdict).toBe("multistationary");
    expect(j.witness.steadyStates.length).toBeGreaterThanOrEqual(2);
  });
  it("writes a plain report with what it assumes, and refuses a bad timeout", async () => {
    const r = await cli(["multistationarity", "n.csv"], { "n.csv": "reaction,rate,reverse_rate\nA <-> B,k1,k2\n" });
    expect(r.out).toMatch(/^Verdict: monostationary \(/);
    expect(r.out).toContain("\nAssumes:\n  - Mass-action kinetics.");
    const bad = await cli(["multistationarity", "n.csv", "--timeout", "0"], { "n.csv": "reaction,rate\nA -> B,k\n" });
    expect(bad.code).not.toBe(0);
    expect(bad.err).toContain("--timeout expects a positive number of seconds");
  });
});
