import { describe, expect, it } from "vitest";
import { degreeIn, namesIn, toTex } from "~/analyses/latex";
import katex from "katex";

describe("formulas as LaTeX", () => {
  it("typesets polynomials and quotients in the CLI's syntax", () => {
    expect(toTex("X^3 - 6*X^2 + 11*X - 6")).toBe("{\\mathrm{X}}^{3}-6\\,{\\mathrm{X}}^{2}+11\\,\\mathrm{X}-6");
    expect(toTex("S0*E*k1/(km1 + k2)")).toMatch(/^\\frac\{/);
    // E is a species here, not Euler's number.
    expect(toTex("E")).toBe("\\mathrm{E}");
  });

  it("never lets a multi-letter species read as a product", () => {
    // The species ES is one upright word; the product of E and S keeps its sign.
    expect(toTex("ES - 1/4")).toMatch(/^\\mathrm\{ES\}-/);
    expect(toTex("E*S")).toBe("\\mathrm{E}\\cdot\\mathrm{S}");
    expect(toTex("2*E*S")).toMatch(/^2\\,\\mathrm\{E\}\\cdot\\mathrm\{S\}$/);
  });

  it("produces LaTeX that KaTeX accepts", () => {
    for (const e of ["(lm3 + l4)*S0*E^2*k1/((km3 + k4)*F*l3)", "-3/2*A*B + k_1*E", "2/5*S0*K"]) {
      expect(() => katex.renderToString(toTex(e), { throwOnError: true })).not.toThrow();
    }
  });

  it("lists names and the degree in the free species", () => {
    expect(namesIn("k1*A/(k2 + A)")).toEqual(["k1", "A", "k2"]);
    expect(degreeIn("S0*E^2*k1/(F*l3)", ["S0", "E", "F"])).toBe(3);
    expect(degreeIn("(lm3 + l4)*S0*E*k1*k2/((km1 + k2)*F^2*l3*l4)", ["S0", "E", "F"])).toBe(2);
    expect(degreeIn("4/3*S0*K/F", ["S0", "K", "F"])).toBe(2);
  });
});
