import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { computeParametrisation, kineticsRing, steadyStateSystem, totalsFromInitial } from "@domain/steady-state/index";
import { Budget } from "@domain/steady-state/budget";
import { floatSystem } from "@domain/steady-state/float-eval";
import { multistartPositiveSolutions, seededRandom } from "@domain/numeric/multistart";
import { TWO_SITE_BISTABLE, TWO_SITE_SYMBOLIC, analyseCsv, evaluateExpression, fixture, initial } from "./helpers";

/**
 * Steady-state results checked against published statements, one network per block; every check
 * names its source. "By hand" values are derived in the comment beside them.
 */

describe("deficiency zero theorem (Feinberg, Chem. Eng. Sci. 42, 1987, Thm 4.1; Horn & Jackson, Arch. Rational Mech. Anal. 47, 1972)", () => {
  it("triangle A <-> B <-> C <-> A (δ = 0, weakly reversible): exactly one positive steady state in the class, and it is stable", () => {
    const csv = `reaction,rate,reverse_rate,rate_value,reverse_rate_value
A <-> B,k1,k2,1,2
B <-> C,k3,k4,3,1
C <-> A,k5,k6,1,5
`;
    const r = analyseCsv(csv, { initial: initial("A=1") });
    expect(r.structure.deficiency).toBe(0);
    expect(r.structure.weaklyReversible).toBe(true);
    expect(r.steadyStates).toHaveLength(1);
    expect(r.steadyStates![0].stable).toBe(true);
    const c = r.steadyStates![0].concentrations;
    expect(c.A + c.B + c.C).toBeCloseTo(1, 12);
  });

  it("cycle A -> B -> C -> A (δ = 0, weakly reversible): the unique state has equal fluxes, A = 36/11, B = 18/11, C = 12/11 for k = 1, 2, 3 and total 6 (by hand)", () => {
    const csv = `reaction,rate,rate_value
A -> B,k1,1
B -> C,k2,2
C -> A,k3,3
`;
    const r = analyseCsv(csv, { initial: initial("A=6") });
    expect(r.steadyStates).toHaveLength(1);
    const c = r.steadyStates![0].concentrations;
    expect(c.A).toBeCloseTo(36 / 11, 13);
    expect(c.B).toBeCloseTo(18 / 11, 13);
    expect(c.C).toBeCloseTo(12 / 11, 13);
    expect(r.steadyStates![0].verdict).toBe("stable");
  });

  it("A + B <-> C (δ = 0, reversible) with k1 = 2, k2 = 3, A(0) = 1, B(0) = 2: the one state solves 2C² − 9C + 4 = 0, C = 1/2 (by hand)", () => {
    const csv = `reaction,rate,reverse_rate,rate_value,reverse_rate_value
A + B <-> C,k1,k2,2,3
`;
    const r = analyseCsv(csv, { initial: initial("A=1,B=2") });
    expect(r.steadyStates).toHaveLength(1);
    const c = r.steadyStates![0].concentrations;
    expect(c.C).toBeCloseTo(0.5, 13);
    expect(c.A).toBeCloseTo(0.5, 13);
    expect(c.B).toBeCloseTo(1.5, 13);
    expect(r.steadyStates![0].stable).toBe(true);
  });

  it("inflow/outflow 0 <-> X (δ = 0, weakly reversible): one stable state X = k1/k2 — and ACR in X", () => {
    const r = analyseCsv("reaction,rate,reverse_rate,rate_value,reverse_rate_value\n0 <-> X,k1,k2,3,2\n", { initial: new Map() });
    expect(r.steadyStates!.map((s) => s.concentrations.X)).toEqual([1.5]);
    expect(r.steadyStates![0].eigenvalues[0].re).toBeCloseTo(-2, 12);
    expect(r.acr).toEqual([{ species: "X", value: "3/2" }]);
  });

  it("A -> B (δ = 0, not weakly reversible): no positive steady state", () => {
    const r = analyseCsv("reaction,rate\nA -> B,k\n");
    expect(r.structure.deficiency).toBe(0);
    expect(r.positiveSteadyStatesExist).toBe(false);
    expect(r.parametrisation).toBeNull();
  });

  it("Michaelis–Menten E + S <-> C -> E + P (δ = 0, not weakly reversible; fixture): no positive steady state for any rate constants", () => {
    const r = analyseCsv(fixture("michaelis-menten"), { initial: initial("E=1,S=1") });
    expect(r.structure.deficiency).toBe(0);
    expect(r.positiveSteadyStatesExist).toBe(false);
    // Symbolic rates: no numeric steady states, and the analysis says why.
    expect(r.warnings.some((w) => w.includes("No positive steady state"))).toBe(true);
  });
});

