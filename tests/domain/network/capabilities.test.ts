import { describe, expect, it } from "vitest";
import { analyseStructure, parseNetworkCsv, shinarFeinbergRobust, structuralCapabilities } from "@domain/network/index";

const structure = (rows: string) => analyseStructure(parseNetworkCsv(`reaction\n${rows}\n`));

describe("structuralCapabilities", () => {
  it("deficiency zero, weakly reversible: exactly one stable state per class, no multistationarity", () => {
    expect(structuralCapabilities(structure("A <-> B\nB <-> C\nC <-> A"))).toEqual({
      steadyStatesPerClass: { count: "exactly-one", by: "deficiency-zero" },
      multistationarityRuledOut: true,
      stable: true,
      robust: [],
    });
  });

  it("Michaelis–Menten (δ = 0, not weakly reversible): no positive steady state", () => {
    const c = structuralCapabilities(structure("E + S <-> C\nC -> E + P"));
    expect(c.steadyStatesPerClass).toEqual({ count: "none", by: "deficiency-zero" });
    expect(c.stable).toBe(false);
  });

  it("a network neither theorem decides stays open", () => {
    // Schlögl's reactions 0 <-> X, 2X <-> 3X: δ = 4 − 2 − 1 = 1, but the linkage classes have
    // deficiency 0 each, so the sum condition of the deficiency one theorem fails.
    const c = structuralCapabilities(structure("0 <-> X\n2X <-> 3X"));
    expect(c.steadyStatesPerClass).toEqual({ count: "open", by: null });
    expect(c.multistationarityRuledOut).toBe(false);
  });
});

describe("shinarFeinbergRobust", () => {
  it("A + B -> 2B, B -> A: robust in A (Shinar & Feinberg, Science 327, 2010, the opening example — recalled from memory)", () => {
    // By hand: dA/dt = −k1·A·B + k2·B = B·(k2 − k1·A), so every positive steady state has A = k2/k1.
    expect(shinarFeinbergRobust(structure("A + B -> 2B\nB -> A"))).toEqual([{ species: "A", complexes: ["A + B", "B"] }]);
  });

  it("the EnvZ–OmpR model: robust in the phosphorylated regulator Yp (Shinar & Feinberg 2010, Fig. 2 — recalled from memory)", () => {
    const envz = structure(["XD <-> X", "X <-> XT", "XT -> Xp", "Xp + Y <-> XpY", "XpY -> X + Yp", "XT + Yp <-> XTYp", "XTYp -> XT + Y"].join("\n"));
    // 10 complexes − 3 linkage classes − rank 6 (8 species, 2 conservation laws) = 1.
    // Outside check (SymPy 1.14, Debian python3-sympy): with the rate constants 2, 3, 5, 7, 1, 4, 3, 2, 5, 6, 1
    // in reaction order, the lex Gröbner basis of the eight steady-state equations (order
    // XD > X > Xp > Y > XpY > XTYp > XT > Yp) contains XT·(5·Yp − 7): Yp = 7/5 at every positive steady state.
    expect(envz.deficiency).toBe(1);
    expect(shinarFeinbergRobust(envz).map((r) => r.species)).toEqual(["Yp"]);
  });

  it("needs deficiency one and a single-species difference", () => {
    expect(shinarFeinbergRobust(structure("E + S <-> C\nC -> E + P"))).toEqual([]);
    // Schlögl: δ = 1 but every complex is terminal (both pairs are reversible).
    expect(shinarFeinbergRobust(structure("0 <-> X\n2X <-> 3X"))).toEqual([]);
    // δ = 5 − 2 − 2 = 1 with non-terminal complexes A + B and C, which differ in three species.
    const s = structure("A + B -> 2C\nC -> A\nC -> B");
    expect(s.deficiency).toBe(1);
    expect(shinarFeinbergRobust(s)).toEqual([]);
  });

  it("reports the criterion only: the theorem's premise (a positive steady state exists) is left to the caller", () => {
    // A + B -> C -> A, B -> 0: A + B and B differ in A alone, yet dB/dt = −B·(k1·A + k3) < 0 for
    // B > 0, so there is no positive steady state and the robustness statement is empty.
    const s = structure("A + B -> C\nC -> A\nB -> 0");
    expect(s.deficiency).toBe(1);
    expect(shinarFeinbergRobust(s).map((r) => r.species)).toEqual(["A"]);
  });
});
