import { describe, expect, it } from "vitest";
import { AlgebraError, PolynomialRing, QQ, groebnerBasis, isGroebner, isReduced, rational } from "@domain/algebra/index";
import { fglm } from "@domain/algebra/fglm";
import { fglmModularQQ, rationalReconstruction, sqrtFloor } from "@domain/algebra/fglm-modular";
import { isPrime } from "@domain/algebra/field";
import { katsura, prng, randomPolyText } from "../../fixtures/algebra/systems";

const grevlexBasis = (vars: readonly string[], polys: readonly string[]) => {
  const R = new PolynomialRing(vars, QQ, "grevlex");
  return groebnerBasis(polys.map((s) => R.parse(s)));
};

describe("rational reconstruction", () => {
  it("recovers small fractions from their images (von zur Gathen and Gerhard, §5.10)", () => {
    // 1/2 mod 7 is 4 (2·4 = 8 ≡ 1), but with |a|, b ≤ 1 no fraction fits: 4 itself is too big, 1/2 has b = 2.
    expect(rationalReconstruction(4n, 7n, 1n)).toBeNull();
    expect(rationalReconstruction(34n, 101n, 7n)).toEqual(rational(1n, 3n)); // 3·34 = 102 ≡ 1 mod 101, 2·7² < 101
    const m = 1_000_003n * 998_244_353n;
    const bound = sqrtFloor(m / 2n);
    for (const [a, b] of [[-355n, 113n], [22n, 7n], [1n, 1n], [0n, 1n], [-1n, 12345n]] as const) {
      const image = (((a * modInverse(b, m)) % m) + m) % m;
      expect(rationalReconstruction(image, m, bound)).toEqual(rational(a, b));
    }
  });
  it("sqrtFloor is exact on squares and their neighbours, also beyond doubles", () => {
    for (const n of [0n, 1n, 2n, 3n, 4n, 99n, 100n, 101n, 10n ** 40n, 10n ** 40n - 1n, 2n ** 2001n])
      expect(sqrtFloor(n) ** 2n <= n && (sqrtFloor(n) + 1n) ** 2n > n).toBe(true);
  });
});

function modInverse(a: bigint, m: bigint): bigint {
  let [r0, r1, t0, t1] = [m, ((a % m) + m) % m, 0n, 1n];
  while (r1 !== 0n) {
    const q = r0 / r1;
    [r0, r1, t0, t1] = [r1, r0 - q * r1, t1, t0 - q * t1];
  }
  return t0;
}

describe("fglmModularQQ (images mod primes, lifted and proven)", () => {
  it("equals FGLM over Q on katsura-4 in lex and in a block order", () => {
    const sys = katsura(4);
    const G = grevlexBasis(sys.vars, sys.polys);
    for (const order of ["lex", "lex(2), grevlex(3)"]) {
      const target = new PolynomialRing(sys.vars, QQ, order);
      const lifted = fglmModularQQ(G, target)!;
      expect(lifted).not.toBeNull();
      expect(lifted.map((h) => target.format(h))).toEqual(fglm(G, target).map((h) => target.format(h)));
    }
  });

  it("handles an ideal not in shape position (derived by hand)", () => {
    // x^2 = 2, y^2 = 3/2, z = x*y: z^2 = 3 and x = z/y = 2/3*y*z, so in lex x > y > z the reduced
    // basis is {z^2 - 3, y^2 - 3/2, x - 2/3*y*z}; y is not a polynomial in z (four points, z = ±√3 twice).
    const vars = ["x", "y", "z"];
    const G = grevlexBasis(vars, ["x^2 - 2", "y^2 - 3/2", "z - x*y"]);
    const lex = new PolynomialRing(vars, QQ, "lex");
    expect(fglmModularQQ(G, lex)!.map((h) => lex.format(h))).toEqual(["z^2 - 3", "y^2 - 3/2", "x - 2/3*y*z"]);
  });

  it("skips a prime that divides a denominator and still lifts the right basis", () => {
    let p = 2 ** 26 - 1;
    while (!isPrime(p)) p -= 2; // the first prime the lift tries
    const vars = ["x", "y"];
    const G = grevlexBasis(vars, [`x - 1/${p}`, `y^2 - ${p}/3*x`]);
    const lex = new PolynomialRing(vars, QQ, "lex");
    expect(fglmModularQQ(G, lex)!.map((h) => lex.format(h))).toEqual(["y^2 - 1/3", `x - 1/${p}`]);
  });

  it("gives reduced Gröbner bases equal to FGLM over Q on random zero-dimensional ideals (seeded)", () => {
    const rnd = prng(77);
    const vars = ["x", "y", "z"];
    for (let trial = 0; trial < 6; trial++) {
      // x^2 + …, y^2 + …, z^2 + … with random lower terms: zero-dimensional by construction.
      const polys = vars.map((v) => `${v}^2 + ${randomPolyText(rnd, vars, { nvars: 3, npolys: 3, maxDegree: 1, maxTerms: 3, coeffBound: 50n, fractions: true })}`);
      const G = grevlexBasis(vars, polys);
      if (G.length === 1 && G[0].exps[0] === 0) continue;
      const lex = new PolynomialRing(vars, QQ, "lex");
      const lifted = fglmModularQQ(G, lex)!;
      expect(isGroebner(lifted)).toBe(true);
      expect(isReduced(lifted)).toBe(true);
      expect(lifted.map((h) => lex.format(h))).toEqual(fglm(G, lex).map((h) => lex.format(h)));
    }
  });

  it("honours a deadline", () => {
    const sys = katsura(5);
    const G = grevlexBasis(sys.vars, sys.polys);
    const lex = new PolynomialRing(sys.vars, QQ, "lex");
    expect(() => fglmModularQQ(G, lex, { deadline: Date.now() - 1 })).toThrow(AlgebraError);
  });
});
