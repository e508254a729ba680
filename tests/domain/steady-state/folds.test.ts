import { execFileSync } from "node:child_process";
import { existsSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { parseRational } from "@domain/algebra/rational";
import { parseNetworkCsv } from "@domain/network/index";
import { foldScan, simpleRationalBetween } from "@domain/steady-state/folds";
import { TWO_SITE_BISTABLE, analyseCsv, fixture, initial } from "./helpers";

const q = (t: string) => parseRational(t)!;
const PYTHON = "/usr/bin/python3";
const sympy = (script: string): unknown => JSON.parse(execFileSync(PYTHON, ["-c", script], { encoding: "utf8" }));

/** Edelstein's network X <-> 2X, X + Y <-> Z, Z <-> Y (B. B. Edelstein, J. Theor. Biol. 29 (1970) 57–62), bistable for some constants; these were found by a search of T(X) for a non-monotone branch. */
const EDELSTEIN = `reaction,rate,reverse_rate,rate_value,reverse_rate_value
X <-> 2X,k1,k2,1/5,1/5
X + Y <-> Z,k3,k4,100,1/10
Z <-> Y,k5,k6,5,2
`;

describe("foldScan", () => {
  it("one-species cubic switch: folds at k1 = 6 ± 2√3/9 (by hand from the discriminant) with 1, 3, 1 steady states", () => {
    // dX/dt = k1 − 11X + 6X² − X³; disc_X(X³ − 6X² + 11X − k1) = −(27k1² − 324k1 + 968), roots 6 ± 2√3/9 (hand computation).
    const r = foldScan(parseNetworkCsv(fixture("cubic-autocatalysis")), { parameter: "k1", from: q("1"), to: q("10"), points: 11 });
    const byHand = [6 - (2 * Math.sqrt(3)) / 9, 6 + (2 * Math.sqrt(3)) / 9];
    expect(r.folds.map((f) => f.value)).toEqual(byHand.map((v) => Number(v.toPrecision(10))));
    r.folds.forEach((f, i) => {
      expect(f.interval[1] - f.interval[0]).toBeLessThan(1e-9);
      expect(f.interval[0]).toBeLessThanOrEqual(byHand[i] + 1e-15);
      expect(f.interval[1]).toBeGreaterThanOrEqual(byHand[i] - 1e-15);
    });
    expect(r.windows.map((w) => w.count)).toEqual([1, 3, 1]);
    // Inside the window every curve point has three states: stable, unstable, stable from low to high X.
    const inside = r.points.filter((p) => p.value > byHand[0] + 1e-3 && p.value < byHand[1] - 1e-3);
    expect(inside.length).toBeGreaterThan(2);
    for (const p of inside) expect(p.steadyStates.map((s) => s.stable)).toEqual([true, false, true]);
  });

  it.skipIf(!existsSync(PYTHON))("cubic switch: the fold intervals hold SymPy's real_roots of SymPy's discriminant", () => {
    const roots = sympy(`
import json
from sympy import symbols, discriminant, real_roots, Poly
x, k = symbols("x k")
d = discriminant(x**3 - 6*x**2 + 11*x - k, x)
print(json.dumps([float(r.evalf(30)) for r in real_roots(Poly(d, k))]))
`) as number[];
    const r = foldScan(parseNetworkCsv(fixture("cubic-autocatalysis")), { parameter: "k1", from: q("0"), to: q("20"), points: 3 });
    expect(r.folds).toHaveLength(roots.length);
    r.folds.forEach((f, i) => {
      expect(f.interval[0]).toBeLessThanOrEqual(roots[i] + 1e-12);
      expect(f.interval[1]).toBeGreaterThanOrEqual(roots[i] - 1e-12);
    });
  });

  it.skipIf(!existsSync(PYTHON))("Edelstein network, total of Y + Z varied: two folds among SymPy's discriminant roots, 1 / 3 / 1 states checked by SymPy", () => {
    const r = foldScan(parseNetworkCsv(EDELSTEIN), { parameter: "T1", from: q("0"), to: q("1/10"), points: 5 });
    expect(r.folds).toHaveLength(2);
    expect(r.windows.map((w) => w.count)).toEqual([1, 3, 1]);
    // SymPy alone: lex basis of the saturated system with T symbolic, eliminant in (Y, T), its discriminant's real roots;
    // and at a sample T in each window the positive solutions from the eliminant's real roots.
    const samples = r.windows.map((w) => (w.from + w.to) / 2);
    const out = sympy(`
import json
from sympy import symbols, groebner, discriminant, real_roots, Poly, Rational as R
X, Y, Z, T, t = symbols("X Y Z T t")
k1, k2, k3, k4, k5, k6 = R(1,5), R(1,5), 100, R(1,10), 5, 2
dX = k1*X - k2*X**2 - k3*X*Y + k4*Z
dY = -k3*X*Y + k4*Z + k5*Z - k6*Y
G = groebner([dX, dY, Y + Z - T, 1 - t*X*Y*Z*T], t, X, Z, Y, T, order="lex")
E = [g for g in G.exprs if g.free_symbols <= {Y, T} and Y in g.free_symbols][0]
disc = discriminant(Poly(E, Y), Y)
roots = [float(x) for x in real_roots(Poly(disc, T)) if x > 0]
counts = []
for s in ${JSON.stringify(samples)}:
    Ts = R(s).limit_denominator(10**12)
    n = 0
    for y in real_roots(Poly(E.subs(T, Ts), Y)):
        y = float(y)
        z = float(Ts) - y
        if y <= 0 or z <= 0: continue
        x = ((k4 + k5) * z - k6 * y) / (k3 * y)
        if x > 0: n += 1
    counts.append(n)
print(json.dumps({"roots": roots, "counts": counts}))
`) as { roots: number[]; counts: number[] };
    for (const f of r.folds) expect(out.roots.some((x) => x >= f.interval[0] - 1e-12 && x <= f.interval[1] + 1e-12)).toBe(true);
    expect(out.counts).toEqual([1, 3, 1]);
  });

  it("varies an initial concentration and reports conservation laws without totals as a located error", () => {
    const net = parseNetworkCsv(EDELSTEIN);
    const r = foldScan(net, { parameter: "Y", from: q("0"), to: q("1/10"), points: 3, initial: initial("Z=0") });
    expect(r.kind).toBe("initial");
    expect(r.windows.map((w) => w.count)).toEqual([1, 3, 1]);
    // The reason is data; its words name no command-line option (the web shows them too).
    expect(() => foldScan(net, { parameter: "k1", from: q("0"), to: q("1") })).toThrow(
      expect.objectContaining({ problem: { kind: "scan-totals-needed", totals: ["T1"] }, message: expect.not.stringContaining("--") }),
    );
    expect(() => foldScan(net, { parameter: "nope", from: q("0"), to: q("1") })).toThrow(/neither a rate constant/);
  });

  it("two-site cycle, initial F varied: linear elimination first, a 1 / 3 / 1 window around F = 1/20, each fold confirmed by the full analysis on either side", () => {
    const r = foldScan(parseNetworkCsv(TWO_SITE_BISTABLE), { parameter: "F", from: q("1/100"), to: q("1/10"), points: 3, initial: initial("S0=2,E=1,F=1/20"), timeoutMs: 120_000 });
    expect(r.warnings.join(" ")).toMatch(/Linear elimination/);
    expect(r.windows.map((w) => w.count)).toEqual([1, 3, 1]);
    expect(r.windows[1]!.from < 0.05 && r.windows[1]!.to > 0.05).toBe(true);
    // analyseNetwork (parametrisation + numeric steady states, another code path) just below and above each fold.
    const count = (f: string) => analyseCsv(TWO_SITE_BISTABLE, { initial: initial(`S0=2,E=1,F=${f}`), skipFullBasis: true }).steadyStates!.length;
    const side = (v: number, d: number) => (v + d).toFixed(9);
    expect([count(side(r.folds[0]!.value, -1e-6)), count(side(r.folds[0]!.value, 1e-6))]).toEqual([1, 3]);
    expect([count(side(r.folds[1]!.value, -1e-6)), count(side(r.folds[1]!.value, 1e-6))]).toEqual([3, 1]);
  }, 180_000);

  it("simpleRationalBetween picks a short rational strictly inside", () => {
    const r = simpleRationalBetween(q("5615/1000"), q("6384/1000"));
    expect(r).toEqual(q("6"));
    const s = simpleRationalBetween(q("1/3"), q("1/2"));
    expect(s.num * 3n > s.den && s.num * 2n < s.den).toBe(true);
  });
});
