import { partialDerivative, terms } from "../algebra/index";
import { toNumber } from "../algebra/index";
import type { Matrix, Vector } from "../numeric/dense";
import type { QPoly } from "./kinetics";

/** A polynomial compiled for fast float evaluation: coefficients and exponent rows. */
interface CompiledPoly {
  coeffs: number[];
  exps: number[][];
}

const compile = (p: QPoly): CompiledPoly => {
  const ts = terms(p);
  return { coeffs: ts.map((t) => toNumber(t.coeff)), exps: ts.map((t) => [...t.exponents]) };
};

function evalCompiled(c: CompiledPoly, x: Vector): number {
  let s = 0;
  for (let i = 0; i < c.coeffs.length; i++) {
    let t = c.coeffs[i];
    const e = c.exps[i];
    for (let k = 0; k < e.length; k++) if (e[k] !== 0) t *= e[k] === 1 ? x[k] : Math.pow(x[k], e[k]);
    s += t;
  }
  return s;
}

/**
 * Float evaluator of a polynomial map and its Jacobian with respect to the variables `wrt`
 * (0-based ring indices); the point gives a value for every ring variable. Exact polynomials in,
 * floats out — for Newton polishing, stability and simulation only.
 * Example: for [x^2 − y] and wrt [0, 1], at (2, 1) the value is [3] and the Jacobian [[4, −1]].
 */
export function floatSystem(polys: readonly QPoly[], wrt: readonly number[]) {
  const f = polys.map(compile);
  const jac = polys.map((p) => wrt.map((k) => compile(partialDerivative(p, k))));
  return {
    values: (x: Vector): Vector => f.map((c) => evalCompiled(c, x)),
    jacobian: (x: Vector): Matrix => jac.map((row) => row.map((c) => evalCompiled(c, x))),
  };
}

/** Float value of one polynomial at a point (all ring variables). */
export const evaluateFloat = (p: QPoly, x: Vector): number => evalCompiled(compile(p), x);