describe("quasi-steady-state enzyme kinetics (Briggs & Haldane, Biochem. J. 19, 1925)", () => {
  // An open version of E + S <-> C -> E + P (substrate supplied, product removed) has positive steady states;
  // at them C·(k−1 + k2) = k1·E·S, i.e. C = E_T·S/(K_M + S) with E_T = E + C and K_M = (k−1 + k2)/k1.
  const csv = `reaction,rate,reverse_rate
0 -> S,k0,
E + S <-> C,k1,km1
C -> E + P,k2,
P -> 0,k3,
`;
  it("the parametrisation satisfies E·S = K_M·C with C = k0/k2 (the catalytic flux k2·C balances the inflow k0)", () => {
    const r = analyseCsv(csv, { skipFullBasis: true });
    expect(r.parametrisation).not.toBeNull();
    const scope = { E: 0.7, k0: 1.3, k1: 2.1, km1: 0.4, k2: 3.3, k3: 0.8 };
    const c = evaluateExpression(r.parametrisation!.expressions.C, scope);
    const s = evaluateExpression(r.parametrisation!.expressions.S, scope);
    expect(c).toBeCloseTo(scope.k0 / scope.k2, 13);
    expect(scope.E * s).toBeCloseTo(((scope.km1 + scope.k2) / scope.k1) * c, 13);
    expect(r.parametrisation!.positive).toBe(true);
    // C is therefore absolutely robust in this open mechanism.
    expect(r.acr.map((a) => a.species)).toContain("C");
  });

  it("the Briggs–Haldane relations hold exactly at every positive steady state (ideal membership)", () => {
    const r = analyseCsv(csv, {
      skipFullBasis: true,
      relations: ["C*(km1 + k2) - k1*E*S", "k2*C*(k1*S + km1 + k2) - k2*k1*S*(E + C)", "C*k1 - E*S"],
    });
    expect(r.relations[0].inIdeal).toBe(true);
    expect(r.relations[1].inIdeal).toBe(true);
    // A wrong formula (K_M = 1) is rejected, with a non-zero remainder.
    expect(r.relations[2].inIdeal).toBe(false);
    expect(r.relations[2].vanishes).toBe(false);
    expect(r.relations[2].remainder).not.toBe("0");
  });
});

describe("absolute concentration robustness (Shinar & Feinberg, Science 327, 2010)", () => {
  it("A + B -> 2B, B -> A: A = k2/k1 at every positive steady state (the paper's introductory example — recalled from memory)", () => {
    const r = analyseCsv("reaction,rate\nA + B -> 2B,k1\nB -> A,k2\n");
    expect(r.acr).toEqual([{ species: "A", value: "k2/k1" }]);
    expect(r.parametrisation!.free).toEqual(["B"]);
  });

  it("the EnvZ–OmpR-type network (fixture, deficiency one) has ACR in Yp only, Yp = k5·(k10 + k11)/(k9·k11) (flux balances by hand)", () => {
    const r = analyseCsv(fixture("shinar-feinberg-acr"), { skipFullBasis: true });
    expect(r.structure.deficiency).toBe(1);
    expect(r.acr.map((a) => a.species)).toEqual(["Yp"]);
    const scope = { k5: 1.7, k9: 0.3, k10: 2.9, k11: 1.1 };
    expect(evaluateExpression(r.acr[0].value, scope)).toBeCloseTo((scope.k5 * (scope.k10 + scope.k11)) / (scope.k9 * scope.k11), 13);
  });

  it("numerically: two different classes of the EnvZ–OmpR network share the value of Yp", () => {
    const values = [1, 2, 3, 1, 2, 4, 1, 2, 3, 1, 2];
    const rows = fixture("shinar-feinberg-acr").split("\n").filter((l) => l && !l.startsWith("#"));
    let v = 0;
    const csv = [
      "reaction,rate,reverse_rate,rate_value,reverse_rate_value",
      ...rows.slice(1).map((row) => {
        const [reaction, rate, reverse] = row.split(",");
        const fwd = values[v++];
        const rev = reverse ? values[v++] : "";
        return `${reaction},${rate},${reverse},${fwd},${rev}`;
      }),
    ].join("\n");
    const a = analyseCsv(csv, { initial: initial("XD=2,Y=3"), skipFullBasis: true });
    const b = analyseCsv(csv, { initial: initial("XD=5,Y=7"), skipFullBasis: true });
    expect(a.steadyStates).toHaveLength(1);
    expect(b.steadyStates).toHaveLength(1);
    // k5 = 2, k9 = 3, k10 = 1, k11 = 2 in this assignment: Yp = 2·(1 + 2)/(3·2) = 1.
    expect(a.steadyStates![0].concentrations.Yp).toBeCloseTo(1, 12);
    expect(b.steadyStates![0].concentrations.Yp).toBeCloseTo(1, 12);
    expect(a.steadyStates![0].concentrations.Y).not.toBeCloseTo(b.steadyStates![0].concentrations.Y, 3);
  });
});

