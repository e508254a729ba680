import { formatRational, type Rational } from "../algebra/rational";
import type { Network } from "../network/index";
import { massActionTerms } from "./ode-terms";

/**
 * The mass-action ODE right-hand side and its Jacobian as ready-to-run code: a Python module
 * (NumPy arrays, SciPy's solve_ivp signature f(t, x)) and a Julia function pair (in-place
 * f!(du, u, p, t), the usual signature of Julia ODE solvers). Both follow
 * dx_s/dt = Σ_j (y'_s − y_s)·k_j·Π_t x_t^{y_t} (Horn & Jackson, Arch. Rational Mech. Anal. 47, 1972, eq. 2.5),
 * term by term, with the version's rate-constant values; a constant without a value must be supplied.
 * A held (constant) species is a parameter in the same table, not a variable (its derivative is 0):
 * its concentration multiplies the rate constant of each reaction that consumes it.
 *
 * Example: for "A -> B, k = 2" the Python rhs is `[-k["k"] * x[0], k["k"] * x[0]]`.
 */
export interface OdeCodeOptions {
  /** Shown in the header, e.g. `Invertase binding (version 3)`. */
  readonly title: string;
}

interface Term {
  /** Integer coefficient (net stoichiometry), never 0. */
  readonly coefficient: number;
  readonly rate: string;
  /** Constant species of the reactant → exponent: parameters, like the rate constant. */
  readonly held: ReadonlyMap<string, number>;
  /** Species index → exponent. */
  readonly powers: ReadonlyMap<number, number>;
}

/**
 * dx_s/dt as term lists from the domain's one mass-action builder (`massActionTerms`), held
 * species apart as parameters, and ∂(dx_s/dt)/∂x_t differentiated term by term (terms with the
 * same rate and monomial merged).
 */
function codeTerms(network: Network): { rhs: Term[][]; jacobian: Term[][][] } {
  const n = network.species.length;
  const index = new Map(network.species.map((s, i) => [s, i]));
  const rhs: Term[][] = massActionTerms(network).map((ode) =>
    ode.terms.map((t) => ({
      coefficient: t.coefficient,
      rate: t.rate,
      held: new Map(t.factors.filter((f) => f.constant).map((f) => [f.species, f.power])),
      powers: new Map(t.factors.filter((f) => !f.constant).map((f) => [index.get(f.species)!, f.power])),
    })),
  );
  const addTerm = (list: Term[], t: Term) => {
    const key = (x: Term) => `${x.rate}|${[...x.held].sort().join(";")}|${[...x.powers].sort((a, b) => a[0] - b[0]).join(";")}`;
    const i = list.findIndex((x) => key(x) === key(t));
    if (i < 0) list.push(t);
    else {
      const c = list[i].coefficient + t.coefficient;
      if (c === 0) list.splice(i, 1);
      else list[i] = { ...list[i], coefficient: c };
    }
  };
  const jacobian = rhs.map((terms) =>
    Array.from({ length: n }, (_, t) => {
      const out: Term[] = [];
      for (const term of terms) {
        const y = term.powers.get(t);
        if (!y) continue;
        const powers = new Map(term.powers);
        if (y === 1) powers.delete(t);
        else powers.set(t, y - 1);
        addTerm(out, { coefficient: term.coefficient * y, rate: term.rate, held: term.held, powers });
      }
      return out;
    }),
  );
  return { rhs, jacobian };
}

/** Every parameter of the code: the rate constants, then the held concentrations (one namespace: no rate symbol is a species name). */
function rateValues(network: Network): Map<string, Rational | undefined> {
  const m = new Map<string, Rational | undefined>();
  for (const r of network.reactions) m.set(r.rate, m.get(r.rate) ?? r.rateValue);
  for (const c of network.constants ?? []) m.set(c.name, c.value);
  return m;
}

interface Dialect {
  readonly rate: (name: string) => string;
  readonly x: (i: number) => string;
  readonly pow: string;
}

