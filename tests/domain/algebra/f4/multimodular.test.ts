import { describe, expect, it } from "vitest";
import { AlgebraError, PolynomialRing, QQ, groebnerBasis } from "@domain/algebra/index";
import type { Progress } from "@domain/algebra/groebner/limits";
import { Limits } from "@domain/algebra/groebner/limits";
import type { LiftCandidate, MultiModularStats } from "@domain/algebra/f4/multimodular";
import { firstLiftPrime, multiModularGroebnerQQ, multiModularInput, proofBatches, proveBatch } from "@domain/algebra/f4/multimodular";
import { dehomogenisedBasis, homogenise, homogeniseInto, homogenisedGrowth, orderWithH } from "@domain/algebra/groebner/homogenise";
import { cyclic, katsura, randomIdeal } from "../../../fixtures/algebra/systems";

/**
 * Multi-modular F4 over Q against the reference implementation (plain fraction-free Buchberger of
 * this project, checked against SymPy 1.11 and Singular 4.3 elsewhere). Reduced bases are unique
 * (Cox, Little, O'Shea, ch. 2 §7, Prop. 6).
 */
const fresh = (): MultiModularStats => ({ primes: 0, unlucky: 0, modularMs: 0, liftMs: 0, proofMs: 0 });

function run(vars: string[], order: string, polys: string[]) {
  const R = new PolynomialRing(vars, QQ, order);
  const ps = polys.map((s) => R.parse(s));
  const stats = fresh();
  const mm = multiModularGroebnerQQ(ps, new Limits(), { stats });
  const ref = groebnerBasis(ps, { method: "buchberger" }).map((g) => R.format(g));
  return { mm: mm?.map((g) => R.format(g)) ?? null, ref, stats };
}

