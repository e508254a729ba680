import { describe, expect, it } from "vitest";
import { PolynomialRing, QQ, groebnerBasis } from "@domain/algebra/index";
import type { ImageTracing, LiftCandidate, ModularImage } from "@domain/algebra/f4/multimodular";
import {
  ImageLifter, candidateBasis, decodeImage, decodeImageBatch, encodeImage, encodeImageBatch, imageModPrime, isDeclinedOnly, liftPrimes, multiModularGroebnerQQ, multiModularInput,
} from "@domain/algebra/f4/multimodular";
import { Limits } from "@domain/algebra/groebner/limits";

/**
 * Primes where the run's learnt F4 run declines to replay (ModularImage.declined) are set aside
 * by the lift instead of computed afresh, and the result is still the reduced basis: checked
 * against this project's fraction-free Buchberger over Q (itself checked against SymPy 1.11 and
 * Singular 4.3 in sympy.test.ts / singular.test.ts). Reduced bases are unique (Cox, Little,
 * O'Shea, ch. 2 §7, Prop. 6), so equality is exact.
 *
 * The system is built so that the replay declines at exactly one prime: a constant term equal to
 * the third lift prime q vanishes mod q, so F4's run there leaves the columns learnt at the first.
 */
const R = new PolynomialRing(["x", "y", "z"], QQ, "grevlex");
const q = [...liftPrimes(multiModularInput([R.parse("x")]))][2];
const polys = [`x^2 + y*z + 1`, `y^2 + x*z - ${q}`, `z^2 + x*y - 3`].map((s) => R.parse(s));
const plain = (im: ModularImage) => ({ p: im.p, lengths: Array.from(im.lengths), exps: Array.from(im.exps), coeffs: Array.from(im.coeffs), declined: im.declined === true });

describe("primes where the learnt F4 run declines", () => {
  it("imageModPrime: declines only at q; onDecline true gives no elements, false gives F4 afresh flagged declined", () => {
    const input = multiModularInput(polys);
    const ps = [...liftPrimes(input)].slice(0, 5);
    expect(ps[2]).toBe(q);
    for (const skip of [true, false]) {
      const tracing: ImageTracing = { trace: undefined, replayed: 0, declined: 0, onDecline: () => skip };
      const images = ps.map((p) => imageModPrime(input, p, new Limits(), undefined, undefined, tracing));
      expect(images.map((im) => im.declined === true)).toEqual([false, false, true, false, false]);
      expect(tracing).toMatchObject({ replayed: 3, declined: 1 });
      expect(isDeclinedOnly(images[2])).toBe(skip);
      if (!skip) expect({ ...plain(images[2]), declined: false }).toEqual(plain(imageModPrime(input, q, new Limits())));
    }
  });

  it("the lift sets q aside, records it, and gives the reduced basis; the one-process run does the same", () => {
    const input = multiModularInput(polys);
    const lifter = new ImageLifter(input);
    const tracing: ImageTracing = { trace: undefined, replayed: 0, declined: 0, onDecline: () => lifter.takesDecline() };
    let cand: LiftCandidate | null = null;
    for (const p of liftPrimes(input)) {
      cand = lifter.add(imageModPrime(input, p, new Limits(), undefined, undefined, tracing));
      if (cand) break;
    }
    expect(cand!.declined).toEqual([q]);
    expect(cand!.primes).not.toContain(q);
    expect(cand!.unlucky).not.toContain(q);
    const want = groebnerBasis(polys, { method: "buchberger" }).map((g) => R.format(g));
    expect(candidateBasis(input, cand!).map((g) => R.format(g))).toEqual(want);
    const replays = { replayed: 0, declined: 0 };
    expect(multiModularGroebnerQQ(polys, new Limits(), { replays })!.map((g) => R.format(g))).toEqual(want);
    expect(replays.declined).toBe(1);
  });

  it("at most one declined prime plus one per four combined is set aside; past that a declined image is combined, and one without elements is refused", () => {
    const input = multiModularInput(polys);
    const ps = [...liftPrimes(input)];
    const none = (p: number): ModularImage => ({ p, n: 3, lengths: new Int32Array(0), exps: new Int32Array(0), coeffs: new Int32Array(0), declined: true });
    const lifter = new ImageLifter(input);
    expect(lifter.takesDecline()).toBe(true);
    expect(lifter.add(none(ps[0]))).toBeNull();
    expect(lifter.takesDecline()).toBe(false);
    expect(() => lifter.add(none(ps[1]))).toThrow(/was not computed/);
    // A declined image with elements past the limit is combined like any other; after four, one more may be set aside.
    const big = multiModularInput([`x^2 + ${10n ** 60n + 7n}*y*z + 1`, `y^2 + x*z - 2`, `z^2 + x*y - 3`].map((s) => R.parse(s)));
    const wide = new ImageLifter(big);
    wide.add(none(ps[0]));
    for (const p of [...liftPrimes(big)].slice(1, 5)) expect(wide.add({ ...imageModPrime(big, p, new Limits()), declined: true })).toBeNull();
    expect(wide.count).toBe(4);
    expect(wide.takesDecline()).toBe(true);
  });

  it("the flag survives encoding, alone, on a support and in a batch; an image after one without elements is written on the last computed support", () => {
    const input = multiModularInput(polys);
    const [a, b, c] = [...liftPrimes(input)].slice(0, 4).filter((p) => p !== q).map((p) => imageModPrime(input, p, new Limits()));
    const d: ModularImage = { p: q, n: 3, lengths: new Int32Array(0), exps: new Int32Array(0), coeffs: new Int32Array(0), declined: true };
    expect(plain(decodeImage(encodeImage(d)))).toEqual(plain(d));
    const flagged = { ...b, declined: true };
    expect(plain(decodeImage(encodeImage(flagged, a), () => a))).toEqual(plain(flagged));
    const batch = encodeImageBatch([a, d, c]);
    const out = decodeImageBatch(batch);
    expect(out.map(plain)).toEqual([a, d, c].map(plain));
    // c is residues on a: the batch is far smaller than three full images.
    expect(batch.byteLength).toBeLessThan(encodeImage(a).byteLength + encodeImage(c).byteLength);
    expect(out[2].exps).toBe(out[0].exps);
  });
});
