import { describe, expect, it } from "vitest";
import { PolynomialRing, QQ } from "@domain/algebra/index";
import type { Polynomial, Rational } from "@domain/algebra/index";
import { integerCoefficients, primeCoefficients } from "@domain/algebra/groebner/coefficients";
import type { EngineCoefficients } from "@domain/algebra/groebner/coefficients";
import { clearDenominators, toEngine } from "@domain/algebra/groebner/convert";
import { ReductionKernel, toReducer } from "@domain/algebra/groebner/reduce";
import type { EPoly } from "@domain/algebra/groebner/reduce";
import { RowKernel } from "@domain/algebra/groebner/row-kernel";
import { buchberger } from "@domain/algebra/groebner/buchberger";

// Block order with a parameter block, where the row layout is meant to pay.
const R = new PolynomialRing(["x", "y", "z", "a", "b"], QQ, [{ kind: "lex", size: 3 }, { kind: "grevlex", size: 2 }]);
const Z = (p: Polynomial<Rational>) => clearDenominators(toEngine(p));
const P = 32003;
const modP = (f: EPoly<bigint>): EPoly<number> => {
  const S = 6, coeffs: number[] = [], exps: number[] = [];
  f.coeffs.forEach((c, t) => {
    const r = Number(((c % BigInt(P)) + BigInt(P)) % BigInt(P));
    if (r !== 0) { coeffs.push(r); exps.push(...f.exps.subarray(t * S, t * S + S)); }
  });
  return { coeffs, exps: Int32Array.from(exps) };
};

function randomPolys(count: number, seed: number): Polynomial<Rational>[] {
  let s = seed >>> 0;
  const next = (m: number) => { s ^= s << 13; s >>>= 0; s ^= s >>> 17; s ^= s << 5; s >>>= 0; return s % m; };
  const vars = ["x", "y", "z", "a", "b"];
  return Array.from({ length: count }, () => {
    const terms = Array.from({ length: 3 + next(4) }, () => {
      const mon = vars.map((v) => (next(3) === 0 ? `*${v}^${1 + next(3)}` : "")).join("");
      return `${next(2) ? "-" : "+"} ${1 + next(9)}/${1 + next(4)}${mon}`;
    });
    return R.parse(terms.join(" ").replace(/^\+ /, ""));
  }).filter((p) => p.coeffs.length > 0);
}

const same = <C>(a: EPoly<C>, b: EPoly<C>) => {
  expect(a.coeffs).toEqual(b.coeffs);
  expect(Array.from(a.exps)).toEqual(Array.from(b.exps));
};

function compare<C>(K: EngineCoefficients<C>, polys: EPoly<C>[], normalize: boolean) {
  const merge = new ReductionKernel(K, R.n, R.cmp, () => {}, normalize);
  const rows = new RowKernel(K, R.n, R.cmp, () => {}, normalize);
  const reducers = polys.slice(0, 4).map((g) => toReducer(g, R.n));
  for (const f of polys.slice(4)) {
    for (const full of [true, false]) same(rows.reduce(f, reducers, full), merge.reduce(f, reducers, full));
  }
  // A forced first step (how Buchberger forms an S-polynomial), where the partner's head divides f's.
  const g = polys[0], f = polys[5];
  const lcmHead = { coeffs: f.coeffs, exps: f.exps.map((e, i) => e + g.exps[i % 6]) };
  same(rows.reduce(lcmHead, reducers, true, g), merge.reduce(lcmHead, reducers, true, g));
  expect(rows.steps).toBe(merge.steps);
}

describe("RowKernel (reduction by dense rows)", () => {
  const polys = randomPolys(16, 2024).map(Z);
  it("gives the merge kernel's normal forms, top reductions and step counts over Z (fraction-free)", () => {
    compare(integerCoefficients, polys, false);
    compare(integerCoefficients, polys, true);
  });
  it("does the same over Z/32003", () => {
    compare(primeCoefficients(P), polys.map(modP), true);
  });
  it("makes Buchberger's algorithm return the same reduced basis in a block order", () => {
    const F = ["x*a - y^2 + b", "y*b - z*a - 1", "z^2 - a*b + 2", "x*y*z - a^2"].map((p) => modP(Z(R.parse(p))));
    const K = primeCoefficients(P);
    const a = buchberger(F, K, R.n, R.cmp, { strategy: "sugar" });
    const b = buchberger(F, K, R.n, R.cmp, { strategy: "sugar", rows: true });
    expect(b.length).toBe(a.length);
    a.forEach((g, i) => same(b[i], g));
  });
});
