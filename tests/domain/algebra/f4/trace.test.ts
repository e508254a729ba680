import { describe, expect, it } from "vitest";
import { PolynomialRing, QQ, groebnerBasis } from "@domain/algebra/index";
import type { ImageTracing, ModularImage } from "@domain/algebra/f4/multimodular";
import { decodeImageTrace, encodeImageTrace, imageModPrime, liftPrimes, multiModularGroebnerQQ, multiModularInput } from "@domain/algebra/f4/multimodular";
import { Limits } from "@domain/algebra/groebner/limits";
import { cyclic, katsura, randomIdeal } from "../../../fixtures/algebra/systems";

/**
 * A learnt F4 run replayed at other primes (trace.ts) against F4 run afresh at the same prime:
 * the replay must give the very same reduced basis mod p (elements, terms, residues) or decline.
 * F4 itself is checked against Buchberger's algorithm in f4.test.ts, and that against SymPy 1.11
 * and Singular 4.3 in sympy.test.ts / singular.test.ts.
 */
function plain(image: ModularImage) {
  return { p: image.p, lengths: Array.from(image.lengths), exps: Array.from(image.exps), coeffs: Array.from(image.coeffs) };
}

function compare(vars: string[], order: string, polys: string[], primes = 5) {
  const R = new PolynomialRing(vars, QQ, order);
  const input = multiModularInput(polys.map((s) => R.parse(s)));
  const tracing: ImageTracing = { trace: undefined, replayed: 0, declined: 0 };
  const ps = [...liftPrimes(input)].slice(0, primes);
  for (const p of ps) {
    const traced = imageModPrime(input, p, new Limits(), undefined, undefined, tracing);
    expect(plain(traced), `${order} mod ${p}`).toEqual(plain(imageModPrime(input, p, new Limits())));
  }
  return { tracing, primes: ps };
}

