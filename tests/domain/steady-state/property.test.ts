import { describe, expect, it } from "vitest";
import { parseNetworkCsv } from "@domain/network/index";
import { seededRandom, multistartPositiveSolutions } from "@domain/numeric/multistart";
import { analyseNetwork, kineticsRing, steadyStateSystem, totalsFromInitial } from "@domain/steady-state/index";
import { floatSystem } from "@domain/steady-state/float-eval";
import { neg, parseRational, sign, type Rational } from "@domain/algebra/rational";
import { fromTerms, terms } from "@domain/algebra/index";

/**
 * Property tests on seeded random small networks (2–3 species, 2–4 reaction rows, molecularity ≤ 3,
 * small rational constants): every reported steady state satisfies the ODEs to 1e-9 and the
 * conservation totals, and a dense multistart Newton search on the same class finds no positive
 * steady state that the exact solver missed (common practice for validating solvers).
 */
const SPECIES = ["A", "B", "C"];
const abs = (r: Rational) => (sign(r) < 0 ? neg(r) : r);

function randomNetwork(random: () => number): { csv: string; initial: string } {
  const ns = 2 + Math.floor(random() * 2);
  const species = SPECIES.slice(0, ns);
  const complex = () => {
    const parts: string[] = [];
    let molecularity = 0;
    for (const s of species) {
      const c = Math.floor(random() * 3);
      if (c > 0 && molecularity + c <= 3) {
        parts.push(c === 1 ? s : `${c}${s}`);
        molecularity += c;
      }
    }
    return parts.length === 0 ? "0" : parts.join(" + ");
  };
  const value = () => ["1", "2", "3", "1/2", "5", "3/2"][Math.floor(random() * 6)];
  const rows: string[] = [];
  const count = 2 + Math.floor(random() * 3);
  let k = 1;
  while (rows.length < count) {
    const left = complex();
    const right = complex();
    if (left === right) continue;
    const reversible = random() < 0.5;
    rows.push(reversible ? `${left} <-> ${right},k${k++},k${k++},${value()},${value()}` : `${left} -> ${right},k${k++},,${value()},`);
  }
  const initial = species.map((s) => `${s}=${1 + Math.floor(random() * 3)}`).join(",");
  return { csv: `reaction,rate,reverse_rate,rate_value,reverse_rate_value\n${rows.join("\n")}\n`, initial };
}

const toInitial = (text: string) => new Map(text.split(",").map((e) => [e.split("=")[0], parseRational(e.split("=")[1])!] as const));

describe("random small networks", () => {
  it("steady states satisfy the ODEs and totals, and multistart Newton finds none that is missing", () => {
    const random = seededRandom(2026);
    let withStates = 0;
    let checked = 0;
    for (let trial = 0; trial < 40; trial++) {
      const { csv, initial } = randomNetwork(random);
      let network;
      try {
        network = parseNetworkCsv(csv);
      } catch {
        continue; // e.g. a species that appears on no side after simplification
      }
      const result = analyseNetwork(network, { initial: toInitial(initial), skipFullBasis: true, timeoutMs: 20_000 });
      if (result.steadyStates === null || result.warnings.some((w) => w.includes("continuum") || w.includes("not finished"))) continue;
      checked++;
      const kin = kineticsRing(network);
      const laws = result.structure.conservationLaws.map((law) => network.species.map((s) => BigInt(law[s] ?? 0)));
      const totals = totalsFromInitial(laws, network.species, toInitial(initial));
      const sys = steadyStateSystem(network, kin, laws, totals);
      const all = kin.species.map((_, i) => i);
      const odes = floatSystem(sys.odes, all);
      const square = floatSystem(sys.equations, all);
      const magnitudes = floatSystem(
        sys.equations.map((p) => fromTerms(p.ring, terms(p).map((t) => ({ coeff: abs(t.coeff), exponents: t.exponents })))),
        all,
      );
      for (const s of result.steadyStates) {
        const x = kin.species.map((sp) => s.concentrations[sp]);
        expect(x.every((v) => v > 0), csv).toBe(true);
        for (const v of odes.values(x)) expect(Math.abs(v), csv).toBeLessThan(1e-9);
        for (const v of square.values(x).slice(sys.keptRows.length)) expect(Math.abs(v), csv).toBeLessThan(1e-9);
      }
      if (result.steadyStates.length > 0) withStates++;
      const found = multistartPositiveSolutions((x) => ({ f: square.values(x), jacobian: square.jacobian(x) }), {
        low: kin.species.map(() => 1e-3),
        high: kin.species.map(() => 20),
        starts: 80,
        seed: trial + 1,
        residualTol: 1e-10,
        maxIterations: 60,
      });
      for (const x of found) {
        // Log-coordinate Newton can creep towards a boundary steady state (a species → 0) while the
        // absolute residual shrinks with the concentrations; a genuine root has a small residual
        // relative to the size of the terms that cancel.
        // It can also run off towards a solution at infinity (some species → ∞, others → 0).
        if (Math.max(...x) > 1e5 || Math.min(...x) < 1e-9) continue;
        const sizes = magnitudes.values(x);
        if (square.values(x).some((v, i) => Math.abs(v) > 1e-8 * sizes[i])) continue;
        const known = result.steadyStates.some((s) => kin.species.every((sp, i) => Math.abs(s.concentrations[sp] - x[i]) <= 1e-5 * Math.max(x[i], 1e-12)));
        expect(known, `${csv} initial ${initial}: Newton found ${x.join(", ")}`).toBe(true);
      }
    }
    expect(checked).toBeGreaterThanOrEqual(25);
    expect(withStates).toBeGreaterThanOrEqual(10);
  });
});
