import { describe, expect, it } from "vitest";
import { PolynomialRing, QQ, primeField } from "@domain/algebra/index";
import type { Polynomial, Rational } from "@domain/algebra/index";
import { buchberger, defaultStrategy, maxDegree, reduceBasis, sPolynomialHead } from "@domain/algebra/groebner/buchberger";
import { fieldCoefficients, primeCoefficients } from "@domain/algebra/groebner/coefficients";
import { fromEngine, toEngine } from "@domain/algebra/groebner/convert";
import { lcm } from "@domain/algebra/monomial";

const R = new PolynomialRing(["x", "y"], QQ, "grlex");
const K = fieldCoefficients(QQ);
const text = (ps: Polynomial<Rational>[]) => ps.map((p) => R.format(p));

describe("buchberger (engine polynomials)", () => {
  it("gives the reduced grlex basis {x^2, x*y, y^2 - 1/2*x} (Cox, Little & O'Shea, Ideals, Varieties, and Algorithms, ch. 2 §7; SymPy groebner gives [x**2, x*y, 2*y**2 - x])", () => {
    const F = [R.parse("x^3 - 2*x*y"), R.parse("x^2*y - 2*y^2 + x")].map(toEngine);
    const G = buchberger(F, K, 2, R.cmp).map((g) => fromEngine(R, g));
    expect(text(G).sort()).toEqual(["x*y", "x^2", "y^2 - 1/2*x"].sort());
  });

  it("gives the same leading monomials over Z/32003 with either pair selection", () => {
    const P = R.withField(primeField(32003));
    const F = [P.parse("x^3 - 2*x*y"), P.parse("x^2*y - 2*y^2 + x")].map(toEngine);
    const lms = (s: "sugar" | "normal") => buchberger(F, primeCoefficients(32003), 2, P.cmp, { strategy: s }).map((g) => Array.from(g.exps.subarray(0, 3)));
    expect(lms("sugar")).toEqual(lms("normal"));
    expect(lms("sugar")).toHaveLength(3);
  });
});

describe("reduceBasis", () => {
  it("drops elements whose leading monomial another divides and inter-reduces the rest", () => {
    // {x^2, x^2 + x*y, x*y + y^2}: the second reduces away, the third keeps its tail y^2.
    const G = reduceBasis([R.parse("x^2"), R.parse("x^2 + x*y"), R.parse("x*y + y^2")].map(toEngine), K, 2, R.cmp).map((g) => fromEngine(R, g));
    expect(text(G)).toEqual(["x*y + y^2", "x^2"]);
  });
});

describe("helpers", () => {
  it("sPolynomialHead multiplies f by lcm / LM(f)", () => {
    const f = toEngine(R.parse("x^2 + y"));
    const g = toEngine(R.parse("x*y + 1"));
    const head = sPolynomialHead(f, lcm(f.exps, 0, g.exps, 0, 2), 2);
    expect(R.format(fromEngine(R, head))).toBe("x^2*y + y^2");
  });
  it("maxDegree is the largest total degree of a term", () => {
    expect(maxDegree(toEngine(R.parse("x^3*y + x + 1")), 2)).toBe(4);
  });
  it("chooses the normal strategy for pure lex and sugar for graded and block orders", () => {
    expect(defaultStrategy([{ kind: "grevlex" }])).toBe("sugar");
    expect(defaultStrategy([{ kind: "lex" }])).toBe("normal");
    expect(defaultStrategy([{ kind: "lex" }, { kind: "grevlex" }])).toBe("sugar");
  });
});
