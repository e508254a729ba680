import { describe, expect, it } from "vitest";
import { AlgebraError, PolynomialRing, QQ, add, assertInvariants, divide, equals, isZeroPoly, mul, primeField, zeroPoly } from "@domain/algebra/index";
import type { Field, Polynomial } from "@domain/algebra/index";
import { prng, randInt, randomPolyText } from "../../fixtures/algebra/systems";

const L = new PolynomialRing(["x", "y"], QQ, "lex");
const run = (f: string, gs: string[]) => {
  const { quotients, remainder } = divide(L.parse(f), gs.map((g) => L.parse(g)));
  return { q: quotients.map((q) => L.format(q)), r: L.format(remainder) };
};

// Cox, Little, O'Shea, "Ideals, Varieties, and Algorithms", 4th ed. 2015, ch. 2 §3 (lex, x > y).
// Quotients and remainders recalled from memory; each also satisfies the division identity below.
describe("division by an ordered list — textbook examples", () => {
  it("Example 1: x*y^2 + 1 by (x*y + 1, y + 1)", () => {
    expect(run("x*y^2 + 1", ["x*y + 1", "y + 1"])).toEqual({ q: ["y", "-1"], r: "2" });
  });
  it("Example 2: x^2*y + x*y^2 + y^2 by (x*y - 1, y^2 - 1)", () => {
    expect(run("x^2*y + x*y^2 + y^2", ["x*y - 1", "y^2 - 1"])).toEqual({ q: ["x + y", "1"], r: "x + y + 1" });
  });
  it("Example 4: the same with the divisors swapped gives a different remainder", () => {
    expect(run("x^2*y + x*y^2 + y^2", ["y^2 - 1", "x*y - 1"])).toEqual({ q: ["x + 1", "x"], r: "2*x + 1" });
  });
  it("Example 5: x*y^2 - x by (x*y + 1, y^2 - 1) and by (y^2 - 1, x*y + 1)", () => {
    expect(run("x*y^2 - x", ["x*y + 1", "y^2 - 1"])).toEqual({ q: ["y", "0"], r: "-x - y" });
    expect(run("x*y^2 - x", ["y^2 - 1", "x*y + 1"])).toEqual({ q: ["x", "0"], r: "0" });
  });
  it("rejects the zero divisor", () => {
    expect(() => divide(L.parse("x"), [L.zero()])).toThrow(AlgebraError);
  });
});

function checkDivision<C>(f: Polynomial<C>, gs: Polynomial<C>[]) {
  const ring = f.ring, n = ring.n, S = ring.stride;
  const { quotients, remainder } = divide(f, gs);
  quotients.forEach(assertInvariants);
  assertInvariants(remainder);
  // Identity: f = Σ q_i g_i + r
  const sum = quotients.reduce((acc, q, i) => add(acc, mul(q, gs[i])), zeroPoly(ring));
  expect(equals(add(sum, remainder), f)).toBe(true);
  // Remainder property: no term of r divisible by any LT(g_i)
  for (let t = 0; t < remainder.coeffs.length; t++) {
    for (const g of gs) {
      let div = true;
      for (let k = 1; k <= n; k++) if (g.exps[k] > remainder.exps[t * S + k]) div = false;
      expect(div).toBe(false);
    }
  }
  // LM(q_i g_i) <= LM(f)
  quotients.forEach((q, i) => {
    if (isZeroPoly(q)) return;
    const prod = mul(q, gs[i]);
    expect(ring.cmp(prod.exps, 0, f.exps, 0)).toBeLessThanOrEqual(0);
  });
}

describe("division — property tests (seeded)", () => {
  const orders = ["lex", "grlex", "grevlex", "lex(1), grevlex(2)", "weighted(1,2,1,3)"];
  const fields: Field<unknown>[] = [QQ as Field<unknown>, primeField(32003) as Field<unknown>, primeField(2147483647) as Field<unknown>];
  it("identity, remainder property and degree bound hold", () => {
    const rnd = prng(31337);
    for (let t = 0; t < 150; t++) {
      const order = orders[t % orders.length];
      const nv = order.startsWith("weighted") ? 4 : order.includes("(") ? 3 : randInt(rnd, 2, 4);
      const vars = ["x", "y", "z", "w"].slice(0, nv);
      const R = new PolynomialRing(vars, fields[t % fields.length], order);
      const opts = { nvars: nv, npolys: 1, maxDegree: 3, maxTerms: 4, coeffBound: t % 2 ? 10n ** 20n : 9n, fractions: true };
      let f = R.parse(randomPolyText(rnd, vars, { ...opts, maxDegree: 6, maxTerms: 8 }));
      if (isZeroPoly(f)) f = R.one();
      const gs = Array.from({ length: randInt(rnd, 1, 4) }, () => R.parse(randomPolyText(rnd, vars, opts))).filter((g) => !isZeroPoly(g));
      if (gs.length === 0) continue;
      checkDivision(f, gs);
    }
  });
});
