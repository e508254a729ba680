import { describe, expect, it } from "vitest";
import { PolynomialRing, QQ } from "@domain/algebra/index";
import katex from "katex";
import { composeExpression, expressionDegree, expressionTex, expressionVariables, formatExpression, isPositiveExpression, simplifyFraction } from "@domain/steady-state/rational-expression";

const R = new PolynomialRing(["x", "y", "k1", "k2"], QQ, "lex(2), grevlex(2)");
const p = (s: string) => R.parse(s);

describe("rational expressions", () => {
  it("cancels monomial factors and candidate factors, normalises the denominator", () => {
    const e = simplifyFraction(p("2*k1*x*y + 2*k2*x*y"), p("-4*x*(k1 + k2)"), [p("k1 + k2")]);
    expect(formatExpression(e)).toBe("-1/2*y");
  });
  it("formats with parentheses where the syntax needs them", () => {
    expect(formatExpression({ num: p("k1*x"), den: p("k2") })).toBe("x*k1/k2");
    expect(formatExpression({ num: p("k1*x"), den: p("2*k2") })).toBe("x*k1/(2*k2)");
    expect(formatExpression({ num: p("x + y"), den: p("k1 + k2") })).toBe("(x + y)/(k1 + k2)");
    // Not 5/8/x, which needs the reader to know how / groups.
    expect(formatExpression({ num: p("5/8"), den: p("x") })).toBe("(5/8)/x");
  });
  it("composes substitutions: (x + 1)/y with x = y/k1 is (y + k1)/(y·k1)", () => {
    const e = composeExpression({ num: p("x + 1"), den: p("y") }, 0, p("y"), p("k1"));
    expect(formatExpression(e)).toBe("(y + k1)/(y*k1)");
    expect(isPositiveExpression(e)).toBe(true);
    expect(isPositiveExpression({ num: p("y - k1"), den: p("k2") })).toBe(false);
  });
  it("writes TeX with the same factors as the text: fractions, powers, negative coefficients, symbolic parameters", () => {
    expect(expressionTex({ num: p("k1*x"), den: p("k2") })).toBe("\\frac{\\mathrm{x}\\cdot\\mathrm{k1}}{\\mathrm{k2}}");
    expect(expressionTex({ num: p("-3/2*x^2*y"), den: p("1") })).toBe("-\\frac{3}{2}\\,\\mathrm{x}^{2}\\cdot\\mathrm{y}");
    expect(expressionTex({ num: p("5/8"), den: p("x") })).toBe("\\frac{\\frac{5}{8}}{\\mathrm{x}}");
    // The same parts as the text: the sum left after the monomial x in brackets, first.
    const factored = { num: p("x*k1 + x*k2"), den: p("k2") };
    expect(formatExpression(factored, [p("k1 + k2")])).toBe("(k1 + k2)*x/k2");
    expect(expressionTex(factored, [p("k1 + k2")])).toBe("\\frac{\\left(\\mathrm{k1}+\\mathrm{k2}\\right)\\cdot\\mathrm{x}}{\\mathrm{k2}}");
    // A pivot that divides: written as a factor, after the number and the monomial.
    expect(formatExpression({ num: p("-2*x*k1 - 2*x*k2"), den: p("y") }, [p("k1 + k2")])).toBe("-2*x*(k1 + k2)/y");
    expect(expressionTex({ num: p("-2*x*k1 - 2*x*k2"), den: p("y") }, [p("k1 + k2")])).toBe(
      "\\frac{-2\\,\\mathrm{x}\\cdot\\left(\\mathrm{k1}+\\mathrm{k2}\\right)}{\\mathrm{y}}",
    );
    for (const e of [factored, { num: p("x + y"), den: p("k1 + k2") }, { num: p("-x"), den: p("1") }])
      expect(() => katex.renderToString(expressionTex(e, [p("k1 + k2")]), { throwOnError: true })).not.toThrow();
  });
  it("degree in the free species: of the numerator or the denominator, the larger", () => {
    // x^2*y*k1/(x*k2): numerator degree 3 in x, y; denominator 1.
    expect(expressionDegree({ num: p("x^2*y*k1"), den: p("x*k2") }, [0, 1])).toBe(3);
    expect(expressionDegree({ num: p("k1"), den: p("x^2 + y*k2") }, [0, 1])).toBe(2);
    expect(expressionDegree({ num: p("k1"), den: p("k2") }, [0, 1])).toBe(0);
  });
  it("variables it depends on: nonzero exponents in numerator or denominator, in the ring's order", () => {
    expect(expressionVariables({ num: p("k2*x"), den: p("y + k1") })).toEqual(["x", "y", "k1", "k2"]);
    expect(expressionVariables({ num: p("x^2 - x"), den: p("3") })).toEqual(["x"]);
    expect(expressionVariables({ num: p("5"), den: p("1") })).toEqual([]);
  });
});
