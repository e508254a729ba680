import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { evaluate, partialDerivative, type Rational } from "../../../domain/algebra/index";
import { rational, toNumber, formatRational } from "../../../domain/algebra/rational";
import { parseNetworkCsv } from "../../../domain/network/index";
import { odeJulia, odePython } from "../../../domain/steady-state/index";
import { kineticsRing, massActionOdes } from "../../../domain/steady-state/index";
import { seededRandom } from "../../support/prng";
import { roundTripCorpus } from "../network/sbml/demo-corpus";

/**
 * The exported Python module, run by Debian's python3-scipy (NumPy 1.x/2.x, SciPy), against the
 * engine's exact mass-action polynomials (domain/steady-state massActionOdes and their exact
 * partial derivatives) at seeded random rational points: right-hand side and Jacobian agree to
 * 1e-12 relative (floating point against exact rationals).
 */
// Debian's interpreter (with python3-scipy) when present, so the check runs on the packaged SciPy.
const PYTHON = spawnSync("/usr/bin/python3", ["-c", "import numpy, scipy"]).status === 0 ? "/usr/bin/python3" : "python3";
const hasScipy = spawnSync(PYTHON, ["-c", "import numpy, scipy"]).status === 0;
const SCIPY = hasScipy ? spawnSync(PYTHON, ["-c", "import numpy, scipy; print(f'SciPy {scipy.__version__}, NumPy {numpy.__version__}')"], { encoding: "utf8" }).stdout.trim() : "not installed";
const dir = mkdtempSync(join(tmpdir(), "ode-code-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const DRIVER = `
import json, sys, importlib.util
from fractions import Fraction
spec = importlib.util.spec_from_file_location("net", sys.argv[1])
net = importlib.util.module_from_spec(spec); spec.loader.exec_module(net)
job = json.load(sys.stdin)
p = {k: float(Fraction(v)) for k, v in job["rates"].items()}
out = []
for point in job["points"]:
    x = [float(Fraction(v)) for v in point]
    out.append({"rhs": [float(v) for v in net.rhs(0.0, x, p)], "jac": [[float(v) for v in row] for row in net.jacobian(0.0, x, p)]})
print(json.dumps(out))
`;

const close = (got: number, exact: Rational) => {
  const e = toNumber(exact);
  return e === 0 ? got === 0 : Math.abs(got - e) <= 1e-12 * Math.abs(e);
};

describe.skipIf(!hasScipy)(`ODEs as Python, run with ${SCIPY}`, () => {
  writeFileSync(join(dir, "driver.py"), DRIVER);

  it.each(roundTripCorpus().map((c, i) => ({ ...c, seed: 100 + i })))("$name: rhs and Jacobian match the engine at 5 random points", ({ csv, seed }) => {
    const net = parseNetworkCsv(csv);
    const rand = seededRandom(seed);
    const q = (): Rational => rational(BigInt(1 + Math.floor(rand() * 1000)), BigInt(1 + Math.floor(rand() * 97)));
    // Rate constants: the version's values, and seeded values for those without one.
    const kin = kineticsRing(net, { substituteRates: false });
    const rates = new Map<string, Rational>(kin.rateParameters.map((k) => [k, net.reactions.find((r) => r.rate === k)?.rateValue ?? q()]));
    for (const r of net.reactions) if (r.rateValue) rates.set(r.rate, r.rateValue);
    // Held species are parameters of the module, at the version's concentration (seeded when symbolic).
    for (const c of net.constants ?? []) if (c.value) rates.set(c.name, c.value);
    const odes = massActionOdes(net, kin);
    const points = Array.from({ length: 5 }, () => kin.species.map(() => q()));
    const file = join(dir, `net${seed}.py`);
    writeFileSync(file, odePython(net, { title: `seeded ${seed}` }));
    const job = { rates: Object.fromEntries([...rates].map(([k, v]) => [k, formatRational(v)])), points: points.map((p) => p.map(formatRational)) };
    const run = spawnSync(PYTHON, [join(dir, "driver.py"), file], { input: JSON.stringify(job), encoding: "utf8" });
    expect(run.stderr).toBe("");
    const results = JSON.parse(run.stdout) as { rhs: number[]; jac: number[][] }[];
    const ringPoint = (p: Rational[]) => [...p, ...kin.rateParameters.map((k) => rates.get(k)!)];
    points.forEach((p, i) => {
      // kin.species is the network's species order, the order of the module's x.
      expect(kin.species).toEqual(net.species);
      odes.forEach((f, s) => {
        const exact = evaluate(f, ringPoint(p));
        expect(close(results[i].rhs[s], exact), `rhs ${s} at point ${i}: ${results[i].rhs[s]} vs ${formatRational(exact)}`).toBe(true);
        kin.species.forEach((_, t) => {
          const d = evaluate(partialDerivative(f, t), ringPoint(p));
          expect(close(results[i].jac[s][t], d), `J[${s},${t}] at point ${i}`).toBe(true);
        });
      });
    });
  });

  it("refuses to run without a value for every rate constant", () => {
    const file = join(dir, "open.py");
    writeFileSync(file, odePython(parseNetworkCsv("reaction,rate\nA -> B,k\n"), { title: "open" }));
    const run = spawnSync(PYTHON, ["-c", `import importlib.util as u; s=u.spec_from_file_location("m", ${JSON.stringify(file)}); m=u.module_from_spec(s); s.loader.exec_module(m); m.rhs(0, [1.0, 1.0])`], { encoding: "utf8" });
    expect(run.status).not.toBe(0);
    expect(run.stderr).toMatch(/give values for the rate constants and held concentrations k/);
  });

  it("holds a constant species as a parameter: its concentration multiplies the rate, it has no equation", () => {
    const file = join(dir, "held.py");
    const net = parseNetworkCsv("reaction,rate,reverse_rate,rate_value,reverse_rate_value\nA + 2X <-> 3X,k1,k2,2,1\nX <-> B,k3,k4,1,3\n# constant: A = 5/2, B\n# initial: X = 1/4\n");
    const text = odePython(net, { title: "held" });
    expect(text).toContain('SPECIES = ["X"]');
    expect(text).toContain('PARAMETERS = {"k1": 2.0, "k2": 1.0, "k3": 1.0, "k4": 3.0, "A": 5 / 2, "B": None}');
    expect(text).toContain('INITIAL = {"X": 1 / 4}');
    writeFileSync(file, text);
    // At X = 1/4, A = 5/2, B = 3: dX/dt = k1·A·X² − k2·X³ − k3·X + k4·B = 5/16 − 1/64 − 1/4 + 9 = 9.046875 (by hand).
    const probe = `import importlib.util as u; s=u.spec_from_file_location("m", ${JSON.stringify(file)}); m=u.module_from_spec(s); s.loader.exec_module(m)
p = dict(m.PARAMETERS); p["B"] = 3.0
print(repr(float(m.rhs(0, [m.INITIAL["X"]], p)[0])))
try:
    m.rhs(0, [1.0])
except ValueError as e:
    print(e)`;
    const run = spawnSync(PYTHON, ["-c", probe], { encoding: "utf8" });
    expect(run.stderr).toBe("");
    const [value, message] = run.stdout.trim().split("\n");
    expect(Number(value)).toBe(9.046875);
    expect(message).toBe("give values for the rate constants and held concentrations B");
  });

  it("runs as a script: solve_ivp to t = 10 conserves E + C of the enzyme demo", () => {
    const file = join(dir, "enzyme.py");
    writeFileSync(file, odePython(parseNetworkCsv("reaction,rate,reverse_rate,rate_value,reverse_rate_value\nE + S <-> C,kon,koff,2,1\nC -> E + P,kcat,,3,\n"), { title: "enzyme" }));
    const run = spawnSync(PYTHON, [file], { encoding: "utf8" });
    expect(run.status).toBe(0);
    const v = Object.fromEntries(run.stdout.trim().split("\n").map((l) => l.split(" = ")).map(([k, x]) => [k, Number(x)]));
    // x0 = 1 for every species, so E + C = 2 at all times (a conservation law of the network).
    expect(Math.abs(v.E + v.C - 2)).toBeLessThan(1e-5);
  });
});

describe("ODEs as Julia", () => {
  it("writes in-place rhs! and jacobian! with 1-based indices and the version's constants", () => {
    const text = odeJulia(parseNetworkCsv("reaction,rate,rate_value\n2A -> B,k,1/3\n"), { title: "dimer" });
    expect(text).toContain('const PARAMETERS = Dict{String,Union{Float64,Nothing}}("k" => 1 / 3)');
    expect(text).toContain('du[1] = -2 * k["k"] * u[1]^2  # dA/dt');
    expect(text).toContain('du[2] = k["k"] * u[1]^2  # dB/dt');
    expect(text).toContain('J[1, 1] = -4 * k["k"] * u[1]');
    expect(text).toMatch(/^# Mass-action ODEs of "dimer"/);
  });

  it("writes a held species as a parameter factor of its reactions' rates", () => {
    const text = odeJulia(parseNetworkCsv("reaction,rate,rate_value\nA + 2X -> 3X,k1,2\nX -> 0,k2,1\n# constant: A = 5/2\n# initial: X = 0\n"), { title: "held" });
    expect(text).toContain('"k1" => 2.0, "k2" => 1.0, "A" => 5 / 2)');
    expect(text).toContain('const INITIAL = Dict{String,Float64}("X" => 0.0)');
    expect(text).toContain('du[1] = k["k1"] * k["A"] * u[1]^2 - k["k2"] * u[1]  # dX/dt');
    expect(text).toContain("# Held constant (parameters beside the rate constants, not variables: their d/dt is 0): A = 5/2");
  });
});
