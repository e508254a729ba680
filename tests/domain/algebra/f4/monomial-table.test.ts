import { describe, expect, it } from "vitest";
import { MonomialTable } from "@domain/algebra/f4/monomial-table";
import { makeComparator } from "@domain/algebra/order";

const mono = (T: MonomialTable, ...e: number[]) => T.intern(Int32Array.from([e.reduce((a, b) => a + b, 0), ...e]), 0);
const exps = (T: MonomialTable, id: number) => Array.from(T.exps.subarray(id * T.S + 1, id * T.S + T.S));

describe("MonomialTable", () => {
  it("interns each monomial once and multiplies, divides and takes lcms by id", () => {
    const T = new MonomialTable(3);
    const a = mono(T, 2, 1, 0), b = mono(T, 0, 1, 3);
    expect(mono(T, 2, 1, 0)).toBe(a);
    expect(exps(T, T.product(a, b))).toEqual([2, 2, 3]);
    expect(T.product(a, b)).toBe(mono(T, 2, 2, 3));
    expect(T.quotient(T.product(a, b), b)).toBe(a);
    expect(exps(T, T.lcm(a, b))).toEqual([2, 1, 3]);
    expect(T.degree(T.lcm(a, b))).toBe(6);
    expect(T.divides(a, T.product(a, b))).toBe(true);
    expect(T.divides(b, a)).toBe(false);
    expect(T.coprime(mono(T, 1, 0, 0), mono(T, 0, 0, 2))).toBe(true);
    expect(T.coprime(a, b)).toBe(false);
  });

  it("keeps ids and exponents through growth and rehashing (more monomials than the initial capacity)", () => {
    const T = new MonomialTable(4, 16);
    const ids: number[] = [];
    for (let i = 0; i < 9; i++) for (let j = 0; j < 9; j++) for (let k = 0; k < 9; k++) ids.push(mono(T, i, j, k, (i + j) % 3));
    expect(new Set(ids).size).toBe(729);
    let n = 0;
    for (let i = 0; i < 9; i++) for (let j = 0; j < 9; j++) for (let k = 0; k < 9; k++) {
      expect(mono(T, i, j, k, (i + j) % 3)).toBe(ids[n]);
      expect(exps(T, ids[n])).toEqual([i, j, k, (i + j) % 3]);
      n++;
    }
  });

  it("compares ids with the ring's comparator (grevlex: x*z < y^2, z^2 < x*y)", () => {
    const T = new MonomialTable(3);
    const c = T.comparator(makeComparator([{ kind: "grevlex" }], 3));
    expect(c(mono(T, 1, 0, 1), mono(T, 0, 2, 0))).toBeLessThan(0);
    expect(c(mono(T, 0, 0, 2), mono(T, 1, 1, 0))).toBeLessThan(0);
  });
});
