import { describe, expect, it } from "vitest";
import { PolynomialRing, QQ, groebnerBasis } from "@domain/algebra/index";
import type { LiftCandidate, MultiModularInput } from "@domain/algebra/f4/multimodular";
import { ImageLifter, adoptIntegerCandidate, encodeIntegerCandidate, imageModPrime, liftPrimes, multiModularInput, proofBatches, proveBatch } from "@domain/algebra/f4/multimodular";
import { Limits } from "@domain/algebra/groebner/limits";
import { katsura } from "../../../fixtures/algebra/systems";

/**
 * The lifted candidate sent to the workers as its integer form (encodeIntegerCandidate) instead of
 * its text: every proof batch gives the same outcome as with the text, so the proof is the same
 * (the candidate is the reduced basis, checked against this project's Buchberger over Q, itself
 * checked against SymPy 1.11 and Singular 4.3 in sympy.test.ts / singular.test.ts), and a changed
 * coefficient makes the proof fail: the batches really reduce with the bytes.
 */
const overTheWire = <T>(x: T): T => JSON.parse(JSON.stringify(x)) as T;

function lifted(input: MultiModularInput): LiftCandidate {
  const lifter = new ImageLifter(input);
  for (const p of liftPrimes(input)) {
    const c = lifter.add(imageModPrime(input, p, new Limits()));
    if (c) return c;
  }
  throw new Error("no candidate");
}

describe("the candidate's integer form for the proof batches", () => {
  const R = new PolynomialRing(katsura(4).vars, QQ, "grevlex");
  const polys = katsura(4).polys.map((s) => R.parse(s));

  it("katsura-4: loaded without the text in another process' copy of the input, every batch is proven as with the text", () => {
    const input = multiModularInput(polys);
    const cand = lifted(input);
    expect(cand.basis).toEqual(groebnerBasis(polys, { method: "buchberger" }).map((g) => R.format(g)));
    const bytes = encodeIntegerCandidate(input, cand, new Limits());
    const elsewhere = overTheWire(input);
    const key: LiftCandidate = { basis: [], primes: [], unlucky: [], checkedWith: cand.checkedWith };
    // Unaligned, as a database driver may hand them over.
    const shifted = new Uint8Array(bytes.byteLength + 1).subarray(1);
    shifted.set(bytes);
    adoptIntegerCandidate(elsewhere, key, shifted);
    const batches = proofBatches(input, cand, 3);
    expect(batches.map((b) => b.kind)).toEqual(["pairs", "pairs", "pairs", "inputs", "hilbert"]);
    for (const b of batches) expect(proveBatch(elsewhere, key, b, new Limits()), b.kind).toEqual(proveBatch(overTheWire(input), overTheWire(cand), b, new Limits()));
    expect(batches.map((b) => proveBatch(elsewhere, key, b, new Limits()).ok)).toEqual([true, true, true, true, true]);
  });

  it("a changed coefficient in the bytes fails the proof; bytes of another shape are refused", () => {
    const input = multiModularInput(polys);
    const cand = lifted(input);
    const bytes = encodeIntegerCandidate(input, cand, new Limits());
    const text = new TextDecoder().decode(bytes);
    // The last coefficient of the last element (hexadecimal, after the last comma): one more.
    const at = bytes.lastIndexOf(",".charCodeAt(0)) + 1;
    const last = text.slice(at);
    const neg = last.startsWith("-");
    const value = BigInt("0x" + (neg ? last.slice(1) : last)) * (neg ? -1n : 1n) + 1n;
    const hex = value < 0n ? "-" + (-value).toString(16) : value.toString(16);
    const changed = new Uint8Array([...bytes.subarray(0, at), ...new TextEncoder().encode(hex)]);
    const header = new DataView(changed.buffer);
    header.setInt32(16, header.getInt32(16, true) + (changed.byteLength - bytes.byteLength), true);
    const key: LiftCandidate = { basis: [], primes: [], unlucky: [], checkedWith: cand.checkedWith };
    const elsewhere = overTheWire(input);
    adoptIntegerCandidate(elsewhere, key, changed);
    const outcomes = proofBatches(input, cand, 1).map((b) => proveBatch(elsewhere, key, b, new Limits()).ok);
    expect(outcomes.slice(0, 2)).not.toEqual([true, true]);
    expect(() => adoptIntegerCandidate(overTheWire(input), key, bytes.subarray(0, bytes.byteLength - 1))).toThrow(/does not match/);
    const other = multiModularInput(katsura(3).polys.map((s) => new PolynomialRing(katsura(3).vars, QQ, "grevlex").parse(s)));
    expect(() => adoptIntegerCandidate(other, key, bytes)).toThrow(/does not match/);
  });

  it("a batch that needs the text says so when only the integer form was sent", () => {
    const input = multiModularInput(polys);
    const key: LiftCandidate = { basis: [], primes: [], unlucky: [], checkedWith: 1 };
    expect(() => proveBatch(overTheWire(input), key, { kind: "pairs", index: 0, of: 1 }, new Limits())).toThrow(/needs the candidate's text/);
  });
});
