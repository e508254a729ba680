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

  /**
   * Published worked examples of injectivity: Craciun & Feinberg, "Multiple equilibria in complex
   * chemical reaction networks: I. The injectivity property", SIAM J. Appl. Math. 65 (2005) 1526–1546,
   * Table 1.1, networks in a continuous flow stirred tank reactor (every species flows in and out).
   * Recalled from memory, not re-read: the table lists network (i) A + B ⇌ P, B + C ⇌ Q, C ⇌ 2A as
   * having the capacity for multiple equilibria and network (ii) A + B ⇌ P, B + C ⇌ Q, C + D ⇌ R,
   * D ⇌ 2A as not having it, their point being how delicately the answer depends on the structure.
   * Checked here without our engine as well: SymPy builds the mass-action Jacobian from the reaction
   * text itself and expands its determinant; one sign of all coefficients is the injectivity criterion
   * of the paper, mixed signs leave the question open.
   */
  it.skipIf(!existsSync(PYTHON))("Craciun & Feinberg 2005, Table 1.1 (ii): injective, so monostationary; (i): not injective (recalled from memory; SymPy checks the determinants)", () => {
    const open = (species: string[], rows: string[]) => [...rows, ...species.map((x) => `0 <-> ${x}`)];
    const cases = [
      { name: "(ii)", species: ["A", "B", "C", "D", "P", "Q", "R"], rows: open(["A", "B", "C", "D", "P", "Q", "R"], ["A + B <-> P", "B + C <-> Q", "C + D <-> R", "D <-> 2A"]) },
      { name: "(i)", species: ["A", "B", "C", "P", "Q"], rows: open(["A", "B", "C", "P", "Q"], ["A + B <-> P", "B + C <-> Q", "C <-> 2A"]) },
    ];
    const signsBySympy = (species: string[], rows: string[]) =>
      sympy(`
import json, re
from sympy import Symbol, Matrix, Poly, ZZ
from sympy.polys.matrices import DomainMatrix
species = ${JSON.stringify(species)}
rows = ${JSON.stringify(rows)}
def side(text):
    out = {}
    for term in text.split("+"):
        term = term.strip()
        if term == "0":
            continue
        m = re.fullmatch(r"([0-9]*) *([A-Za-z_][A-Za-z0-9_]*)", term)
        out[m.group(2)] = out.get(m.group(2), 0) + int(m.group(1) or 1)
    return out
x = {s: Symbol(s, positive=True) for s in species}
f = {s: 0 for s in species}
ks = []
for row in rows:
    left, right = (side(t) for t in row.split("<->"))
    for a, b in ((left, right), (right, left)):
        k = Symbol("k%d" % (len(ks) + 1), positive=True)
        ks.append(k)
        v = k
        for s, c in a.items():
            v *= x[s] ** c
        for s in species:
            f[s] += (b.get(s, 0) - a.get(s, 0)) * v
J = Matrix([[f[s].diff(x[t]) for t in species] for s in species])
gens = [x[s] for s in species] + ks
det = DomainMatrix.from_Matrix(J).convert_to(ZZ[tuple(gens)]).det()
print(json.dumps(sorted(set(1 if c > 0 else -1 for c in Poly(det.as_expr(), *gens).coeffs()))))
`) as number[];
    const [ii, i] = cases.map((c) => ({ ...c, net: parseNetworkCsv(`reaction\n${c.rows.join("\n")}\n`), signs: signsBySympy(c.species, c.rows) }));
    // (ii): every coefficient of det J has the sign (−1)^7 (seven species): injective, no two positive steady states.
    expect(ii.signs).toEqual([-1]);
    expect(injectivity(ii.net)).toMatchObject({ injective: true, sign: "negative" });
    const verdict = multistationarity(ii.net);
    expect(verdict.verdict).toBe("monostationary");
    expect(verdict.method).toBe("injectivity");
    // (i): both signs occur, so injectivity cannot rule out several steady states, and we do not claim it does.
    expect(i.signs).toEqual([-1, 1]);
    expect(injectivity(i.net).injective).toBe(false);
    expect(multistationarity(i.net).verdict).not.toBe("monostationary");
  });
});