describe("F4 replayed from a learnt run (trace.ts) equals F4 run afresh", () => {
  const orders = ["grevlex", "grlex", "lex", "lex(1), grevlex(2)", "grevlex(2), grevlex(1)", "weighted(1,2,3)"];
  for (let seed = 1; seed <= 18; seed++) {
    const order = orders[seed % orders.length];
    it(`random ideal ${seed} in ${order}, five primes`, () => {
      const s = randomIdeal(seed * 11, { nvars: 3, npolys: 2 + (seed % 3), maxDegree: 3, minTerms: 2, minDegree: 1, maxTerms: 4, coeffBound: 1000n });
      const { tracing } = compare(s.vars, order, s.polys);
      expect(tracing.trace).toBeTruthy(); // none of these ideals contains 1
      expect(tracing.replayed).toBe(4);
    });
  }

  it("replays katsura-4 and cyclic-5 in grevlex at every later prime", () => {
    for (const s of [katsura(4), cyclic(5)]) {
      const { tracing } = compare(s.vars, "grevlex", s.polys);
      expect(tracing.trace).toBeTruthy();
      expect(tracing.replayed).toBe(4);
    }
  });

  it("declines, and F4 runs itself, where a result loses a term at the new prime", () => {
    // f2 − f1 = q·z + x: two terms at the learning prime, only x modulo q.
    const R = new PolynomialRing(["x", "y", "z"], QQ, "grevlex");
    const probe = multiModularInput(["x*y + 3*z"].map((s) => R.parse(s)));
    const [p0, q] = [...liftPrimes(probe)].slice(0, 2);
    const polys = ["x*y + 3*z", `x*y + ${3 + q}*z + x`, "y^2 - z"];
    const input = multiModularInput(polys.map((s) => R.parse(s)));
    expect([...liftPrimes(input)].slice(0, 2)).toEqual([p0, q]);
    const tracing: ImageTracing = { trace: undefined, replayed: 0, declined: 0 };
    imageModPrime(input, p0, new Limits(), undefined, undefined, tracing);
    const atQ = imageModPrime(input, q, new Limits(), undefined, undefined, tracing);
    expect(tracing).toMatchObject({ replayed: 0, declined: 1 });
    expect(plain(atQ)).toEqual(plain(imageModPrime(input, q, new Limits())));
  });

  it("runs untraced when a replayed lift fails its proof: a row that is zero only at the learning prime", () => {
    // x − y and x − (1 + p0)·y: their difference −p0·y vanishes at the learning prime p0, so the
    // learnt run has one element and every replay repeats it; over Q the basis is {y, x}. In lex,
    // with the grevlex basis as reference (proof step 3 by membership; in grevlex step 3 itself
    // would fail at p0, which the traced and the untraced run share).
    const R = new PolynomialRing(["x", "y"], QQ, "lex");
    const [p0] = [...liftPrimes(multiModularInput([R.parse("x - y")]))].slice(0, 1);
    const F = ["x - y", `x - ${1 + p0}*y`].map((s) => R.parse(s));
    const Rg = R.withOrder("grevlex");
    const reference = groebnerBasis(["x - y", `x - ${1 + p0}*y`].map((s) => Rg.parse(s)));
    expect(reference.map((g) => Rg.format(g))).toEqual(["y", "x"]);
    const replays = { replayed: 0, declined: 0 };
    const G = multiModularGroebnerQQ(F, new Limits(), { replays, reference });
    expect(replays.replayed).toBeGreaterThan(0);
    expect(G?.map((g) => R.format(g))).toEqual(["y", "x"]);
    expect(G?.map((g) => R.format(g))).toEqual(groebnerBasis(F, { method: "buchberger" }).map((g) => R.format(g)));
  });

  it("does not trace the unit ideal", () => {
    const { tracing } = compare(["x", "y"], "grevlex", ["x*y - 1", "x^2 - 1/3", "y - 5"], 2);
    expect(tracing.trace).toBeNull();
  });

  it("gives the same basis over Q traced and untraced, and replays", () => {
    const R = new PolynomialRing(katsura(4).vars, QQ, "grevlex");
    const polys = katsura(4).polys.map((s) => R.parse(s));
    const replays = { replayed: 0, declined: 0 };
    const traced = multiModularGroebnerQQ(polys, new Limits(), { replays })!.map((g) => R.format(g));
    const untraced = multiModularGroebnerQQ(polys, new Limits(), { traced: false })!.map((g) => R.format(g));
    expect(traced).toEqual(untraced);
    expect(traced).toEqual(groebnerBasis(polys, { method: "buchberger" }).map((g) => R.format(g)));
    expect(replays.replayed).toBeGreaterThan(0);
  });

  it("replays a trace learnt in another process (encoded, decoded on a fresh monomial table) like F4 afresh", () => {
    // A copy of the input stands for a worker's task process: its own prepared ring and monomial
    // table, which never saw the learning run's intermediate monomials, so the outputs' ids differ.
    for (const [s, order] of [[katsura(4), "grevlex"], [cyclic(5), "grevlex"], [randomIdeal(77, { nvars: 3, npolys: 3, maxDegree: 3, minTerms: 2, minDegree: 1, maxTerms: 4, coeffBound: 1000n }), "lex(1), grevlex(2)"]] as const) {
      const R = new PolynomialRing(s.vars, QQ, order);
      const input = multiModularInput(s.polys.map((t) => R.parse(t)));
      const [p0, ...later] = [...liftPrimes(input)].slice(0, 4);
      const learnt: ImageTracing = { trace: undefined, replayed: 0, declined: 0 };
      imageModPrime(input, p0, new Limits(), undefined, undefined, learnt);
      expect(learnt.trace).toBeTruthy();
      const bytes = encodeImageTrace(input, learnt.trace!);
      const elsewhere = structuredClone(input);
      // Unaligned, as a Buffer from the database may be.
      const shifted = new Uint8Array(bytes.byteLength + 1).subarray(1);
      shifted.set(bytes);
      const loaded: ImageTracing = { trace: decodeImageTrace(elsewhere, shifted), replayed: 0, declined: 0 };
      for (const p of later) {
        expect(plain(imageModPrime(elsewhere, p, new Limits(), undefined, undefined, loaded)), `${order} mod ${p}`).toEqual(plain(imageModPrime(input, p, new Limits())));
      }
      expect(loaded.replayed).toBe(later.length);
    }
  });

  it("refuses bytes that are not a trace, or a trace of another number of variables", () => {
    const R = new PolynomialRing(["x", "y"], QQ, "grevlex");
    const input = multiModularInput(["x^2 - y", "x*y - 1"].map((t) => R.parse(t)));
    const learnt: ImageTracing = { trace: undefined, replayed: 0, declined: 0 };
    imageModPrime(input, [...liftPrimes(input)][0], new Limits(), undefined, undefined, learnt);
    const bytes = encodeImageTrace(input, learnt.trace!);
    expect(() => decodeImageTrace(input, new Uint8Array(16))).toThrow(/not a trace/);
    const R3 = new PolynomialRing(["x", "y", "z"], QQ, "grevlex");
    expect(() => decodeImageTrace(multiModularInput(["x - z"].map((t) => R3.parse(t))), bytes)).toThrow(/number of variables/);
  });
});
