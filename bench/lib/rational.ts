/**
 * Minimal exact rationals for the benchmark harness (bigint numerator/denominator, den > 0,
 * gcd 1). Kept apart from domain/algebra on purpose: the harness must check the engine's
 * output with code the engine does not share.
 *
 * Example: q(6n, -4n) is { n: -3n, d: 2n }; qToString(q(3n, 2n)) is "3/2".
 */
export interface Q {
  readonly n: bigint;
  readonly d: bigint;
}

function gcd(a: bigint, b: bigint): bigint {
  if (a < 0n) a = -a;
  if (b < 0n) b = -b;
  while (b !== 0n) [a, b] = [b, a % b];
  return a;
}

export function q(n: bigint, d: bigint = 1n): Q {
  if (d === 0n) throw new RangeError("division by zero");
  if (d < 0n) [n, d] = [-n, -d];
  const g = gcd(n, d);
  return g > 1n ? { n: n / g, d: d / g } : { n, d };
}

export const qIsZero = (a: Q): boolean => a.n === 0n;
export const qAdd = (a: Q, b: Q): Q => q(a.n * b.d + b.n * a.d, a.d * b.d);
export const qMul = (a: Q, b: Q): Q => q(a.n * b.n, a.d * b.d);
export const qNeg = (a: Q): Q => ({ n: -a.n, d: a.d });
export function qDiv(a: Q, b: Q): Q {
  if (b.n === 0n) throw new RangeError("division by zero");
  return q(a.n * b.d, a.d * b.n);
}
export const qToString = (a: Q): string => (a.d === 1n ? `${a.n}` : `${a.n}/${a.d}`);

/** Parses "3", "-3/4". */
export function qParse(text: string): Q {
  const m = /^\s*(-?\d+)(?:\s*\/\s*(\d+))?\s*$/.exec(text);
  if (!m) throw new SyntaxError(`not a rational number: "${text}"`);
  return q(BigInt(m[1]), m[2] === undefined ? 1n : BigInt(m[2]));
}

/** Maps a rational into Z/p as an integer in [0, p). Example: qModP(q(1n, 2n), 7n) is 4n. */
export function qModP(a: Q, p: bigint): bigint {
  const mod = (x: bigint) => ((x % p) + p) % p;
  const d = mod(a.d);
  if (d === 0n) throw new RangeError(`denominator ${a.d} vanishes modulo ${p}`);
  return mod(mod(a.n) * modInverse(d, p));
}

function modInverse(a: bigint, p: bigint): bigint {
  // Extended Euclid; p is prime so the inverse exists for a != 0.
  let [r0, r1, s0, s1] = [a, p, 1n, 0n];
  while (r1 !== 0n) {
    const t = r0 / r1;
    [r0, r1] = [r1, r0 - t * r1];
    [s0, s1] = [s1, s0 - t * s1];
  }
  return ((s0 % p) + p) % p;
}
