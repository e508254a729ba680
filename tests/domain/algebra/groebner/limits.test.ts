import { describe, expect, it } from "vitest";
import { AlgebraError } from "@domain/algebra/errors";
import { Limits } from "@domain/algebra/groebner/limits";

describe("Limits", () => {
  it("passes with no limits set", () => {
    const l = new Limits();
    expect(() => l.checkTime()).not.toThrow();
    expect(() => l.checkSizes(1e6, 1e6, 1e6)).not.toThrow();
  });
  it("throws a timeout AlgebraError once the deadline has passed, naming what it was computing", () => {
    const l = new Limits({ deadline: Date.now() - 1 }, "lex basis");
    expect(() => l.checkTime()).toThrow(new AlgebraError("timeout", "lex basis: deadline exceeded"));
  });
  it("takes the earlier of an absolute deadline and a relative timeout", () => {
    expect(() => new Limits({ deadline: Date.now() + 60_000, timeoutMs: -1 }).checkTime()).toThrow(/deadline exceeded/);
  });
  it("throws cancelled when the signal is aborted", () => {
    const c = new AbortController();
    c.abort();
    expect(() => new Limits({ signal: c.signal }).checkTime()).toThrow(/cancelled/);
  });
  it("names each size budget it refuses", () => {
    const l = new Limits({ maxBasisSize: 10, maxPairs: 20, maxTerms: 30 });
    expect(() => l.checkSizes(10, 20, 30)).not.toThrow();
    expect(() => l.checkSizes(11, 0)).toThrow("Gröbner basis: basis grew beyond 10 polynomials");
    expect(() => l.checkSizes(0, 21)).toThrow("more than 20 pending pairs");
    expect(() => l.checkSizes(0, 0, 31)).toThrow("a polynomial grew beyond 30 terms");
  });
  it("forwards progress", () => {
    const seen: number[] = [];
    new Limits({ onProgress: (p) => seen.push(p.basisSize) }).progress({ pairsLeft: 1, basisSize: 4, degree: 2, reductions: 3 });
    expect(seen).toEqual([4]);
  });
});
