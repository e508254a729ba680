import { describe, expect, it } from "vitest";
import { PolynomialRing, QQ, primeField } from "@domain/algebra/index";
import { coefficientsFor, clearDenominators, fromEngine, monicRational, toEngine } from "@domain/algebra/groebner/convert";

const R = new PolynomialRing(["x", "y"], QQ, "grevlex");

describe("engine conversions", () => {
  it("round-trips a polynomial through the engine form without sharing its coefficient array", () => {
    const p = R.parse("1/2*x^2 - 3*y + 5");
    const e = toEngine(p);
    expect(e.coeffs).not.toBe(p.coeffs);
    expect(R.format(fromEngine(R, e))).toBe("1/2*x^2 - 3*y + 5");
  });

  it("clears denominators by their lcm: 1/2*x - 2/3*y + 1/6 → 3x - 4y + 1", () => {
    expect(clearDenominators(toEngine(R.parse("1/2*x - 2/3*y + 1/6"))).coeffs).toEqual([3n, -4n, 1n]);
  });

  it("makes an integer polynomial monic over Q, also with a negative leading coefficient", () => {
    const z = clearDenominators(toEngine(R.parse("-4*x + 6*y - 2")));
    expect(R.format(fromEngine(R, monicRational(z)))).toBe("x - 3/2*y + 1/2");
    let ticks = 0;
    monicRational(z, () => ticks++);
    expect(ticks).toBe(3);
  });

  it("uses word-size arithmetic for Z/p and the field itself otherwise", () => {
    const P = coefficientsFor(primeField(7));
    const Q = coefficientsFor(QQ);
    expect(P.mul(3, 5)).toBe(1); // 15 ≡ 1 (mod 7), plain numbers
    expect(Q.mul({ num: 2n, den: 3n }, { num: 3n, den: 4n })).toEqual({ num: 1n, den: 2n });
  });
});
