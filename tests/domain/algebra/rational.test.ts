import { describe, expect, it } from "vitest";
import { add, compare, div, eq, formatRational, fromInt, gcdBig, inv, mul, neg, parseRational, rational, sign, sub, toNumber, ZERO } from "@domain/algebra/rational";

const q = (text: string) => parseRational(text)!;

describe("rationals", () => {
  it("are kept in lowest terms with a positive denominator", () => {
    expect(rational(6n, -4n)).toEqual({ num: -3n, den: 2n });
    expect(rational(0n, -5n)).toEqual({ num: 0n, den: 1n });
    expect(() => rational(1n, 0n)).toThrow();
  });

  it("add, subtract, multiply and divide exactly (1/3 + 1/6 = 1/2, 2/3 · 9/4 = 3/2)", () => {
    expect(add(q("1/3"), q("1/6"))).toEqual(q("1/2"));
    expect(sub(q("1/3"), q("1/3"))).toEqual(ZERO);
    expect(mul(q("2/3"), q("9/4"))).toEqual(q("3/2"));
    expect(div(q("1/2"), q("-1/4"))).toEqual(fromInt(-2));
    expect(inv(q("-3/7"))).toEqual(q("-7/3"));
    expect(() => inv(ZERO)).toThrow();
    expect(neg(q("5/2"))).toEqual(q("-5/2"));
  });

  it("compares by value and gives the sign", () => {
    expect(compare(q("1/3"), q("0.3333"))).toBe(1);
    expect(compare(q("-1/2"), q("-0.5"))).toBe(0);
    expect([sign(q("-2")), sign(ZERO), sign(q("1/9"))]).toEqual([-1, 0, 1]);
    expect(eq(q("2/4"), q("1/2"))).toBe(true);
  });

  it("reads integers, fractions and exact decimals, and refuses anything else", () => {
    expect(q("0.125")).toEqual(rational(1n, 8n));
    expect(q("2e-3")).toEqual(rational(1n, 500n));
    expect(q(" -12 / 8 ")).toEqual(rational(-3n, 2n));
    expect(q("1.5E2")).toEqual(fromInt(150));
    for (const bad of ["", "1/0", "x", "1/2/3", ".", "1..2", "0x10"]) expect(parseRational(bad), bad).toBeNull();
  });

  it("prints canonical text that reads back to the same value", () => {
    for (const text of ["3", "-3/2", "0", "7/100000000000000000000"]) expect(formatRational(q(text))).toBe(text);
  });

  it("converts to a float, also when both parts overflow a double", () => {
    expect(toNumber(q("1/3"))).toBeCloseTo(1 / 3, 15);
    const huge = rational(10n ** 400n + 1n, 3n * 10n ** 400n);
    expect(toNumber(huge)).toBeCloseTo(1 / 3, 12);
  });

  it("finds greatest common divisors of big integers (also with signs and zero)", () => {
    expect(gcdBig(2n ** 100n * 3n, 2n ** 98n * 9n)).toBe(2n ** 98n * 3n);
    expect(gcdBig(-12n, 18n)).toBe(6n);
    expect(gcdBig(0n, 5n)).toBe(5n);
  });
});
