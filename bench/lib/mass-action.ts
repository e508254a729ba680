/**
 * Mass-action kinetics for the phosphorylation benchmark systems: each reaction fires at
 * rate k·Π x^a (a = reactant coefficients), and dx/dt sums (product − reactant coefficient of x)
 * times that rate (Feinberg, "Foundations of Chemical Reaction Network Theory", 2019, ch. 2).
 *
 * A rate (or a conservation total) is a number, or the name of a parameter that is one of the
 * variables, for systems with symbolic constants.
 *
 * Example: for A + B -> C with k = 2, massActionRhs gives dA/dt = -2*A*B, dC/dt = 2*A*B;
 * with rate "k" (and "k" among the variables), dA/dt = -k*A*B.
 */
import { polyAdd, polyConst, polyMul, polyPow, polyScale, polyVar, type Poly } from "./poly";
import { q, type Q } from "./rational";

export interface Reaction {
  readonly reactants: Readonly<Record<string, number>>;
  readonly products: Readonly<Record<string, number>>;
  readonly rate: Q | string;
}

function constantOrParameter(value: Q | string, variables: readonly string[]): Poly {
  if (typeof value !== "string") return polyConst(value, variables.length);
  const i = variables.indexOf(value);
  if (i < 0) throw new Error(`unknown parameter ${value}`);
  return polyVar(i, variables.length);
}

export function massActionRhs(reactions: readonly Reaction[], variables: readonly string[]): Poly[] {
  const n = variables.length;
  const index = (s: string): number => {
    const i = variables.indexOf(s);
    if (i < 0) throw new Error(`unknown species ${s}`);
    return i;
  };
  const rhs: Poly[] = variables.map(() => new Map());
  for (const r of reactions) {
    let flux = constantOrParameter(r.rate, variables);
    for (const [s, a] of Object.entries(r.reactants)) flux = polyMul(flux, polyPow(polyVar(index(s), n), a, n));
    for (const s of new Set([...Object.keys(r.reactants), ...Object.keys(r.products)])) {
      const net = (r.products[s] ?? 0) - (r.reactants[s] ?? 0);
      if (net !== 0) rhs[index(s)] = polyAdd(rhs[index(s)], polyScale(flux, q(BigInt(net))));
    }
  }
  return rhs;
}

/** A linear conservation equation Σ c_s·s − total. Example: E + ES0 − 1/2. */
export function conservationEquation(coefficients: Readonly<Record<string, number>>, total: Q | string, variables: readonly string[]): Poly {
  const n = variables.length;
  let p = polyScale(constantOrParameter(total, variables), q(-1n));
  for (const [s, c] of Object.entries(coefficients)) {
    const i = variables.indexOf(s);
    if (i < 0) throw new Error(`unknown species ${s}`);
    p = polyAdd(p, polyScale(polyVar(i, n), q(BigInt(c))));
  }
  return p;
}
