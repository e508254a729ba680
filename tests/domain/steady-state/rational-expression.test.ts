import { describe, expect, it } from "vitest";
import { PolynomialRing, QQ } from "@domain/algebra/index";
import { composeExpression, formatExpression, isPositiveExpression, simplifyFraction } from "@domain/steady-state/rational-expression";

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
});
