import { describe, expect, it } from "vitest";
import { crtStep, mqrr, rationalModP } from "@domain/algebra/f4/reconstruction";

const modInv = (a: bigint, m: bigint): bigint => {
  let [r0, r1, t0, t1] = [m, ((a % m) + m) % m, 0n, 1n];
  while (r1 !== 0n) { const q = r0 / r1; [r0, r1] = [r1, r0 - q * r1]; [t0, t1] = [t1, t0 - q * t1]; }
  return ((t0 % m) + m) % m;
};

describe("Chinese remaindering and rational reconstruction", () => {
  it("crtStep combines residues (11 ≡ 2 mod 3, 11 ≡ 1 mod 5)", () => {
    expect(crtStep(2n, 3n, 1, 5, 2)).toBe(11n); // 3^{-1} mod 5 = 2
  });

  it("lifts a 60-digit fraction from the residues modulo enough primes (Monagan's MQRR, ISSAC 2004)", () => {
    const num = -(10n ** 60n + 12345n), den = 10n ** 59n + 7n; // coprime: den is odd and not divisible by 5
    const primes = [67108859, 67108837, 67108819, 67108777, 67108763, 67108757, 67108753, 67108729, 67108693, 67108669,
      67108667, 67108661, 67108649, 67108633, 67108597, 67108579, 67108529, 67108511, 67108507, 67108493];
    let M = 1n, u = 0n;
    for (const p of primes) {
      const P = BigInt(p);
      const r = Number((((num % P) + P) % P) * modInv(den, P) % P);
      u = M === 1n ? BigInt(r) : crtStep(u, M, r, p, Number(modInv(M, P)));
      M *= P;
      expect(u % P).toBe(BigInt(r));
    }
    expect(mqrr(u, M)).toEqual({ num, den });
  });

  it("refuses when the modulus is too small for the fraction, and maps rationals mod p", () => {
    const m = 1000003n;
    const u = (123456n * modInv(654321n, m)) % m;
    expect(mqrr(u, m)).toBeNull();
    expect(rationalModP({ num: 1n, den: 3n }, 7)).toBe(5);
    expect(rationalModP({ num: -2n, den: 1n }, 7)).toBe(5);
    expect(rationalModP({ num: 1n, den: 7n }, 7)).toBeNull();
  });
});
