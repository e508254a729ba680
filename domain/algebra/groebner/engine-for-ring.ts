import { isRationalField } from "../field";
import type { Polynomial } from "../polynomial";
import type { Rational } from "../rational";
import type { PolynomialRing } from "../ring";
import type { EngineCoefficients } from "./coefficients";
import { integerCoefficients } from "./coefficients";
import { clearDenominators, coefficientsFor, toEngine } from "./convert";
import type { EPoly } from "./reduce";

/**
 * Engine arithmetic for scale-invariant questions (does it reduce to zero? which leading
 * monomials?): fraction-free integers for Q, the field itself otherwise.
 */
export interface ScaleFreeEngine {
  readonly K: EngineCoefficients<unknown>;
  toEngine(p: Polynomial<unknown>): EPoly<unknown>;
}

export function scaleFreeEngine<C>(ring: PolynomialRing<C>): ScaleFreeEngine {
  if (isRationalField(ring.field)) {
    return {
      K: integerCoefficients as EngineCoefficients<unknown>,
      toEngine: (p) => clearDenominators(toEngine(p as Polynomial<Rational>)),
    };
  }
  return { K: coefficientsFor(ring.field) as EngineCoefficients<unknown>, toEngine: (p) => toEngine(p) };
}
