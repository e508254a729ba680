import { describe, expect, it } from "vitest";
import { LEHMER_MIN_BITS, bitLength, isHuge, lehmerGcd } from "@domain/algebra/lehmer-gcd";
import { gcdBig } from "@domain/algebra/rational";

// Plain Euclid as the independent reference (Knuth, TAOCP vol. 2, §4.5.2, Algorithm A).
function euclid(a: bigint, b: bigint): bigint {
  a = a < 0n ? -a : a;
  b = b < 0n ? -b : b;
  while (b !== 0n) [a, b] = [b, a % b];
  return a;
}

// Deterministic pseudo-random big integers (xorshift), `bits` bits long.
function generator(seed: number) {
  let s = seed >>> 0 || 1;
  const next = () => ((s ^= s << 13), (s ^= s >>> 17), (s ^= s << 5), s >>> 0);
  return (bits: number): bigint => {
    let x = 1n;
    for (let i = 0; i < Math.ceil(bits / 32); i++) x = (x << 32n) | BigInt(next());
    return x;
  };
}

describe("lehmerGcd (Knuth, Algorithm L)", () => {
  it("agrees with Euclid on random huge operands with a planted common factor", () => {
    const big = generator(7);
    for (const bits of [2100, 3000, 5000, 9000]) {
      for (let k = 0; k < 4; k++) {
        const g = big(bits / 3);
        const a = big(bits) * g, b = big(bits - 37 * k) * g;
        expect(lehmerGcd(a, b)).toBe(euclid(a, b));
        expect(gcdBig(-a, b)).toBe(euclid(a, b));
      }
    }
  });

  it("handles the edge cases: zero, equal operands, one dividing the other, very different sizes, powers of two", () => {
    const big = generator(11);
    const a = big(4000);
    expect(lehmerGcd(a, 0n)).toBe(a);
    expect(lehmerGcd(0n, -a)).toBe(a);
    expect(lehmerGcd(a, a)).toBe(a);
    expect(lehmerGcd(a * 12345n, a)).toBe(a);
    expect(lehmerGcd(a, 3n)).toBe(euclid(a, 3n));
    expect(lehmerGcd(2n ** 4000n * 3n, 2n ** 3999n * 9n)).toBe(3n * 2n ** 3999n);
    // Consecutive Fibonacci numbers: the worst case for Euclid (all quotients 1), coprime.
    let [f0, f1] = [0n, 1n];
    for (let i = 0; i < 6000; i++) [f0, f1] = [f1, f0 + f1];
    expect(bitLength(f1)).toBeGreaterThan(LEHMER_MIN_BITS);
    expect(lehmerGcd(f1, f0)).toBe(1n);
  });

  it("calls tick once per round, so a throwing deadline check interrupts it", () => {
    const big = generator(3);
    const a = big(20_000), b = big(20_000);
    let ticks = 0;
    expect(lehmerGcd(a, b, euclid, () => void ticks++)).toBe(euclid(a, b));
    expect(ticks).toBeGreaterThan(10);
    expect(() => lehmerGcd(a, b, euclid, () => { throw new Error("deadline"); })).toThrow("deadline");
  });

  it("bitLength and isHuge", () => {
    expect(bitLength(1n)).toBe(1);
    expect(bitLength(255n)).toBe(8);
    expect(bitLength(256n)).toBe(9);
    expect(bitLength(2n ** 4000n)).toBe(4001);
    expect(isHuge(2n ** BigInt(LEHMER_MIN_BITS) + 1n)).toBe(true);
    expect(isHuge(-(2n ** BigInt(LEHMER_MIN_BITS) + 1n))).toBe(true);
    expect(isHuge(2n ** 100n)).toBe(false);
  });
});
