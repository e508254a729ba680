import { AlgebraError } from "./errors";
import type { Field } from "./field";
import { formatPolynomial } from "./format";
import type { MonomialComparator, OrderSpec } from "./order";
import { formatOrderSpec, makeComparator, parseOrderSpec, resolveOrderSpec } from "./order";
import { parsePolynomial } from "./parse";
import type { ParseOptions } from "./parse";
import type { Polynomial, Term } from "./polynomial";
import { constantPoly, fromTerms, variablePoly, zeroPoly } from "./polynomial";

const IDENT = /^[A-Za-z_][A-Za-z0-9_]*$/;

/**
 * A polynomial ring K[x_1, ..., x_n] with a fixed monomial order: variables (highest first),
 * coefficient field and comparator are fixed at construction ("strategy chosen once").
 *
 * Example: `new PolynomialRing(['x','y'], QQ, 'lex').parse('x^2 - y/2')` then `ring.format(p)`
 * gives `x^2 - 1/2*y`.
 */
export class PolynomialRing<C> {
  readonly vars: readonly string[];
  readonly n: number;
  /** Int32 slots per packed monomial: total degree + n exponents. */
  readonly stride: number;
  readonly field: Field<C>;
  readonly order: OrderSpec;
  readonly cmp: MonomialComparator;
  private readonly index: ReadonlyMap<string, number>;

  constructor(vars: readonly string[], field: Field<C>, order: OrderSpec | string = "grevlex") {
    if (vars.length === 0) throw new AlgebraError("ring", "a polynomial ring needs at least one variable");
    const seen = new Map<string, number>();
    vars.forEach((v, i) => {
      if (!IDENT.test(v)) throw new AlgebraError("ring", `'${v}' is not a valid variable name (letters, digits, _; not starting with a digit)`);
      if (seen.has(v)) throw new AlgebraError("ring", `variable '${v}' is listed twice`);
      seen.set(v, i);
    });
    this.vars = [...vars];
    this.n = vars.length;
    this.stride = vars.length + 1;
    this.field = field;
    this.order = resolveOrderSpec(typeof order === "string" ? parseOrderSpec(order) : order, vars.length);
    this.cmp = makeComparator(this.order, vars.length);
    this.index = seen;
  }

  /** 0-based index of a variable, or -1. */
  indexOf(name: string): number {
    return this.index.get(name) ?? -1;
  }

  get orderName(): string {
    return formatOrderSpec(this.order);
  }

  /** Same variables and order over another field (e.g. Z/p for modular computation). */
  withField<D>(field: Field<D>): PolynomialRing<D> {
    return new PolynomialRing(this.vars, field, this.order);
  }

  /** Same variables and field with another order. */
  withOrder(order: OrderSpec | string): PolynomialRing<C> {
    return new PolynomialRing(this.vars, this.field, order);
  }

  zero(): Polynomial<C> {
    return zeroPoly(this);
  }
  one(): Polynomial<C> {
    return constantPoly(this, this.field.one);
  }
  constant(c: C): Polynomial<C> {
    return constantPoly(this, c);
  }
  /** The variable by name or 0-based index. */
  variable(v: string | number): Polynomial<C> {
    const i = typeof v === "number" ? v : this.indexOf(v);
    if (i < 0 || i >= this.n) throw new AlgebraError("ring", `unknown variable '${v}'`);
    return variablePoly(this, i);
  }
  /** Builds a polynomial from (coefficient, exponent vector) terms in any order. */
  fromTerms(terms: readonly Term<C>[]): Polynomial<C> {
    return fromTerms(this, terms);
  }
  parse(text: string, options?: ParseOptions): Polynomial<C> {
    return parsePolynomial(this, text, options);
  }
  format(p: Polynomial<C>): string {
    return formatPolynomial(p);
  }
}
