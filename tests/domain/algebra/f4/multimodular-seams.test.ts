import { describe, expect, it } from "vitest";
import { PolynomialRing, QQ, groebnerBasis } from "@domain/algebra/index";
import { Limits } from "@domain/algebra/groebner/limits";
import type { LiftCandidate, ModularImage, MultiModularInput } from "@domain/algebra/f4/multimodular";
import {
  ImageLifter, batchReference, candidateBasis, decodeImage, decodeImageBatch, encodeImage, encodeImageBatch, imageModPrime, imageReference, liftImages, liftPrimes, multiModularGroebnerQQ,
  multiModularInput, proofBatches, proveBatch,
} from "@domain/algebra/f4/multimodular";
import { katsura, randomIdeal } from "../../../fixtures/algebra/systems";

/**
 * The plain-data seams of the multi-modular path (what a distributed run sends between machines)
 * composed by hand must give what the single-process composition gives; both are checked against
 * the plain fraction-free Buchberger of this project (itself checked against SymPy 1.11 and
 * Singular 4.3 in sympy.test.ts / singular.test.ts). Reduced bases are unique (Cox, Little,
 * O'Shea, "Ideals, Varieties, and Algorithms", ch. 2 §7, Prop. 6), so "same basis" is exact.
 */
function system(vars: readonly string[], order: string, polys: readonly string[]) {
  const R = new PolynomialRing(vars, QQ, order);
  return { R, polys: polys.map((s) => R.parse(s)) };
}

/** Text as it would cross the network: a fresh object the receiving process never saw. */
const overTheWire = <T>(x: T): T => JSON.parse(JSON.stringify(x)) as T;

/** A "distributed" run in one process: images in an arbitrary order, lifted in prime order, proof in parts. */
function byParts(input: MultiModularInput, batches: number) {
  const primes = [...take(liftPrimes(input), 200)];
  // Computed out of order (as workers finish them), each on a fresh copy of the input, as bytes.
  const computed = new Map<number, Uint8Array>();
  // Every other image on the support of the one before it (as a worker's task process sends them).
  const plain = new Map(primes.map((p) => [p, imageModPrime(overTheWire(input), p, new Limits())] as const));
  for (const [i, p] of [...primes.entries()].reverse()) computed.set(p, encodeImage(plain.get(p)!, i % 2 === 1 ? plain.get(primes[i - 1]) : undefined));
  const lifter = new ImageLifter(overTheWire(input));
  const decoded = new Map<number, ModularImage>();
  let cand: LiftCandidate | null = null;
  for (const p of primes) {
    const image = decodeImage(computed.get(p)!, (r) => decoded.get(r));
    decoded.set(p, image);
    cand = lifter.add(image);
    if (cand) break;
  }
  expect(cand).not.toBeNull();
  const sent = overTheWire(cand!);
  const outcomes = proofBatches(input, sent, batches).map((b) => proveBatch(overTheWire(input), sent, overTheWire(b), new Limits()));
  return { cand: cand!, outcomes, basis: candidateBasis(overTheWire(input), sent) };
}

function* take<T>(g: Iterable<T>, n: number): Generator<T> {
  let k = 0;
  for (const x of g) { if (k++ >= n) return; yield x; }
}