describe("multi-modular F4 over Q agrees with Buchberger (reference implementation)", () => {
  for (let seed = 1; seed <= 12; seed++) {
    const order = seed % 2 ? "grevlex" : "grlex";
    const big = seed % 3 === 0;
    it(`random ideal ${seed} (${order}${big ? ", 60-digit coefficients" : ""}, fractions)`, () => {
      const s = randomIdeal(seed * 11, {
        nvars: 3, npolys: 3, maxDegree: 2, minTerms: 2, minDegree: 1, maxTerms: 3, coeffBound: big ? 10n ** 60n : 99n, fractions: true,
      });
      const { mm, ref, stats } = run(s.vars, order, s.polys);
      if (mm === null) {
        // Only an unprovable run may decline, and it says which step failed.
        expect(stats.failed).toBeDefined();
        const R = new PolynomialRing(s.vars, QQ, order);
        expect(groebnerBasis(s.polys.map((t) => R.parse(t)), { method: "f4" }).map((g) => R.format(g))).toEqual(ref);
      } else {
        expect(mm).toEqual(ref);
        expect(stats.failed).toBeUndefined();
      }
    });
  }

  for (let seed = 1; seed <= 4; seed++) {
    it(`homogeneous quadrics ${seed} with 60-digit and fractional coefficients are lifted and proven`, () => {
      const s = randomIdeal(900 + seed, {
        nvars: 4, npolys: 3, maxDegree: 2, minDegree: 2, minTerms: 3, maxTerms: 4, coeffBound: 10n ** 60n, fractions: true,
      });
      const { mm, ref, stats } = run(s.vars, seed % 2 ? "grevlex" : "grlex", s.polys);
      expect(stats.failed).toBeUndefined();
      expect(mm).toEqual(ref);
      expect(stats.primes).toBeGreaterThan(8); // 60-digit numbers need many 26-bit primes
    });
  }

  it("katsura-4 and katsura-5 lift, are proven and match", () => {
    for (const sys of [katsura(4), katsura(5)]) {
      const { mm, ref, stats } = run(sys.vars, "grevlex", sys.polys);
      expect(mm).toEqual(ref);
      expect(stats.primes).toBeGreaterThan(2);
      expect(stats.proofMs).toBeGreaterThanOrEqual(0);
      expect(stats.failed).toBeUndefined();
    }
  });

  it("declines what it cannot prove (cyclic-5: the homogenised ideal is not saturated; unit ideal) and method 'f4' still answers through the traced path", () => {
    const c5 = run(cyclic(5).vars, "grevlex", cyclic(5).polys);
    expect(c5.mm).toBeNull();
    expect(c5.stats.failed).toBe("hilbert");
    const R = new PolynomialRing(cyclic(5).vars, QQ, "grevlex");
    expect(groebnerBasis(cyclic(5).polys.map((s) => R.parse(s)), { method: "f4" }).map((g) => R.format(g))).toEqual(c5.ref);
    const unit = run(["x", "y"], "grevlex", ["x*y - 1", "x^2 - 1/3", "y - 5"]);
    expect(unit.ref).toEqual(["1"]);
    const U = new PolynomialRing(["x", "y"], QQ, "grevlex");
    expect(groebnerBasis(["x*y - 1", "x^2 - 1/3", "y - 5"].map((s) => U.parse(s)), { method: "f4" }).map((g) => U.format(g))).toEqual(["1"]);
  });

  it("takes step 3's h-free leads from the growth check's basis of F^h at the same prime, and uses them", () => {
    const R = new PolynomialRing(katsura(4).vars, QQ, "grevlex");
    const F = katsura(4).polys.map((s) => R.parse(s));
    const p = firstLiftPrime(F);
    const growth = homogenisedGrowth(homogenise(F).polys, new Limits(), p)!;
    expect(growth.saturated).toBe(true); // katsura-n: <F^h> is saturated
    const ref = groebnerBasis(F, { method: "buchberger" }).map((g) => R.format(g));
    const seeded = multiModularGroebnerQQ(F, new Limits(), { hFreeLeads: { p, leads: growth.hFreeLeads } });
    expect(seeded?.map((g) => R.format(g))).toEqual(ref);
    // Leads that cover nothing make step 3 fail: the seeded leads are the ones checked.
    const stats = fresh();
    expect(multiModularGroebnerQQ(F, new Limits(), { stats, hFreeLeads: { p, leads: [] } })).toBeNull();
    expect(stats.failed).toBe("hilbert");
  });

  it("reports which prime it is on", () => {
    const R = new PolynomialRing(katsura(4).vars, QQ, "grevlex");
    const seen: Progress[] = [];
    groebnerBasis(katsura(4).polys.map((s) => R.parse(s)), { method: "f4", onProgress: (p) => seen.push(p) });
    const primes = seen.filter((p) => p.prime !== undefined).map((p) => p.prime!);
    expect(Math.min(...primes)).toBe(1);
    expect(Math.max(...primes)).toBeGreaterThan(2);
    expect(seen.every((p) => p.primes === undefined || p.primes >= p.prime!)).toBe(true);
  });

  it("stops at the deadline, on cancellation and on the basis-size budget", () => {
    const R = new PolynomialRing(katsura(5).vars, QQ, "grevlex");
    const polys = katsura(5).polys.map((s) => R.parse(s));
    const code = (f: () => unknown) => { try { f(); return "none"; } catch (e) { expect(e).toBeInstanceOf(AlgebraError); return (e as AlgebraError).code; } };
    expect(code(() => groebnerBasis(polys, { method: "f4", deadline: Date.now() - 1 }))).toBe("timeout");
    const ac = new AbortController();
    expect(code(() => groebnerBasis(polys, { method: "f4", signal: ac.signal, onProgress: (p) => { if (p.prime === 2) ac.abort(); } }))).toBe("cancelled");
    expect(code(() => groebnerBasis(polys, { method: "f4", maxBasisSize: 4 }))).toBe("budget");
  });
});

/**
 * Lex and block orders through I^h: the reduced basis of I^h in >_h lifted from the homogenised
 * grevlex basis R^h and proven by Hilbert series (no S-pairs), then h = 1 and inter-reduction.
 * Compared with the reference implementation's basis in the order itself; wrong candidates must
 * fail the proof, each for its own reason.
 */