function expression(terms: readonly Term[], d: Dialect): string {
  if (terms.length === 0) return "0.0";
  return terms
    .map((t, i) => {
      const factors = [
        d.rate(t.rate),
        ...[...t.held].map(([c, y]) => (y === 1 ? d.rate(c) : `${d.rate(c)}${d.pow}${y}`)),
        ...[...t.powers].sort((a, b) => a[0] - b[0]).map(([s, y]) => (y === 1 ? d.x(s) : `${d.x(s)}${d.pow}${y}`)),
      ];
      const m = Math.abs(t.coefficient);
      const body = (m === 1 ? "" : `${m} * `) + factors.join(" * ");
      return (t.coefficient < 0 ? (i === 0 ? "-" : " - ") : i === 0 ? "" : " + ") + body;
    })
    .join("");
}

const floatLiteral = (v: Rational): string => (v.den === 1n ? `${v.num}.0` : `${v.num} / ${v.den}`);

function headerLines(network: Network, options: OdeCodeOptions, xName: string, first: number): string[] {
  const values = rateValues(network);
  const held = network.constants ?? [];
  const heldNames = new Set(held.map((c) => c.name));
  const show = (k: string, v: Rational | undefined) => `${k} = ${v ? formatRational(v) : "(no value: give one)"}`;
  const side = (c: Record<string, number>) => Object.entries(c).map(([s, y]) => (y === 1 ? s : `${y}${s}`)).join(" + ") || "0";
  return [
    `Mass-action ODEs of "${options.title.replace(/["\\]/g, "'").replace(/\s+/g, " ")}", written by Stillpoint.`,
    "",
    "  dx/dt = N · v(x),   v_j(x) = k_j · Π_s x_s^(y_s,j)   (Horn & Jackson 1972)",
    "",
    "Assumes mass-action kinetics in one well-mixed volume and concentrations ≥ 0.",
    `Species (${xName}[${first}], ${xName}[${first + 1}], …): ${network.species.join(", ")}`,
    `Rate constants from the network version: ${[...values].filter(([k]) => !heldNames.has(k)).map(([k, v]) => show(k, v)).join(", ")}`,
    ...(held.length > 0
      ? [
          `Held constant (parameters beside the rate constants, not variables: their d/dt is 0): ${held.map((c) => show(c.name, c.value)).join(", ")}`,
          "  A held species' concentration multiplies the rate constant of each reaction it is a reactant of.",
        ]
      : []),
    ...(network.initial && network.initial.length > 0 ? [`Initial values stored with the version: ${network.initial.map((i) => `${i.name} = ${formatRational(i.value)}`).join(", ")}`] : []),
    "Reactions:",
    ...network.reactions.map((r) => `  ${r.id}: ${side({ ...r.reactant, ...(r.held ?? {}) })} -> ${side(r.product)}  (${r.rate})`),
  ];
}

/**
 * A Python 3 module: SPECIES, PARAMETERS, rhs(t, x, p) and jacobian(t, x, p) returning NumPy
 * arrays, and a short solve_ivp run when executed as a script.
 * Example: `python3 network.py` integrates from the version's initial values (1 where none) and prints the end state.
 */
