import { describe, expect, it } from "vitest";
import { AlgebraError, MAX_PRIME, QQ, invMod, isPrime, mulMod, primeField, rational } from "@domain/algebra/index";
import { prng } from "../../fixtures/algebra/systems";

describe("prime fields Z/p", () => {
  const bigPrimes = [2147483647, 2147483629, 2147483587, 67108879 /* > 2^26: split path */];
  it("multiplies exactly at the edges near 2^31 (checked against bigint)", () => {
    for (const p of bigPrimes) {
      const P = BigInt(p);
      const edge = [0, 1, 2, 65535, 65536, 65537, p - 1, p - 2, p - 65536, Math.floor(p / 2), Math.floor(p / 2) + 1];
      for (const a of edge) for (const b of edge) {
        expect(mulMod(a, b, p)).toBe(Number((BigInt(a) * BigInt(b)) % P));
        expect(primeField(p).mul(a, b)).toBe(Number((BigInt(a) * BigInt(b)) % P));
      }
      const rnd = prng(p);
      for (let k = 0; k < 2000; k++) {
        const a = Math.floor(rnd() * p), b = Math.floor(rnd() * p);
        expect(mulMod(a, b, p)).toBe(Number((BigInt(a) * BigInt(b)) % P));
      }
    }
  });

  it("(p-1)^2 = 1 and inverses multiply to one", () => {
    const F = primeField(MAX_PRIME);
    expect(F.mul(MAX_PRIME - 1, MAX_PRIME - 1)).toBe(1);
    const rnd = prng(7);
    for (let k = 0; k < 500; k++) {
      const a = 1 + Math.floor(rnd() * (MAX_PRIME - 1));
      expect(F.mul(a, F.inv(a))).toBe(1);
      expect(F.mul(a, invMod(a, MAX_PRIME))).toBe(1);
    }
  });

  it("small primes use the plain product and agree with bigint", () => {
    const F = primeField(32003);
    for (let a = 31990; a < 32003; a++) for (let b = 31990; b < 32003; b++) expect(F.mul(a, b)).toBe((a * b) % 32003);
    expect(F.sub(1, 2)).toBe(32002);
    expect(F.add(32002, 2)).toBe(1);
    expect(F.neg(0)).toBe(0);
  });

  it("maps rationals and rejects non-invertible denominators", () => {
    const F = primeField(7);
    expect(F.fromRational(rational(1n, 3n))).toBe(5);
    expect(F.fromBigInt(-1n)).toBe(6);
    expect(() => F.fromRational(rational(1n, 14n))).toThrow(AlgebraError);
    expect(F.format(6)).toBe("-1");
    expect(F.format(3)).toBe("3");
    expect(F.format(4)).toBe("-3");
  });

  it("rejects non-primes and moduli at or above 2^31", () => {
    expect(() => primeField(4)).toThrow(/not a prime/);
    expect(() => primeField(2147483659)).toThrow(/not a prime below 2\^31/);
    expect(isPrime(2147483647)).toBe(true);
    expect(isPrime(2147483649)).toBe(false);
  });
});

describe("QQ", () => {
  it("does exact normalised arithmetic", () => {
    const a = rational(1n, 2n), b = rational(1n, 3n);
    expect(QQ.add(a, b)).toEqual(rational(5n, 6n));
    expect(QQ.div(a, b)).toEqual(rational(3n, 2n));
    expect(QQ.format(rational(-6n, 4n))).toBe("-3/2");
    expect(() => QQ.inv(QQ.zero)).toThrow(AlgebraError);
  });
});
