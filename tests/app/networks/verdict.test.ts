import { describe, expect, it } from "vitest";
import { analyseStructure, parseNetworkCsv } from "@domain/network/index";
import { verdictCard, type LatestAnalysis } from "~/networks/verdict";
import type { AnalysisResult } from "~/analyses/result-types";

const structure = (rows: string) => analyseStructure(parseNetworkCsv(`reaction\n${rows}\n`));
const statements = (card: ReturnType<typeof verdictCard>) => Object.fromEntries(card.lines.map((l) => [l.key, l.statement]));
const links = { newAnalysis: "/labs/l/networks/n/analyse?v=1" };

describe("verdictCard", () => {
  it("a deficiency-zero weakly reversible network: one stable state per class, decided by the structure", () => {
    const card = verdictCard(structure("A <-> B\nB <-> C\nC <-> A"), null, links);
    expect(statements(card)).toEqual({
      "steady-states": "Exactly one in every class, and it is stable.",
      multistationarity: "No, whatever the rate constants.",
      robust: "None found from the structure.",
    });
    expect(card.lines[0]!.basis).toMatch(/deficiency zero theorem, for any positive rate constants/);
    expect(card.assumptions).toEqual(["Mass-action kinetics", "Positive concentrations only", "One compatibility class at a time (fixed totals)", "Any positive rate constants"]);
  });

  it("Michaelis–Menten: no positive steady state, so nothing to be robust", () => {
    const card = verdictCard(structure("E + S <-> C\nC -> E + P"), null, links);
    expect(card.lines.map((l) => l.tone)).toEqual(["none", "settled", "none"]);
    expect(statements(card).robust).toMatch(/no positive steady state/);
  });

  it("robust by the Shinar–Feinberg criterion, stated with its condition", () => {
    const card = verdictCard(structure("A + B -> 2B\nB -> A"), null, links);
    expect(statements(card).robust).toBe("A, if a positive steady state exists.");
    expect(card.lines[2]!.basis).toContain("A + B and B differ in A alone");
  });

  it("an open network with no analysis points to starting one", () => {
    const card = verdictCard(structure("0 <-> X\n2X <-> 3X"), null, links);
    expect(card.lines.map((l) => l.tone)).toEqual(["open", "open", "open"]);
    expect(card.lines[0]!.evidence).toEqual({ href: links.newAnalysis, label: "Start an analysis" });
    expect(verdictCard(structure("0 <-> X\n2X <-> 3X"), null, { newAnalysis: null }).lines[0]!.evidence.href).toBe("#theorems");
  });

  it("an open network takes the newest analysis: its count, its multistationarity verdict and robust species, with the constants it used", () => {
    const result = {
      steadyStates: [0.1, 1, 3].map((x, i) => ({ concentrations: { X: x }, stable: i !== 1, verdict: "", eigenvalues: [], residual: 0 })),
      steadyStateSet: "finite",
      positiveSteadyStatesExist: true,
      parametrisation: null,
      acr: [],
      multistationarity: { verdict: "multistationary", method: "witness", reason: "Three positive steady states were found for one choice of constants" },
    } as unknown as AnalysisResult;
    const latest: LatestAnalysis = { href: "/labs/l/analyses/a", result, rateMode: "numeric", finishedAt: "2026-12-02T10:00:00.000Z" };
    const card = verdictCard(structure("0 <-> X\n2X <-> 3X"), latest, links);
    expect(statements(card)).toEqual({
      "steady-states": "3 positive steady states in this class: 2 stable, 1 unstable.",
      multistationarity: "Yes: some positive rate constants give two or more in one class.",
      robust: "None found.",
    });
    expect(card.lines[0]!.basis).toBe("From the newest analysis of this version, for the rate constants of the analysis.");
    expect(card.lines[1]!.basis).toBe("The newest analysis found 3 in one class with the given rate constants and totals.");
    expect(card.lines[0]!.evidence.href).toBe("/labs/l/analyses/a");
    expect(card.assumptions[3]).toBe("Counts: the rate constants given to the analysis");
  });

  it("names species held constant among the assumptions", () => {
    const s = analyseStructure(parseNetworkCsv("# constant: A = 2, B = 3\nreaction\nA + 2X -> 3X\n3X -> 2X + B\nX -> B\nB -> X\n"));
    expect(verdictCard(s, null, links).assumptions).toContain("Held constant: A, B (2 species)");
  });
});
