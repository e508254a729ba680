import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { parseRational } from "@domain/algebra/rational";
import { parseNetworkCsv } from "@domain/network/index";
import { analyseNetwork } from "@domain/steady-state/index";
import { multistationarity } from "@domain/steady-state/multistationarity";
import { analysisResultJson, multistationarityJson } from "@domain/steady-state/result";

const CUBIC = readFileSync("tests/fixtures/networks/cubic-autocatalysis.csv", "utf8");

describe("analysisResultJson", () => {
  const json = analysisResultJson(analyseNetwork(parseNetworkCsv(CUBIC), { initial: new Map([["X", parseRational("1")!]]) }));

  it("is plain data: a JSON round trip changes nothing (no undefined, no class instances)", () => {
    expect(JSON.parse(JSON.stringify(json))).toEqual(json);
    expect(Object.values(json).every((v) => v !== undefined)).toBe(true);
  });

  it("keeps the keys in the order of the CLI contract", () => {
    expect(Object.keys(json).slice(0, 13)).toEqual([
      "species", "constants", "complexes", "reactions", "rank", "linkageClasses", "deficiency", "weaklyReversible",
      "conservationLaws", "groebnerBasis", "parametrisation", "acr", "steadyStates",
    ]);
  });

  it("gives eigenvalues as { re, im } and the three states of -(X - 1)(X - 2)(X - 3) (values of the fixture's header)", () => {
    const states = json.steadyStates!;
    expect(states.map((s) => s.concentrations.X).sort()).toEqual([expect.closeTo(1, 9), expect.closeTo(2, 9), expect.closeTo(3, 9)]);
    for (const s of states) expect(Object.keys(s.eigenvalues[0]).sort()).toEqual(["im", "re"]);
    expect(json.groebnerBasisComplete).toBe(json.groebnerBasisStatus === "complete");
  });
});

describe("multistationarityJson", () => {
  it("omits the witness key when there is none", () => {
    const mono = multistationarityJson(multistationarity(parseNetworkCsv("reaction,rate,reverse_rate\nA <-> B,k1,k2\n"), { timeoutMs: 10_000 }));
    expect(mono.verdict).toBe("monostationary");
    expect("witness" in mono).toBe(false);
    expect(Object.keys(mono)).toEqual(["verdict", "method", "reason", "assumptions", "sources"]);
  });
});
