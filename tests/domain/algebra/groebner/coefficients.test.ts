import { describe, expect, it } from "vitest";
import { fieldCoefficients, integerCoefficients, primeCoefficients } from "@domain/algebra/groebner/coefficients";
import { QQ, rational } from "@domain/algebra/index";
import { prng } from "../../../fixtures/algebra/systems";

describe("engine coefficients", () => {
  it("fraction-free factors satisfy a·lc(p) = b·lc(g) with a > 0 minimal", () => {
    const K = integerCoefficients;
    for (const [lcp, lcg] of [[6n, 4n], [-9n, 6n], [5n, -1n], [12n, 3n], [7n, 1n]] as const) {
      const [a, b] = K.reductionFactors(lcp, lcg);
      expect(a * lcp).toBe(b * lcg);
      expect(a > 0n).toBe(true);
    }
    expect(K.reductionFactors(6n, 4n)).toEqual([2n, 3n]);
    const c = [-6n, 9n, 12n];
    K.normalize(c);
    expect(c).toEqual([2n, -3n, -4n]); // primitive, positive leading coefficient
  });
  it("Z/p kernels are exact near 2^26 and 2^31 (checked against bigint)", () => {
    for (const p of [67108859, 2147483647]) {
      const K = primeCoefficients(p);
      const P = BigInt(p);
      const rnd = prng(p);
      for (let t = 0; t < 1000; t++) {
        const [x, b, y] = [0, 1, 2].map(() => (t < 3 ? p - 1 - t : Math.floor(rnd() * p)));
        const expected = Number((((BigInt(x) - BigInt(b) * BigInt(y)) % P) + P) % P);
        expect(K.mulSub(x, b, y)).toBe(expected);
        expect(K.negMul(b, y)).toBe(Number((P - ((BigInt(b) * BigInt(y)) % P)) % P));
      }
      const c = [12345, 678, 9];
      K.normalize(c);
      expect(c[0]).toBe(1);
    }
  });
  it("a field used directly makes polynomials monic", () => {
    const K = fieldCoefficients(QQ);
    const c = [rational(2n), rational(3n)];
    K.normalize(c);
    expect(c).toEqual([rational(1n), rational(3n, 2n)]);
    expect(K.reductionFactors(rational(3n), rational(2n))).toEqual([QQ.one, rational(3n, 2n)]);
  });
});