export function odePython(network: Network, options: OdeCodeOptions): string {
  const { rhs, jacobian } = codeTerms(network);
  const d: Dialect = { rate: (k) => `k[${JSON.stringify(k)}]`, x: (i) => `x[${i}]`, pow: " ** " };
  const n = network.species.length;
  const values = rateValues(network);
  const lines = [
    '"""',
    ...headerLines(network, options, "x", 0),
    "",
    "Use:  from this_module import rhs, jacobian, SPECIES, PARAMETERS",
    '      scipy.integrate.solve_ivp(rhs, (0, 10), x0, jac=jacobian, method="LSODA")',
    '"""',
    "import numpy as np",
    "",
    `SPECIES = [${network.species.map((s) => JSON.stringify(s)).join(", ")}]`,
    `PARAMETERS = {${[...values].map(([k, v]) => `${JSON.stringify(k)}: ${v ? floatLiteral(v) : "None"}`).join(", ")}}`,
    `INITIAL = {${(network.initial ?? []).map((i) => `${JSON.stringify(i.name)}: ${floatLiteral(i.value)}`).join(", ")}}`,
    "",
    "",
    "def _constants(p):",
    "    missing = [name for name, value in p.items() if value is None]",
    "    if missing:",
    '        raise ValueError("give values for the rate constants and held concentrations " + ", ".join(missing))',
    "    return p",
    "",
    "",
    "def rhs(t, x, p=PARAMETERS):",
    '    """dx/dt at concentrations x (the system is autonomous: t is not used)."""',
    "    k = _constants(p)",
    "    return np.array([",
    ...rhs.map((terms, s) => `        ${expression(terms, d)},  # d${network.species[s]}/dt`),
    "    ], dtype=float)",
    "",
    "",
    "def jacobian(t, x, p=PARAMETERS):",
    '    """The matrix J[s, u] = d(dx_s/dt)/dx_u at x."""',
    "    k = _constants(p)",
    `    J = np.zeros((${n}, ${n}))`,
    ...jacobian.flatMap((row, s) => row.flatMap((terms, u) => (terms.length === 0 ? [] : [`    J[${s}, ${u}] = ${expression(terms, d)}`]))),
    "    return J",
    "",
    "",
    'if __name__ == "__main__":',
    "    from scipy.integrate import solve_ivp",
    "",
    "    # The version's initial values; 1 for a species without one (put your own here).",
    "    x0 = np.array([INITIAL.get(name, 1.0) for name in SPECIES], dtype=float)",
    '    sol = solve_ivp(rhs, (0.0, 10.0), x0, jac=jacobian, method="LSODA", rtol=1e-8, atol=1e-10)',
    "    for name, value in zip(SPECIES, sol.y[:, -1]):",
    '        print(f"{name} = {value:.6g}")',
  ];
  return lines.join("\n") + "\n";
}

/**
 * A Julia file: SPECIES, PARAMETERS, rhs!(du, u, p, t) and jacobian!(J, u, p, t), in place, 1-based.
 * Example: `include("network.jl"); du = zeros(length(SPECIES)); rhs!(du, ones(length(SPECIES)), PARAMETERS, 0.0)`.
 */
export function odeJulia(network: Network, options: OdeCodeOptions): string {
  const { rhs, jacobian } = codeTerms(network);
  const d: Dialect = { rate: (k) => `k[${JSON.stringify(k)}]`, x: (i) => `u[${i + 1}]`, pow: "^" };
  const values = rateValues(network);
  const lines = [
    ...headerLines(network, options, "u", 1).map((l) => (l === "" ? "#" : `# ${l}`)),
    "#",
    "# Use:  include(\"this_file.jl\"); du = zeros(length(SPECIES)); rhs!(du, u0, PARAMETERS, 0.0)",
    "",
    `const SPECIES = [${network.species.map((s) => JSON.stringify(s)).join(", ")}]`,
    `const PARAMETERS = Dict{String,Union{Float64,Nothing}}(${[...values].map(([k, v]) => `${JSON.stringify(k)} => ${v ? floatLiteral(v) : "nothing"}`).join(", ")})`,
    `const INITIAL = Dict{String,Float64}(${(network.initial ?? []).map((i) => `${JSON.stringify(i.name)} => ${floatLiteral(i.value)}`).join(", ")})`,
    "",
    "function constants(p)",
    "    missing = [name for (name, value) in p if value === nothing]",
    '    isempty(missing) || error("give values for the rate constants and held concentrations " * join(sort(missing), ", "))',
    "    return p",
    "end",
    "",
    "\"\"\"du = dx/dt at concentrations u (autonomous: t is not used).\"\"\"",
    "function rhs!(du, u, p, t)",
    "    k = constants(p)",
    ...rhs.map((terms, s) => `    du[${s + 1}] = ${expression(terms, d)}  # d${network.species[s]}/dt`),
    "    return du",
    "end",
    "",
    "\"\"\"J[s, v] = d(dx_s/dt)/du_v at u.\"\"\"",
    "function jacobian!(J, u, p, t)",
    "    k = constants(p)",
    "    fill!(J, 0.0)",
    ...jacobian.flatMap((row, s) => row.flatMap((terms, v) => (terms.length === 0 ? [] : [`    J[${s + 1}, ${v + 1}] = ${expression(terms, d)}`]))),
    "    return J",
    "end",
  ];
  return lines.join("\n") + "\n";
}
