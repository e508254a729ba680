import type { Polynomial } from "../polynomial";
import type { Rational } from "../rational";
import type { SelectionStrategy } from "./buchberger";
import { buchberger } from "./buchberger";
import { integerCoefficients } from "./coefficients";
import { clearDenominators, fromEngine, monicRational, toEngine } from "./convert";
import type { Limits } from "./limits";

// TEMPORARY: plain fraction-free path until the traced modular strategy lands.
export function modularGroebnerQQ(polys: readonly Polynomial<Rational>[], strategy: SelectionStrategy | undefined, limits: Limits): Polynomial<Rational>[] {
  const ring = polys[0].ring;
  const basis = buchberger(polys.map((p) => clearDenominators(toEngine(p))), integerCoefficients, ring.n, ring.cmp, { strategy, limits });
  return basis.map((p) => fromEngine(ring, monicRational(p)));
}
