import { execFileSync } from "node:child_process";
import { existsSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { parseRational, toNumber } from "@domain/algebra/rational";
import { analyseStructure, parseNetworkCsv, type Network } from "@domain/network/index";
import { injectivity, multistationarity } from "@domain/steady-state/multistationarity";
import { fixture } from "./helpers";

const PYTHON = "/usr/bin/python3";
const sympy = (script: string): unknown => JSON.parse(execFileSync(PYTHON, ["-c", script], { encoding: "utf8" }));

/** Float mass-action right-hand sides, written out here independently of the engine. */
function rhs(network: Network, rates: Record<string, string>, x: Record<string, number>): number[] {
  return network.species.map((s) =>
    network.reactions.reduce((acc, r) => {
      const d = (r.product[s] ?? 0) - (r.reactant[s] ?? 0);
      if (d === 0) return acc;
      const rate = toNumber(parseRational(rates[r.rate])!) * Object.entries(r.reactant).reduce((m, [t, e]) => m * x[t] ** e, 1);
      return acc + d * rate;
    }, 0),
  );
}

/** Checks a witness without the engine: each listed state is a steady state of the witness rates, in the witness class, and distinct. */
function checkWitness(network: Network, w: NonNullable<ReturnType<typeof multistationarity>["witness"]>) {
  expect(w.steadyStates.length).toBeGreaterThanOrEqual(2);
  const laws = analyseStructure(network).conservationLaws;
  for (const x of w.steadyStates) {
    const scale = Math.max(...Object.values(w.rates).map((v) => toNumber(parseRational(v)!))) * Math.max(1, ...Object.values(x)) ** 3;
    for (const v of rhs(network, w.rates, x)) expect(Math.abs(v)).toBeLessThan(1e-9 * scale);
    laws.forEach((law, i) => {
      const total = Object.entries(law).reduce((a, [s, c]) => a + c * x[s], 0);
      expect(total).toBeCloseTo(toNumber(parseRational(w.totals[`T${i + 1}`])!), 8);
    });
    for (const v of Object.values(x)) expect(v).toBeGreaterThan(0);
  }
  const first = network.species[0];
  const values = w.steadyStates.map((x) => x[first]).sort((a, b) => a - b);
  const distinct = w.steadyStates.some((x, i) => i > 0 && network.species.some((s) => Math.abs(x[s] - w.steadyStates[0][s]) > 1e-6 * Math.max(1, Math.abs(x[s]))));
  expect(distinct, `distinct states ${values.join(", ")}`).toBe(true);
}

const EDELSTEIN = `reaction,rate,reverse_rate
X <-> 2X,k1,k2
X + Y <-> Z,k3,k4
Z <-> Y,k5,k6
`;
const ONE_SITE = `reaction,rate,reverse_rate
S0 + K <-> S0K,a1,d1
S0K -> S1 + K,c1,
S1 + F <-> S1F,a2,d2
S1F -> S0 + F,c2,
`;
/** Deficiency 2, inflow and outflow of every species: not covered by the deficiency theorems. */
const INJECTIVE = `reaction,rate,reverse_rate
0 <-> A,f1,g1
0 <-> B,f2,g2
0 <-> C,f3,g3
A + B <-> C,k1,k2
2A <-> B,k3,k4
`;

describe("multistationarity", () => {
  it("one-species cubic switch (Schlögl-type, Z. Physik 253, 1972): multistationary with a witness of three states, counted again by SymPy", () => {
    const net = parseNetworkCsv(fixture("cubic-autocatalysis"));
    const r = multistationarity(net);
    expect(r.verdict).toBe("multistationary");
    checkWitness(net, r.witness!);
    if (!existsSync(PYTHON)) return;
    const k = r.witness!.rates;
    const n = sympy(`
import json
from sympy import symbols, Rational as R, real_roots, Poly
X = symbols("X")
f = R("${k.k1}") - R("${k.k2}")*X + R("${k.k3}")*X**2 - R("${k.k4}")*X**3
print(json.dumps(len([r for r in real_roots(Poly(f, X)) if r > 0])))
`) as number;
    expect(n).toBe(r.witness!.steadyStates.length);
  });

  it("Edelstein network (J. Theor. Biol. 29, 1970): multistationary for some constants; witness checked without the engine", () => {
    const net = parseNetworkCsv(EDELSTEIN);
    const r = multistationarity(net);
    expect(r.verdict).toBe("multistationary");
    expect(r.sources.join(" ")).toMatch(/Conradi/);
    checkWitness(net, r.witness!);
    expect(Object.keys(r.witness!.totals)).toEqual(["T1"]);
  });

  it("two-site distributive phosphorylation cycle: multistationary (Wang & Sontag, J. Math. Biol. 57, 2008; Conradi et al. 2017)", () => {
    const net = parseNetworkCsv(fixture("two-site-phosphorylation"));
    const r = multistationarity(net);
    expect(r.verdict).toBe("multistationary");
    checkWitness(net, r.witness!);
    expect(Object.keys(r.witness!.totals)).toHaveLength(3);
  });

  it("one-site phosphorylation cycle: monostationary (Wang & Sontag 2008; Conradi et al. 2017), here by injectivity", () => {
    const r = multistationarity(parseNetworkCsv(ONE_SITE));
    expect(r.verdict).toBe("monostationary");
    expect(r.method).toBe("injectivity");
    expect(r.witness).toBeUndefined();
    expect(r.assumptions.join(" ")).toMatch(/Mass-action/);
  });

  it("weakly reversible deficiency-zero triangle: monostationary by the deficiency zero theorem (Feinberg 1987)", () => {
    const r = multistationarity(parseNetworkCsv(fixture("triangle")));
    expect(r.verdict).toBe("monostationary");
    expect(r.method).toBe("deficiency zero theorem");
    expect(r.sources.join(" ")).toMatch(/Feinberg/);
  });

  it.skipIf(!existsSync(PYTHON))("injective networks: SymPy's det of the Jacobian with conservation rows has coefficients of one sign (Craciun & Feinberg 2005; Feliu & Wiuf 2012)", () => {
    const cases = [
      { csv: INJECTIVE, rows: "[[-g1 - k1*B - 4*k3*A, -k1*A + 2*k4, k2], [-k1*B + 2*k3*A, -g2 - k1*A - k4, k2], [k1*B, k1*A, -g3 - k2]]", vars: "A B C f1 g1 f2 g2 f3 g3 k1 k2 k3 k4" },
      // One-site cycle, species S0, K, S0K, S1, F, S1F; W in RREF has pivots S0, K, F: those rows replaced by W, by hand.
      {
        csv: ONE_SITE,
        rows: "[[1, 0, 1, 1, 0, 1], [0, 1, 1, 0, 0, 0], [a1*K, a1*S0, -d1 - c1, 0, 0, 0], [0, 0, c1, -a2*F, -a2*S1, d2], [0, 0, 0, 0, 1, 1], [0, 0, 0, a2*F, a2*S1, -d2 - c2]]",
        vars: "S0 K S0K S1 F S1F a1 d1 c1 a2 d2 c2",
      },
    ];
    for (const c of cases) {
      const net = parseNetworkCsv(c.csv);
      const ours = injectivity(net);
      const signs = sympy(`
import json
from sympy import symbols, Matrix, Poly, expand
${c.vars.replace(/ /g, ", ")} = symbols("${c.vars}")
d = Poly(expand(Matrix(${c.rows}).det()), *symbols("${c.vars}"))
print(json.dumps(sorted(set(1 if x > 0 else -1 for x in d.coeffs()))))
`) as number[];
      expect(signs).toHaveLength(1);
      expect(ours.injective).toBe(true);
      expect(ours.sign).toBe(signs[0] > 0 ? "positive" : "negative");
      expect(multistationarity(net).method).toBe("injectivity");
    }
  });
});