describe("multi-modular seams (plain data between workers)", () => {
  it("katsura-4: images out of order, lift in prime order, proof in 3 parts = the single-process basis = Buchberger", () => {
    const { R, polys } = system(katsura(4).vars, "grevlex", katsura(4).polys);
    const input = multiModularInput(polys);
    const { cand, outcomes, basis } = byParts(input, 3);
    expect(outcomes.map((o) => o.ok)).toEqual([true, true, true, true, true]);
    const single = multiModularGroebnerQQ(polys, new Limits())!.map((g) => R.format(g));
    const ref = groebnerBasis(polys, { method: "buchberger" }).map((g) => R.format(g));
    expect(basis.map((g) => R.format(g))).toEqual(single);
    expect(single).toEqual(ref);
    expect(cand.primes.length).toBeGreaterThan(1);
    expect(cand.primes).not.toContain(cand.checkedWith);
  });

  it("60-digit fractional coefficients: the same basis with the proof in 1, 2 and 5 parts", () => {
    const s = randomIdeal(903, { nvars: 4, npolys: 3, maxDegree: 2, minDegree: 2, minTerms: 3, maxTerms: 4, coeffBound: 10n ** 60n, fractions: true });
    const { R, polys } = system(s.vars, "grevlex", s.polys);
    const ref = groebnerBasis(polys, { method: "buchberger" }).map((g) => R.format(g));
    for (const parts of [1, 2, 5]) {
      const { outcomes, basis } = byParts(multiModularInput(polys), parts);
      expect(outcomes.every((o) => o.ok)).toBe(true);
      expect(outcomes).toHaveLength(parts + 2);
      expect(basis.map((g) => R.format(g))).toEqual(ref);
    }
  });

  it("drops an unlucky prime (a coefficient divisible by it changes the leading monomials) and still lifts the right basis", () => {
    const probe = multiModularInput([new PolynomialRing(["x"], QQ, "grevlex").parse("x - 1")]);
    const [, p] = [...take(liftPrimes(probe), 2)];
    const { R, polys } = system(["x", "y", "z"], "grevlex", [`x*y - ${p}*z^2`, "x^2 - y", "z^3 - x"]);
    const input = multiModularInput(polys);
    expect([...take(liftPrimes(input), 2)]).toContain(p); // p divides no leading coefficient, so it is tried
    const images = [...take(liftPrimes(input), 12)].map((q) => imageModPrime(input, q, new Limits()));
    const cand = liftImages(input, images)!;
    expect(cand.unlucky).toEqual([p]);
    expect(cand.primes).not.toContain(p);
    // (Its homogenisation is not saturated, so step 3 cannot prove it; the lift itself is what is tested here.)
    expect(candidateBasis(input, cand).map((g) => R.format(g))).toEqual(groebnerBasis(polys, { method: "buchberger" }).map((g) => R.format(g)));
  });

  it("a wrong candidate fails its proof: one element short, or a changed coefficient, fails some batch", () => {
    const { R, polys } = system(katsura(3).vars, "grevlex", katsura(3).polys);
    const input = multiModularInput(polys);
    const { cand } = byParts(input, 1);
    const short: LiftCandidate = { ...cand, basis: cand.basis.slice(0, -1) };
    expect(proofBatches(input, short, 2).some((b) => !proveBatch(input, short, b, new Limits()).ok)).toBe(true);
    const bent = R.format(R.parse(`${cand.basis[cand.basis.length - 1]} + 7`));
    const changed: LiftCandidate = { ...cand, basis: [...cand.basis.slice(0, -1), bent] };
    expect(proofBatches(input, changed, 3).some((b) => !proveBatch(input, changed, b, new Limits()).ok)).toBe(true);
  });

  it("an image survives encoding byte for byte, and bytes that do not match their header are refused", () => {
    const { polys } = system(katsura(3).vars, "grevlex", katsura(3).polys);
    const input = multiModularInput(polys);
    const image = imageModPrime(input, [...take(liftPrimes(input), 1)][0], new Limits());
    const back: ModularImage = decodeImage(encodeImage(image));
    expect(back.p).toBe(image.p);
    expect([...back.lengths]).toEqual([...image.lengths]);
    expect([...back.exps]).toEqual([...image.exps]);
    expect([...back.coeffs]).toEqual([...image.coeffs]);
    expect(() => decodeImage(encodeImage(image).subarray(0, 40))).toThrow(/do not match/);
  });

  it("an image on the support of an earlier one is its residues only, and decodes to the same image", () => {
    const { polys } = system(katsura(4).vars, "grevlex", katsura(4).polys);
    const input = multiModularInput(polys);
    const [p, q] = [...take(liftPrimes(input), 2)];
    const first = imageModPrime(input, p, new Limits()), second = imageModPrime(input, q, new Limits());
    const full = encodeImage(second), short = encodeImage(second, first);
    expect(imageReference(full)).toBeNull();
    expect(imageReference(short)).toBe(p);
    expect(short.byteLength).toBe(4 * (5 + second.coeffs.length)); // header and residues, no exponents
    expect(short.byteLength).toBeLessThan(full.byteLength / 5);
    const back = decodeImage(short, (r) => (r === p ? first : undefined));
    expect(back.exps).toBe(first.exps); // shared, so the lift interns its monomials once
    expect([...back.coeffs]).toEqual([...second.coeffs]);
    expect(back.p).toBe(q);
    // Without the image it refers to, decoding says which one is missing.
    expect(() => decodeImage(short)).toThrow(new RegExp(`mod ${q}: written on the support of the image mod ${p}`));
    // A support that differs is written in full.
    const other: ModularImage = { ...first, exps: first.exps.map((e, i) => (i === first.exps.length - 1 ? e + 1 : e)) };
    expect(imageReference(encodeImage(second, other))).toBeNull();
  });

  it("a batch of images decodes to its images, each on the support of the one before", () => {
    const { polys } = system(katsura(4).vars, "grevlex", katsura(4).polys);
    const input = multiModularInput(polys);
    const images = [...take(liftPrimes(input), 4)].map((p) => imageModPrime(input, p, new Limits()));
    const [before, ...batch] = images;
    const bytes = encodeImageBatch(batch, before);
    expect(batchReference(bytes)).toBe(before.p);
    const back = decodeImageBatch(bytes, (q) => (q === before.p ? before : undefined));
    expect(back.map((b) => b.p)).toEqual(batch.map((b) => b.p));
    back.forEach((b, i) => expect([...b.coeffs]).toEqual([...batch[i].coeffs]));
    expect(back.every((b) => b.exps === before.exps)).toBe(true);
    // A single image decodes as a batch of one; a cut batch is refused.
    expect(decodeImageBatch(encodeImage(before)).map((b) => b.p)).toEqual([before.p]);
    expect(() => decodeImageBatch(bytes.subarray(0, 12), () => before)).toThrow(/do not match/);
  });
});

