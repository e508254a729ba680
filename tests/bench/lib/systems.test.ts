import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { massActionRhs } from "../../../bench/lib/mass-action";
import { parsePoly } from "../../../bench/lib/parse-poly";
import { canonical, polyAdd, type Poly } from "../../../bench/lib/poly";
import { q } from "../../../bench/lib/rational";
import { formatSystemFile } from "../../../bench/lib/system-file";
import {
  cyclic,
  katsura,
  phosphorylationOneSite,
  phosphorylationTwoSite,
  phosphorylationTwoSiteSymbolic,
  selectSystems,
  standardSystems,
} from "../../../bench/lib/systems";

const text = (polys: readonly Poly[], vars: readonly string[]) => polys.map((p) => canonical(p, vars, "grevlex"));
const degree = (p: Poly) => Math.max(...[...p.values()].map((t) => t.exps.reduce((s, e) => s + e, 0)));

describe("cyclic-n (Björck and Fröberg, J. Symbolic Computation 12, 1991; recalled from memory)", () => {
  it("cyclic-3 is x+y+z, xy+yz+zx, xyz-1", () => {
    const s = cyclic(3);
    expect(s.vars).toEqual(["x0", "x1", "x2"]);
    expect(text(s.polys, s.vars)).toEqual(["x0 + x1 + x2", "x0*x1 + x0*x2 + x1*x2", "x0*x1*x2 - 1"]);
  });
  it("cyclic-n has n unknowns, n equations of degrees 1..n, each of the first n-1 with n terms", () => {
    for (const n of [4, 5, 6]) {
      const s = cyclic(n);
      expect(s.vars).toHaveLength(n);
      expect(s.polys.map(degree)).toEqual(Array.from({ length: n }, (_, i) => i + 1));
      expect(s.polys.slice(0, -1).every((p) => p.size === n)).toBe(true);
    }
  });
});

describe("katsura-n (Katsura et al., Cell Biophysics 11, 1987; PoSSo form recalled from memory)", () => {
  it("katsura-2 is u0+2u1+2u2-1, u0^2+2u1^2+2u2^2-u0, 2u0u1+2u1u2-u1", () => {
    const s = katsura(2);
    expect(text(s.polys, s.vars)).toEqual([
      "x0 + 2*x1 + 2*x2 - 1",
      "x0^2 + 2*x1^2 + 2*x2^2 - x0",
      "2*x0*x1 + 2*x1*x2 - x1",
    ]);
  });
  it("katsura-n has n+1 unknowns and n+1 equations: one linear, n quadratic (Bézout bound 2^n)", () => {
    for (const n of [3, 4, 5, 6]) {
      const s = katsura(n);
      expect(s.vars).toHaveLength(n + 1);
      expect(s.polys.map(degree)).toEqual([1, ...Array<number>(n).fill(2)]);
    }
  });
});

describe("phosphorylation steady-state ideals", () => {
  it("mass action for S + E <-> C -> P + E conserves E + C (Michaelis–Menten mechanism)", () => {
    const species = ["S", "E", "C", "P"];
    const rhs = massActionRhs(
      [
        { reactants: { S: 1, E: 1 }, products: { C: 1 }, rate: q(2n) },
        { reactants: { C: 1 }, products: { S: 1, E: 1 }, rate: q(1n) },
        { reactants: { C: 1 }, products: { P: 1, E: 1 }, rate: q(3n) },
      ],
      species,
    );
    expect(text(rhs, species)).toEqual(["-2*S*E + C", "-2*S*E + 4*C", "2*S*E - 4*C", "3*C"]);
    expect(polyAdd(rhs[1], rhs[2]).size).toBe(0);
  });
  it("symbolic rate constants enter as variables: -k*A*B for A + B -> C at rate k", () => {
    const vars = ["A", "B", "C", "k"];
    const rhs = massActionRhs([{ reactants: { A: 1, B: 1 }, products: { C: 1 }, rate: "k" }], vars);
    expect(text(rhs, vars)).toEqual(["-A*B*k", "-A*B*k", "A*B*k", "0"]);
  });
  it("two-site symbolic: 9 species and 15 parameters (k1..k12, three totals) in lex(9), grevlex(15)", () => {
    const s = phosphorylationTwoSiteSymbolic();
    expect(s.vars).toHaveLength(24);
    expect(s.polys).toHaveLength(9);
    expect(canonical(s.polys[0], s.vars, "grevlex")).toBe("E*S0*k1 - ES0*k2 - ES0*k3");
    expect(canonical(s.polys[6], s.vars, "grevlex")).toBe("ES0 + ES1 + E - Etot");
    const file = standardSystems().find((x) => x.name === "phospho-2site-symbolic")!;
    expect(file.file.order).toBe("lex(9), grevlex(15)");
    expect(file.extra).toBe(true);
  });
  it("one-site: 6 species, 3 ODEs plus 3 conservation laws", () => {
    const s = phosphorylationOneSite();
    expect(s.vars).toHaveLength(6);
    expect(s.polys.map(degree)).toEqual([2, 2, 2, 1, 1, 1]);
    expect(canonical(s.polys[3], s.vars, "grevlex")).toBe("ES0 + E - 1/2");
  });
  it("two-site: 9 species, 6 ODEs plus 3 conservation laws, total substrate over 7 species", () => {
    const s = phosphorylationTwoSite();
    expect(s.vars).toHaveLength(9);
    expect(s.polys.map(degree)).toEqual([2, 2, 2, 2, 2, 2, 1, 1, 1]);
    expect(s.polys[8].size).toBe(8);
    // dES0/dt = 2*E*S0 - (1 + 3)*ES0 with the invented constants 2, 1, 3.
    expect(canonical(s.polys[0], s.vars, "grevlex")).toBe("2*E*S0 - 4*ES0");
  });
});

describe("the catalogue", () => {
  it("starts with the start-up baseline and has unique names", () => {
    const all = standardSystems();
    expect(all[0].name).toBe("startup");
    expect(all[0].file.polys).toEqual(["x - 1"]);
    expect(new Set(all.map((s) => s.name)).size).toBe(all.length);
    expect(all.filter((s) => s.quick).map((s) => s.name)).not.toContain("katsura-6");
  });
});

describe("selectSystems", () => {
  const all = standardSystems();
  it("runs everything but the extras by default, and the quick set with --quick", () => {
    const names = selectSystems(all, undefined, false).map((s) => s.name);
    expect(names).toContain("cyclic-6");
    expect(names).not.toContain("phospho-2site-symbolic");
    const quick = selectSystems(all, undefined, true).map((s) => s.name);
    expect(quick).toContain("katsura-4");
    expect(quick).not.toContain("katsura-5");
  });
  it("runs named systems, extras included, and rejects unknown names", () => {
    expect(selectSystems(all, ["phospho-2site-symbolic", "katsura-3"], false).map((s) => s.name)).toEqual(["katsura-3", "phospho-2site-symbolic"]);
    expect(() => selectSystems(all, ["katsura-9"], false)).toThrow(/katsura-9/);
  });
});

describe("bench/systems files", () => {
  it("are exactly what the generator prints and parse back to the same polynomials", () => {
    for (const s of standardSystems()) {
      const file = readFileSync(new URL(`../../../bench/systems/${s.name}.txt`, import.meta.url), "utf8");
      expect(file).toBe(formatSystemFile(s.file));
      for (const p of s.file.polys) expect(canonical(parsePoly(p, s.file.vars), s.file.vars, "grevlex")).toBe(p);
    }
  });
});
