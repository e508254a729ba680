import katex from "katex";
import { describe, expect, it } from "vitest";
import { nameTex, numberTex, polynomialTex } from "@domain/algebra/format-tex";
import { PolynomialRing, QQ, primeField } from "@domain/algebra/index";

const R = new PolynomialRing(["X", "ES", "E", "S", "k_1"], QQ, "lex");
const p = (s: string) => R.parse(s);

describe("polynomials in TeX, from the exact polynomial (no text parsed back)", () => {
  it("powers, integer and fractional coefficients, negative terms", () => {
    expect(polynomialTex(p("X^3 - 6*X^2 + 11*X - 6"))).toBe("\\mathrm{X}^{3}-6\\,\\mathrm{X}^{2}+11\\,\\mathrm{X}-6");
    expect(polynomialTex(p("-3/2*E*S + 1/4"))).toBe("-\\frac{3}{2}\\,\\mathrm{E}\\cdot\\mathrm{S}+\\frac{1}{4}");
    expect(polynomialTex(p("0"))).toBe("0");
    expect(polynomialTex(p("-X"))).toBe("-\\mathrm{X}");
  });

  it("a multi-letter species is one upright word; a product of names keeps its sign", () => {
    expect(polynomialTex(p("ES - 1/4"))).toBe("\\mathrm{ES}-\\frac{1}{4}");
    expect(polynomialTex(p("E*S"))).toBe("\\mathrm{E}\\cdot\\mathrm{S}");
    expect(polynomialTex(p("2*E*S"))).toBe("2\\,\\mathrm{E}\\cdot\\mathrm{S}");
  });

  it("symbolic parameters with underscores are escaped; numbers as fractions", () => {
    expect(nameTex("k_on")).toBe("\\mathrm{k\\_on}");
    expect(polynomialTex(p("k_1*E"))).toBe("\\mathrm{E}\\cdot\\mathrm{k\\_1}");
    expect(numberTex("-7/3")).toBe("-\\frac{7}{3}");
    expect(numberTex("12")).toBe("12");
  });

  it("over Z/p the coefficients are in the symmetric range, as in the text", () => {
    const F = new PolynomialRing(["x"], primeField(7), "lex");
    expect(polynomialTex(F.parse("x^2 + 6"))).toBe("\\mathrm{x}^{2}-1");
  });

  it("KaTeX accepts what it writes", () => {
    for (const s of ["X^3 - 6*X^2 + 11*X - 6", "-3/2*E*S + k_1*E", "2/5*ES*X^7"]) expect(() => katex.renderToString(polynomialTex(p(s)), { throwOnError: true })).not.toThrow();
  });
});
