import { describe, expect, it } from "vitest";
import { crtStep, guidedReconstruction, mqrr, rationalModP } from "@domain/algebra/f4/reconstruction";

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

  it("takes the same quotients with Lehmer's rounds on long numbers as the plain loop (1500–4900-bit numerators and denominators modulo a 9689-bit prime)", () => {
    // The plain maximal-quotient loop as Monagan (ISSAC 2004) states it, the reference here.
    const plain = (u: bigint, m: bigint, logm: number) => {
      let T = (1n << 20n) * BigInt(logm), n = 0n, d = 0n, r0 = m, r1 = u, t0 = 0n, t1 = 1n;
      while (r1 !== 0n && r0 > T) {
        const q = r0 / r1;
        if (q > T) { n = r1; d = t1; T = q; }
        [r0, r1] = [r1, r0 - q * r1];
        [t0, t1] = [t1, t0 - q * t1];
      }
      const g = (a: bigint, b: bigint): bigint => (b === 0n ? (a < 0n ? -a : a) : g(b, a % b));
      if (d === 0n || g(n, d) !== 1n) return null;
      return d < 0n ? { num: -n, den: -d } : { num: n, den: d };
    };
    let seed = 12345n;
    const rnd = (bits: number) => { // a deterministic pseudo-random integer of about `bits` bits
      let x = 0n;
      for (let k = 0; k < bits; k += 31) { seed = (seed * 1103515245n + 12345n) % 2147483648n; x = (x << 31n) | seed; }
      return x >> BigInt(Math.max(0, Math.ceil(bits / 31) * 31 - bits));
    };
    const m = 2n ** 9689n - 1n, logm = 9689; // a Mersenne prime (exponent recalled from memory): every denominator is invertible
    let reconstructed = 0;
    for (const bits of [1500, 2500, 4000, 4900]) {
      for (let k = 0; k < 3; k++) {
        const num = rnd(bits) * (k % 2 ? -1n : 1n), den = rnd(bits) | 1n;
        const u = (((num % m) + m) % m) * modInv(den, m) % m;
        const want = plain(u, m, logm);
        expect(mqrr(u, m, logm)).toEqual(want);
        if (want) reconstructed++;
        const noise = rnd(9000) % m; // almost surely no small fraction: both must refuse alike
        expect(mqrr(noise, m, logm)).toEqual(plain(noise, m, logm));
      }
    }
    expect(reconstructed).toBeGreaterThanOrEqual(6); // the fractions below half the modulus' size come back
  });

  it("refuses when the modulus is too small for the fraction, and maps rationals mod p", () => {
    const m = 1000003n;
    const u = (123456n * modInv(654321n, m)) % m;
    expect(mqrr(u, m)).toBeNull();
    expect(rationalModP({ num: 1n, den: 3n }, 7)).toBe(5);
    expect(rationalModP({ num: -2n, den: 1n }, 7)).toBe(5);
    expect(rationalModP({ num: 1n, den: 7n }, 7)).toBeNull();
  });

  it("guided reconstruction reuses a still-valid fraction and a shared denominator, and agrees with mqrr", () => {
    const m = 2n ** 127n - 1n, logm = 127; // a Mersenne prime, so every denominator is invertible
    const residue = (num: bigint, den: bigint) => ((((num * modInv(den, m)) % m) + m) % m);
    const u = residue(-22n, 17n);
    // Through the shared denominator 17·34: the same fraction mqrr finds, in lowest terms.
    expect(guidedReconstruction(u, m, logm, undefined, 578n)).toEqual({ num: -22n, den: 17n });
    expect(mqrr(u, m, logm)).toEqual({ num: -22n, den: 17n });
    // A previous fraction that is still congruent is returned as it is; one that is not is not.
    const previous = { num: -22n, den: 17n };
    expect(guidedReconstruction(u, m, logm, previous, 1n)).toBe(previous);
    expect(guidedReconstruction(residue(5n, 7n), m, logm, previous, 1n)).toEqual({ num: 5n, den: 7n });
    // A wrong denominator guess falls back to mqrr; too small a modulus still gives null.
    expect(guidedReconstruction(residue(3n, 11n), m, logm, undefined, 7n)).toEqual({ num: 3n, den: 11n });
    const small = 1000003n;
    expect(guidedReconstruction((123456n * modInv(654321n, small)) % small, small, 20, undefined, 654321n)).toBeNull();
  });
});
