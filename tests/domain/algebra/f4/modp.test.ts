import { describe, expect, it } from "vitest";
import { F4_MAX_PRIME, invModP, mulModP, primesBelow, reduceDouble } from "@domain/algebra/f4/modp";
import { isPrime } from "@domain/algebra/field";
import { seededRandom } from "../../../support/prng";

describe("arithmetic modulo a prime below 2^26", () => {
  const p = 67108859; // the largest prime below 2^26
  it("reduces any double below 2^53 exactly, as BigInt arithmetic does", () => {
    const rand = seededRandom(26);
    const invp = 1 / p;
    for (let i = 0; i < 2000; i++) {
      const x = Math.floor(rand() * 2 ** 53);
      expect(reduceDouble(x, p, invp)).toBe(Number(BigInt(x) % BigInt(p)));
    }
  });
  it("multiplies residues exactly and inverts them", () => {
    const a = p - 2, b = p - 3;
    expect(mulModP(a, b, p)).toBe(Number((BigInt(a) * BigInt(b)) % BigInt(p)));
    expect(mulModP(invModP(12345, p), 12345, p)).toBe(1);
  });
  it("lists primes below the limit, largest first, skipping the ones given", () => {
    const first = [...take(primesBelow(F4_MAX_PRIME), 3)];
    expect(first[0]).toBe(p);
    expect(first.every(isPrime)).toBe(true);
    expect(first).toEqual([...first].sort((x, y) => y - x));
    expect([...take(primesBelow(F4_MAX_PRIME, new Set([p])), 1)][0]).toBe(first[1]);
    expect([...primesBelow(30)]).toEqual([29, 23, 19, 17, 13, 11, 7, 5]);
  });
});

function* take<T>(g: Generator<T>, n: number): Generator<T> {
  for (const v of g) {
    if (n-- <= 0) return;
    yield v;
  }
}
