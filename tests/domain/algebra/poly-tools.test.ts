import { describe, expect, it } from "vitest";
import { PolynomialRing, QQ } from "@domain/algebra/index";
import { coefficientsIn, degreeIn, exactQuotient, normaliseEquation, primitive, signPattern, substituteFraction, variablesOf } from "@domain/algebra/poly-tools";

const R = new PolynomialRing(["x", "y", "z"], QQ, "lex");
const p = (s: string) => R.parse(s);
const f = (q: ReturnType<typeof p>) => R.format(q);

describe("polynomial helpers of the steady-state layer", () => {
  it("degrees, variables and coefficients in one variable", () => {
    expect(degreeIn(p("x^2*y + y"), 0)).toBe(2);
    expect([...variablesOf(p("x*z + 1"))]).toEqual([0, 2]);
    expect(coefficientsIn(p("x^2*y + 3*x + y"), 0).map(f)).toEqual(["y", "3", "y"]);
  });
  it("normalises equations: monomial content out, coprime integers, positive leading coefficient", () => {
    expect(f(normaliseEquation(p("2*x^2*y - 4*x*y"), () => true))).toBe("x - 2");
    expect(f(primitive(p("-x/2 + 1/3")))).toBe("3*x - 2");
  });
  it("sign patterns, exact quotients, fraction substitution", () => {
    expect(signPattern(p("x + 2*y"))).toBe("positive");
    expect(signPattern(p("-x - y"))).toBe("negative");
    expect(signPattern(p("x - y"))).toBe("mixed");
    expect(f(exactQuotient(p("x^2 - y^2"), p("x + y"))!)).toBe("x - y");
    expect(exactQuotient(p("x^2 + y^2"), p("x + y"))).toBeNull();
    // x^2 + y with x = y/z, times z^2: y^2 + y*z^2.
    const r = substituteFraction(p("x^2 + y"), 0, p("y"), p("z"));
    expect(r.power).toBe(2);
    expect(f(r.value)).toBe(f(p("y^2 + y*z^2")));
  });
});
