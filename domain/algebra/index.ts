/**
 * Stillpoint's exact polynomial algebra engine — the public surface.
 *
 * Fields: `QQ` (exact bigint rationals, elements `{num, den}`), `primeField(p)` (Z/p, p < 2^31,
 * elements are numbers in [0, p)). Rings: `new PolynomialRing(vars, field, order)` with vars
 * listed from the highest and an order spec string (`'lex'`, `'grlex'`, `'grevlex'`,
 * `'weighted(1,2,3)'`, or blocks `'lex(9), grevlex(15)'`, see `parseOrderSpec`).
 *
 * Typical use for steady-state work (species first, parameters in a lower block):
 * ```ts
 * import { PolynomialRing, QQ, groebnerBasis, substitute, terms, rational } from "@domain/algebra";
 * const R = new PolynomialRing(["x1", "x2", "k1", "k2", "T"], QQ, "lex(2), lex(3)");
 * // from text ...
 * const f = R.parse("k1*x1 - k2*x2");
 * // ... or programmatically from (coefficient, exponent vector) terms, in any order:
 * const g = R.fromTerms([{ coeff: QQ.one, exponents: [1, 0, 0, 0, 0] },
 *                       { coeff: rational(1n), exponents: [0, 1, 0, 0, 0] },
 *                       { coeff: rational(-1n), exponents: [0, 0, 0, 0, 1] }]);   // x1 + x2 - T
 * const G = groebnerBasis([f, g]);  // reduced, monic, increasing LM: [x2*k1 + x2*k2 - k1*T, x1 + x2 - T]
 * // substitute rational values for parameters (0-based variable indices): k1 = 3/2, k2 = 1
 * const h = substitute(G[0], new Map([[2, rational(3n, 2n)], [3, rational(1n)]]));
 * for (const t of terms(h)) console.log(t.coeff, t.exponents); // {num: 5n, den: 2n} [0,1,0,0,0], ...
 * R.format(h);                                        // "5/2*x2 - 3/2*T"
 * ```
 * A full lex basis is `new PolynomialRing(vars, QQ, "lex")`; block orders eliminate the first
 * block (`eliminate(polys, names)` does that for you). For lex and block orders a zero-dimensional
 * ideal is solved in grevlex first and converted by FGLM (`fglm: false` turns that off); over Q
 * the default method learns the computation modulo a prime, replays the useful steps exactly and
 * proves the result (Buchberger's criterion), and FGLM over Q runs modulo primes with rational
 * reconstruction, then proves the lifted basis exactly (fglm-modular.ts), so results are always exact.
 * Deadlines are checked inside single reductions and huge-integer gcds too, so a deadline holds to
 * within a fraction of a second even when coefficients explode.
 * Coefficients: `terms(p)` gives `{coeff, exponents}` (a `Rational` over QQ); `coefficientOf(p, exps)`
 * reads one; `evaluate(p, point)` evaluates; `mapPolynomial(p, otherRing, f)` changes field/order;
 * `moveToRing(p, ring)` re-expresses p in a ring with the same variable names in another order. Long calls accept
 * `{ timeoutMs, deadline, maxBasisSize, maxPairs, maxTerms, signal, onProgress }` and throw
 * `AlgebraError` with code 'timeout' | 'budget' | 'cancelled'; parse errors have code 'parse'
 * and a `location` {line, column}.
 */
export { AlgebraError, isAlgebraError } from "./errors";
export type { AlgebraErrorCode, SourceLocation } from "./errors";
export { QQ, primeField, isPrime, isPrimeField, mulMod, invMod, MAX_PRIME } from "./field";
export type { Field, PrimeField } from "./field";
export * from "./rational";
export { parseOrderSpec, formatOrderSpec, makeComparator } from "./order";
export type { OrderSpec, OrderBlock, BlockKind, MonomialComparator } from "./order";
export { packMonomial, unpackMonomial } from "./monomial";
export type { Exponents } from "./monomial";
export { PolynomialRing } from "./ring";
export {
  add, sub, neg, mul, pow, scale, mulTerm, equals, makeMonic, evaluate, substitute, partialDerivative,
  leadingCoefficient, leadingMonomial, leadingTerm, totalDegree, terms, coefficientOf, numTerms, isZeroPoly,
  fromTerms, zeroPoly, constantPoly, variablePoly, mapPolynomial, assertInvariants, isPolynomial,
} from "./polynomial";
export type { Polynomial, Term } from "./polynomial";
export { parsePolynomial } from "./parse";
export type { ParseOptions } from "./parse";
export { formatPolynomial, printedTerms, type PrintedTerm } from "./format";
export { polynomialTex, nameTex, numberTex } from "./format-tex";
export { divide } from "./division";
export type { DivisionResult } from "./division";
export { groebnerBasis } from "./groebner";
export type { GroebnerOptions } from "./groebner";
export type { LimitOptions, Progress } from "./groebner/limits";
export { normalForm, isGroebner, isReduced, idealMembership, trackedGroebner } from "./ideal";
export type { MembershipResult } from "./ideal";
export { fglm } from "./fglm";
export { eliminate, saturate, isZeroDimensional, standardMonomials, countSolutions, moveToRing } from "./elimination";
