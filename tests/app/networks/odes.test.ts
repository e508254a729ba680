import { describe, expect, it } from "vitest";
import { analyseStructure, parseNetworkCsv } from "@domain/network/index";
import { massActionTerms } from "@domain/steady-state/ode-terms";
import { odesAlignedLatex, odesLatexDocument, odeToLatex, odeToText, rateTex, latexText } from "~/networks/odes";

const structureOf = (csv: string) => analyseStructure(parseNetworkCsv(csv));
/** The page's ODEs: the domain's builder, formatted here. */
const odesOf = (csv: string) => massActionTerms(parseNetworkCsv(csv));

describe("the ODEs as text and TeX", () => {
  it("writes the enzyme mechanism's ODEs (Horn & Jackson 1972, eq. 2.5; worked by hand)", () => {
    const odes = odesOf("reaction,rate,reverse_rate\nE + S <-> C,k1,k2\nC -> E + P,k3,\n");
    expect(odes.map(odeToText)).toEqual([
      "dE/dt = -k1·E·S + k2·C + k3·C",
      "dS/dt = -k1·E·S + k2·C",
      "dC/dt = k1·E·S - k2·C - k3·C",
      "dP/dt = k3·C",
    ]);
  });

  it("uses coefficients as exponents and net change as the factor", () => {
    // 2A -> B: dA/dt = −2·k·A², dB/dt = k·A²; A + B -> 2B: net +1 for B, −1 for A.
    const odes = odesOf("reaction,rate\n2A -> B,k\nA + B -> 2B,j\n");
    expect(odes.map(odeToText)).toEqual(["dA/dt = -2·k·A^2 - j·A·B", "dB/dt = k·A^2 + j·A·B"]);
  });

  it("merges terms with the same rate symbol and reactant, and handles inflow", () => {
    // The same reaction written twice with one shared symbol doubles the term.
    const odes = odesOf("reaction,rate\n0 -> X,f\nX -> 0,d\nX -> 0,d\n");
    expect(odes.map(odeToText)).toEqual(["dX/dt = f - 2·d·X"]);
  });

  it("writes 0 for a species no reaction changes", () => {
    // E is a catalyst: E + S -> E + P leaves E unchanged.
    const odes = odesOf("reaction,rate\nE + S -> E + P,k\n");
    expect(odeToText(odes[0]!)).toBe("dE/dt = 0");
  });

  it("typesets rate symbols and species for LaTeX", () => {
    expect(rateTex("k1")).toBe("k_{1}");
    expect(rateTex("k_on")).toBe("k_{\\mathrm{on}}");
    expect(rateTex("kcat")).toBe("\\mathit{kcat}");
    const [dA] = odesOf("reaction,rate\n2A -> B,k1\n");
    // Concentrations in brackets, so [T][L] (two species) and [TL] (one) read differently.
    expect(odeToLatex(dA!)).toBe("\\frac{d[\\mathrm{A}]}{dt} = -2\\,k_{1}\\,[\\mathrm{A}]^{2}");
  });

  it("aligns all equations at their equals signs for display", () => {
    const block = odesAlignedLatex(odesOf("reaction,rate\nA -> B,k1\n"));
    expect(block.split("\n")).toEqual([
      "\\begin{aligned}",
      "\\frac{d[\\mathrm{A}]}{dt} &= -k_{1}\\,[\\mathrm{A}] \\\\[0.6em]",
      "\\frac{d[\\mathrm{B}]}{dt} &= k_{1}\\,[\\mathrm{A}]",
      "\\end{aligned}",
    ]);
  });

  it("makes a complete LaTeX document with escaped title", () => {
    const doc = odesLatexDocument("R&D 50% _test_", odesOf("reaction,rate\nA -> B,k1\n"));
    expect(doc).toContain("\\begin{align*}");
    expect(doc).toContain("\\section*{R\\&D 50\\% \\_test\\_}");
    expect(doc).toContain("\\frac{d[\\mathrm{A}]}{dt} &= -k_{1}\\,[\\mathrm{A}]");
    expect(latexText("a\\b^c~")).toBe("a\\textbackslash{}b\\textasciicircum{}c\\textasciitilde{}");
  });
});

describe("the ODEs as text and TeX with constant species", () => {
  it("writes a held species as a factor of the rate and gives it no equation (Schlögl, Z. Physik 253, 1972)", () => {
    const s = structureOf("# constant: A = 2, B\nreaction,rate,reverse_rate\nA + 2X <-> 3X,k1,k2\nX <-> B,k3,k4\n");
    const odes = odesOf("# constant: A = 2, B\nreaction,rate,reverse_rate\nA + 2X <-> 3X,k1,k2\nX <-> B,k3,k4\n");
    expect(odes.map(odeToText)).toEqual(["dX/dt = k1·X^2·A - k2·X^3 - k3·X + k4·B"]);
    const tex = odesLatexDocument("Fed switch", odes, s.constants);
    expect(tex).toContain("Held constant: $[\\mathrm{A}] = 2$, $[\\mathrm{B}]$ (without a value: a parameter).");
  });
});