describe("two-site distributive phosphorylation (Wang & Sontag, J. Math. Biol. 57, 2008; Markevich, Hoek & Kholodenko, J. Cell Biol. 164, 2004; Thomson & Gunawardena, Nature 460, 2009)", () => {
  it("with all 12 rate constants symbolic, linear elimination gives a positive rational parametrisation by three free species (Thomson & Gunawardena)", () => {
    const network = parseNetworkCsv(TWO_SITE_SYMBOLIC);
    const kin = kineticsRing(network, { speciesOrder: ["ES0", "ES1", "FS2", "FS1", "S1", "S2", "S0", "E", "F"] });
    const sys = steadyStateSystem(network, kin, [], null);
    const t0 = performance.now();
    const p = computeParametrisation(kin, sys.keptRows.map((i) => sys.odes[i]), new Budget({ timeoutMs: 60_000 }));
    const ms = performance.now() - t0;
    expect(p.parametrisation).not.toBeNull();
    expect(p.parametrisation!.free).toEqual(["S0", "E", "F"]);
    expect(p.parametrisation!.positive).toBe(true);
    // Not a timing test (that is the benchmark's job); a generous bound catches a pathological regression.
    expect(ms).toBeLessThan(30_000);
    // Substituting the parametrisation makes every ODE vanish: check at random positive points.
    const ode = floatSystem(sys.odes, kin.species.map((_, i) => i));
    const random = seededRandom(11);
    for (let trial = 0; trial < 5; trial++) {
      // Random positive free species and rate constants; the other species come from the parametrisation.
      const x = new Array<number>(kin.ring.n).fill(0).map(() => 0.2 + random() * 3);
      const byName = (s: string) => kin.ring.indexOf(s);
      for (const e of p.parametrisation!.expressions) {
        const num = e.expression.num, den = e.expression.den;
        const val = (q: typeof num) => floatSystem([q], []).values(x)[0];
        x[byName(e.species)] = val(num) / val(den);
      }
      const rhs = ode.values(x);
      const scale = Math.max(...x.map(Math.abs)) ** 3 * 10;
      for (const v of rhs) expect(Math.abs(v)).toBeLessThan(1e-10 * scale);
    }
  });

  it("the deficiency is 2 (10 complexes, 2 linkage classes, rank 6 — by hand; recalled from memory as the known value)", () => {
    const r = analyseCsv(fixture("two-site-phosphorylation"), { skipFullBasis: true });
    expect(r.structure.deficiency).toBe(2);
    expect(r.parametrisation?.positive).toBe(true);
  });

  it("is multistationary: for chosen constants the class has 3 positive steady states, 2 stable and 1 unstable, as multistart Newton confirms", () => {
    const r = analyseCsv(TWO_SITE_BISTABLE, { initial: initial("S0=2,E=1,F=1/20"), skipFullBasis: true });
    expect(r.steadyStates).toHaveLength(3);
    expect(r.steadyStates!.map((s) => s.verdict)).toEqual(["stable", "unstable", "stable"]);
    for (const s of r.steadyStates!) {
      expect(s.residual).toBeLessThan(1e-9);
      const c = s.concentrations;
      expect(c.S0 + c.S1 + c.S2 + c.ES0 + c.ES1 + c.FS1 + c.FS2).toBeCloseTo(2, 12);
      expect(c.E + c.ES0 + c.ES1).toBeCloseTo(1, 12);
      expect(c.F + c.FS1 + c.FS2).toBeCloseTo(0.05, 12);
    }
    // Independent check: dense multistart Newton on the square system (kept ODE rows + conservation).
    const network = parseNetworkCsv(TWO_SITE_BISTABLE);
    const kin = kineticsRing(network);
    const laws = r.structure.conservationLaws.map((law) => network.species.map((s) => BigInt(law[s] ?? 0)));
    const sys = steadyStateSystem(network, kin, laws, totalsFromInitial(laws, network.species, initial("S0=2,E=1,F=1/20")));
    const f = floatSystem(sys.equations, kin.species.map((_, i) => i));
    const found = multistartPositiveSolutions((x) => ({ f: f.values(x), jacobian: f.jacobian(x) }), {
      low: kin.species.map(() => 1e-5),
      high: kin.species.map(() => 2),
      starts: 400,
      seed: 3,
    });
    expect(found).toHaveLength(3);
    for (const x of found) {
      const match = r.steadyStates!.some((s) => kin.species.every((sp, i) => Math.abs(s.concentrations[sp] - x[i]) <= 1e-6 * Math.max(1e-9, x[i])));
      expect(match).toBe(true);
    }
  });
});

describe("cubic autocatalysis, a Schlögl-type one-species network (Schlögl, Z. Physik 253, 1972; fixture, constants chosen so dX/dt = −(X−1)(X−2)(X−3))", () => {
  it("has exactly three positive steady states 1, 2, 3: stable, unstable, stable with eigenvalues −2, 1, −2", () => {
    const r = analyseCsv(fixture("cubic-autocatalysis"), { initial: new Map() });
    expect(r.steadyStates!.map((s) => s.concentrations.X)).toEqual([1, 2, 3]);
    expect(r.steadyStates!.map((s) => s.verdict)).toEqual(["stable", "unstable", "stable"]);
    expect(r.steadyStates!.map((s) => s.eigenvalues[0].re)).toEqual([-2, 1, -2]);
    expect(r.groebnerBasis).toEqual(["X^3 - 6*X^2 + 11*X - 6"]);
    expect(r.rootsNeeded).toEqual([{ species: "X", polynomial: "X^3 - 6*X^2 + 11*X - 6", degree: 3 }]);
  });
});