describe("multi-modular proof, step 3 (why steps 1 and 2 are not enough)", () => {
  it("rejects a lift that passes Buchberger's criterion and the inputs check but generates a larger ideal", () => {
    // F = {x*y^2 + p*y^3 + y, x} generates <x, y^3 + y/p> over Q; modulo p it gives <x, y>, and
    // G = {x, y} is a Gröbner basis containing F (worked out by hand: x*y^2 + p*y^3 + y = y^2*x +
    // (p*y^2 + 1)*y). Only step 3 (Hilbert functions at p) tells the lift is wrong.
    const p = 1000003;
    const { R, polys } = system(["x", "y"], "grevlex", [`x*y^2 + ${p}*y^3 + y`, "x"]);
    const input = multiModularInput(polys);
    const image = imageModPrime(input, p, new Limits());
    const wrong: LiftCandidate = { basis: ["y", "x"], primes: [p], unlucky: [], checkedWith: p };
    const outcome = (batch: Parameters<typeof proveBatch>[2]) => proveBatch(input, wrong, batch, new Limits());
    expect(image.lengths.length).toBe(2);
    expect(proofBatches(input, wrong, 1).filter((b) => b.kind !== "hilbert").map(outcome).every((o) => o.ok)).toBe(true);
    expect(outcome({ kind: "hilbert", p })).toEqual({ ok: false, failed: "hilbert" });
    expect(groebnerBasis(polys).map((g) => R.format(g))).toEqual(["x", `y^3 + 1/${p}*y`]);
  });
});
