import { describe, expect, it } from "vitest";
import { AlgebraError, PolynomialRing, QQ, primeField } from "@domain/algebra/index";
import { prng, randomPolyText } from "../../fixtures/algebra/systems";

const R = new PolynomialRing(["x", "y", "z"], QQ, "grevlex");
const fmt = (s: string) => R.format(R.parse(s));

describe("parser and canonical printer", () => {
  it("prints the canonical form of the issue's example", () => {
    expect(fmt("1 - 3/2*z + y*x^2")).toBe("x^2*y - 3/2*z + 1");
  });
  it("a long sum with repeated and cancelling monomials is summed exactly (pairwise, any grouping gives the same)", () => {
    // 1 + 2 + … + 99 times x, minus 4950 x, plus the squares: the x terms cancel whatever the grouping.
    const text = [...Array.from({ length: 99 }, (_, i) => `${i + 1}*x`), "- 4950*x", ...Array.from({ length: 7 }, (_, i) => `+ ${i}/7*y^${i}`)].join(" + ").replace(/\+ -/g, "-").replace(/\+ \+/g, "+");
    expect(fmt(text)).toBe("6/7*y^6 + 5/7*y^5 + 4/7*y^4 + 3/7*y^3 + 2/7*y^2 + 1/7*y");
    expect(fmt("x - y - z - x + y")).toBe("-z");
  });
  it("handles precedence, parentheses, unary minus, fractions and decimals", () => {
    expect(fmt("-x^2")).toBe("-x^2");
    expect(fmt("(x + 1/2)^2")).toBe("x^2 + x + 1/4");
    expect(fmt("0.25*x - 1.5e1 + 2e-1")).toBe("1/4*x - 74/5");
    expect(fmt("x/2 - (y - z)/3")).toBe("1/2*x - 1/3*y + 1/3*z");
    expect(fmt("2*3*x - -y")).toBe("6*x + y");
    expect(fmt("x**2")).toBe("x^2");
    expect(fmt("0*x")).toBe("0");
    expect(fmt("-1")).toBe("-1");
    expect(fmt("-x*y + 4/6")).toBe("-x*y + 2/3");
  });
  it("round-trips random polynomials (seeded)", () => {
    const rnd = prng(42);
    for (let t = 0; t < 50; t++) {
      const text = randomPolyText(rnd, R.vars, { nvars: 3, npolys: 1, maxDegree: 5, maxTerms: 8, coeffBound: 10n ** 15n, fractions: true });
      const once = fmt(text);
      expect(fmt(once)).toBe(once);
    }
  });
  it("reports located errors with what was expected", () => {
    const err = (s: string) => {
      try {
        R.parse(s);
      } catch (e) {
        expect(e).toBeInstanceOf(AlgebraError);
        expect((e as AlgebraError).code).toBe("parse");
        return e as AlgebraError;
      }
      throw new Error(`no error for ${s}`);
    };
    expect(err("x + ").location).toEqual({ line: 1, column: 5 });
    expect(err("x + ").message).toMatch(/expected a number, a variable or '\('/);
    expect(err("2x").message).toMatch(/write 2\*x/);
    expect(err("x + w").message).toMatch(/unknown variable 'w'.*x, y, z.*column 5/);
    expect(err("(x + y").message).toMatch(/expected '\)'/);
    expect(err("x^y").message).toMatch(/non-negative integer exponent/);
    expect(err("x / y").message).toMatch(/division by a non-constant/);
    expect(err("x / 0").message).toMatch(/division by zero/);
    expect(err("x $ y").location).toEqual({ line: 1, column: 3 });
    expect(err("x +\n  # y").location).toEqual({ line: 2, column: 3 });
    expect(R.parse.bind(R, "x +", { line: 7, column: 1 })).toThrow(/line 7, column 4/);
    expect(err("").message).toMatch(/empty/);
  });
  it("prints Z/p coefficients in the symmetric range", () => {
    const P = new PolynomialRing(["x", "y"], primeField(101), "lex");
    expect(P.format(P.parse("100*x + 51*y + 50 + 1/3"))).toBe("-x - 50*y - 17"); // 1/3 = 34 mod 101
  });
});

describe("parser limits (checked before the work)", () => {
  const located = (text: string) => {
    try {
      R.parse(text);
    } catch (e) {
      expect(e).toBeInstanceOf(AlgebraError);
      return (e as AlgebraError).message;
    }
    throw new Error(`parsed ${text.slice(0, 20)}…`);
  };

  it("refuses deep nesting and long sign chains with a location, not a stack overflow", () => {
    expect(located(`${"(".repeat(5000)}x${")".repeat(5000)}`)).toMatch(/nesting deeper than 200 levels/);
    expect(located(`${"-".repeat(5000)}x`)).toMatch(/nesting deeper than 200 levels/);
    expect(fmt(`${"(".repeat(200)}x${")".repeat(200)}`)).toBe("x");
  });

  it("refuses powers too large to expand, and still expands moderate ones exactly", () => {
    expect(located("(x+1)^3000")).toMatch(/degree 3000 when expanded/);
    expect(located("(123456789*x+987654321)^1000")).toMatch(/too large to expand exactly/);
    expect(located("(x^1000000)^1000000")).toMatch(/degree 1000000000000/);
    // Binomial theorem: the coefficient of x^250 in (x+1)^500 is C(500, 250).
    let c = 1n;
    for (let k = 1n; k <= 250n; k++) c = (c * (500n - k + 1n)) / k;
    const terms = R.format(R.parse("(x+1)^500")).split(" + ");
    expect(terms).toHaveLength(501);
    expect(terms).toContain(`${c}*x^250`);
  });

  it("refuses decimals with huge exponents (a BigInt cannot hold 10^99999999999)", () => {
    expect(located("x - 1e99999999999")).toMatch(/too large to work with exactly/);
    expect(located("2E-5000")).toMatch(/too large to work with exactly/);
    expect(fmt("1e3*x")).toBe("1000*x");
  });
});