describe("the Hilbert-series proof through I^h (lex and block orders)", () => {
  function viaSeries(vars: string[], order: string, polys: string[]) {
    const R = new PolynomialRing(vars, QQ, order);
    const F = polys.map((s) => R.parse(s));
    const grevlex = R.withOrder("grevlex");
    const G = groebnerBasis(F.map((f) => grevlex.parse(R.format(f))), { method: "buchberger" });
    const Rh = homogeniseInto(G, orderWithH(R));
    const stats = fresh();
    const Gh = multiModularGroebnerQQ(Rh.polys, new Limits(), { reference: G, series: true, primeLimit: 2 ** 26, stats });
    return { R, F, G, Rh, Gh, stats };
  }

  const orders = ["lex", "lex(1), grevlex(2)", "lex(2), grevlex(1)", "grevlex(1), lex(2)"];
  for (let seed = 1; seed <= 8; seed++) {
    const order = orders[seed % orders.length];
    it(`random ideal ${seed} in ${order} (fractions${seed % 3 === 0 ? ", 30-digit coefficients" : ""}) equals Buchberger's basis in the order`, () => {
      const s = randomIdeal(seed * 37, {
        nvars: 3, npolys: 2, maxDegree: 2, minTerms: 2, minDegree: 1, maxTerms: 3, coeffBound: seed % 3 === 0 ? 10n ** 30n : 99n, fractions: true,
      });
      const { R, F, Gh, stats } = viaSeries(s.vars, order, s.polys);
      expect(stats.failed).toBeUndefined();
      expect(Gh).not.toBeNull();
      const ours = dehomogenisedBasis(Gh!, R, new Limits()).map((g) => R.format(g));
      expect(ours).toEqual(groebnerBasis(F, { method: "buchberger" }).map((g) => R.format(g)));
    });
  }

  it("rejects a missing element (series), a wrong coefficient (membership) and a non-homogeneous element", () => {
    // A parametric steady state: x, y eliminated above the constant k (x + y = 1 conserved).
    const { Rh, G, Gh } = viaSeries(["x", "y", "k"], "lex(2), grevlex(1)", ["k*x^2 - y", "x + y - 1", "x*y*k - 2*y^2"]);
    expect(Gh).not.toBeNull();
    const input = multiModularInput(Rh.polys, G, 2 ** 26, true);
    const H = Rh.ring;
    const proves = (basis: string[]) => {
      const cand: LiftCandidate = { basis, primes: [], unlucky: [], checkedWith: 0 };
      return proofBatches(input, cand, 2).map((b) => proveBatch(input, cand, b, new Limits()));
    };
    const good = Gh!.map((g) => H.format(g));
    expect(proves(good).every((o) => o.ok)).toBe(true);
    expect(proves(good.slice(1))[0]).toEqual({ ok: false, failed: "series" });
    // A changed tail coefficient keeps the leading monomials (so the series) but leaves I^h.
    const last = Gh!.length - 1, g = Gh![last];
    const bent = H.format({ ...g, coeffs: g.coeffs.map((c, t) => (t === g.coeffs.length - 1 ? { num: c.num + 1n, den: c.den } : c)) });
    expect(proves([...good.slice(0, last), bent]).some((o) => !o.ok)).toBe(true);
    // The largest element plus one of another degree: same leading monomial, still in I^h, not homogeneous.
    const low = Gh!.findIndex((x) => x.exps[0] !== g.exps[0]);
    expect(low).toBeGreaterThanOrEqual(0);
    const mixed = H.format(H.parse(`${good[last]} + (${good[low]})`));
    expect(H.parse(mixed).exps.slice(0, H.stride)).toEqual(g.exps.slice(0, H.stride));
    expect(proves([...good.slice(0, last), mixed])[0]).toEqual({ ok: false, failed: "series" });
  });

  it("needs a reference free of h", () => {
    const R = new PolynomialRing(["x", "y", "h"], QQ, "lex(2), lex(1)");
    expect(() => multiModularInput([R.parse("x*h - y^2")], [R.withOrder("grevlex").parse("x*h - y")], 2 ** 26, true)).toThrow(/free of the last variable/);
  });
});
