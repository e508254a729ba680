import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { cli } from "./run-cli";

const CUBIC = readFileSync("tests/fixtures/networks/cubic-autocatalysis.csv", "utf8");

describe("cli scan --json", () => {
  it("prints parameter, folds, windows and points as the contract spells them", async () => {
    const r = await cli(["scan", "c.csv", "--vary", "k1", "--from", "1", "--to", "10", "--points", "5", "--json"], { "c.csv": CUBIC });
    expect(r.err).toBe("");
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.parameter).toBe("k1");
    // Folds at 6 ± 2√3/9 (hand computation from the discriminant −(27k1² − 324k1 + 968)).
    expect(j.folds.map((f: { value: number }) => f.value)).toEqual([5.615099821, 6.384900179]);
    for (const f of j.folds) expect(Object.keys(f)).toEqual(["value", "interval"]);
    expect(j.windows).toEqual([
      { from: 1, to: expect.closeTo(5.6150998205, 9), count: 1 },
      { from: expect.closeTo(5.6150998205, 9), to: expect.closeTo(6.3849001795, 9), count: 3 },
      { from: expect.closeTo(6.3849001795, 9), to: 10, count: 1 },
    ]);
    expect(j.points[0]).toEqual({ value: 1, steadyStates: [{ concentrations: { X: expect.any(Number) }, stable: true }] });
  });

  it("reports a bad parameter and missing totals on stderr with exit code 2", async () => {
    const bad = await cli(["scan", "c.csv", "--vary", "kx", "--from", "1", "--to", "2", "--json"], { "c.csv": CUBIC });
    expect(bad.code).toBe(2);
    expect(bad.err).toMatch(/'kx' is neither a rate constant \(k1, k2, k3, k4\)/);
    const range = await cli(["scan", "c.csv", "--vary", "k1", "--from", "3", "--to", "2"], { "c.csv": CUBIC });
    expect(range.err).toMatch(/--from must be below --to/);
    const usage = await cli(["scan", "c.csv", "--vary", "k1"], { "c.csv": CUBIC });
    expect(usage.err).toMatch(/usage: scan NETWORK.csv --vary NAME --from A --to B/);
  });
});

describe("cli multistationarity --json", () => {
  it("prints verdict, method, reason and a witness", async () => {
    const r = await cli(["multistationarity", "c.csv", "--json"], { "c.csv": CUBIC });
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.verdict).toBe("multistationary");
    expect(typeof j.method).toBe("string");
    expect(typeof j.reason).toBe("string");
    expect(Object.keys(j.witness.rates)).toEqual(["k1", "k2", "k3", "k4"]);
    expect(j.witness.totals).toEqual({});
    expect(j.witness.steadyStates.length).toBeGreaterThanOrEqual(2);
    expect(Object.keys(j.witness.steadyStates[0])).toEqual(["X"]);
  });

  it("has no witness key for a monostationary network", async () => {
    const r = await cli(["multistationarity", "t.csv", "--json"], { "t.csv": "reaction,rate,reverse_rate\nA <-> B,k1,k2\n" });
    const j = JSON.parse(r.out);
    expect(j.verdict).toBe("monostationary");
    expect(j).not.toHaveProperty("witness");
  });
});
