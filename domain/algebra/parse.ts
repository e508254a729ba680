import { AlgebraError } from "./errors";
import type { SourceLocation } from "./errors";
import type { Polynomial } from "./polynomial";
import { add, constantPoly, isZeroPoly, mul, neg, numTerms, pow, scale, totalDegree, variablePoly } from "./polynomial";
import { parseRational } from "./rational";
import type { PolynomialRing } from "./ring";

export interface ParseOptions {
  /** Where the text starts in a larger file, so errors point at the right place (1-based). */
  readonly line?: number;
  readonly column?: number;
}

type Token =
  | { kind: "num"; text: string; pos: number }
  | { kind: "ident"; text: string; pos: number }
  | { kind: "op"; text: "+" | "-" | "*" | "/" | "^" | "(" | ")"; pos: number }
  | { kind: "end"; text: ""; pos: number };

/**
 * What one polynomial text may ask for, checked before the work is done, so a short input cannot
 * run for minutes or overflow the stack (each is a located parse error):
 * nesting of parentheses and signs up to 200 deep; decimal exponents (`1e…`) up to ±1000; a power
 * of a sum up to degree 1000 and at most 20,000 terms when expanded (`(x+1)^3000` is refused, it
 * would take tens of seconds) and an estimated expansion work (the last squaring's term pairs
 * times the coefficient size in 64-bit words) of at most 2,000,000 — about a second here, e.g.
 * `(x+1)^500` or `(x+y+z+1)^30` pass, `(123456789*x+987654321)^300` does not; a power of a
 * monomial up to degree 1,000,000.
 */
export const PARSE_LIMITS = {
  maxNesting: 200,
  maxDecimalExponent: 1000,
  maxExpandedDegree: 1000,
  maxExpandedTerms: 20_000,
  maxMonomialDegree: 1_000_000,
  maxPowerWork: 2_000_000,
} as const;

const bitLength = (n: bigint): number => (n < 0n ? -n : n).toString(2).length;

/** Upper bound on the terms of p^e for p with t terms: C(e + t - 1, t - 1), in floating point (only compared). */
function expandedTermsBound(t: number, e: number): number {
  let bound = 1;
  for (let i = 1; i < t; i++) {
    bound = (bound * (e + i)) / i;
    if (bound > 1e12) return Infinity;
  }
  return bound;
}

const NUMBER = /\d+(?:\.\d*)?(?:[eE][+-]?\d+)?|\.\d+(?:[eE][+-]?\d+)?/y;
const IDENT = /[A-Za-z_][A-Za-z0-9_]*/y;

/**
 * Parses a polynomial: `+ - * ^`, parentheses, integers, fractions `a/b` (division by a non-zero
 * constant), exact decimals (`0.25`, `1e-3`). Recursive descent with the usual precedence
 * (`-x^2` is `-(x^2)`); errors are AlgebraError('parse') with line, column and what was expected.
 * Example: parsePolynomial(R, '(x + 1/2)^2') is x^2 + x + 1/4.
 */
export function parsePolynomial<C>(ring: PolynomialRing<C>, text: string, options: ParseOptions = {}): Polynomial<C> {
  const F = ring.field;
  const locate = (pos: number): SourceLocation => {
    let line = options.line ?? 1;
    let column = (options.column ?? 1) + pos;
    const before = text.slice(0, pos);
    const nl = before.lastIndexOf("\n");
    if (nl >= 0) {
      line += before.split("\n").length - 1;
      column = pos - nl;
    }
    return { line, column };
  };
  const fail = (pos: number, message: string, expected: string): never => {
    throw new AlgebraError("parse", `${message}; expected ${expected}`, { location: locate(pos), expected });
  };

  const tokens: Token[] = [];
  for (let i = 0; i < text.length; ) {
    const ch = text[i];
    if (/\s/.test(ch)) { i++; continue; }
    if ("+-*/^()".includes(ch)) {
      if (ch === "*" && text[i + 1] === "*") { tokens.push({ kind: "op", text: "^", pos: i }); i += 2; continue; }
      tokens.push({ kind: "op", text: ch as "+", pos: i });
      i++;
      continue;
    }
    NUMBER.lastIndex = i;
    let m = NUMBER.exec(text);
    if (m) { tokens.push({ kind: "num", text: m[0], pos: i }); i += m[0].length; continue; }
    IDENT.lastIndex = i;
    m = IDENT.exec(text);
    if (m) { tokens.push({ kind: "ident", text: m[0], pos: i }); i += m[0].length; continue; }
    fail(i, `unexpected character '${ch}'`, "a number, a variable, an operator + - * / ^ or a parenthesis");
  }
  tokens.push({ kind: "end", text: "", pos: text.length });

  let t = 0;
  let depth = 0;
  const nest = (pos: number) => {
    if (++depth > PARSE_LIMITS.maxNesting) fail(pos, `nesting deeper than ${PARSE_LIMITS.maxNesting} levels`, `at most ${PARSE_LIMITS.maxNesting} nested parentheses or signs`);
  };
  const peek = () => tokens[t];
  const isOp = (s: string) => peek().kind === "op" && peek().text === s;

  function expression(): Polynomial<C> {
    // Summands are added pairwise (a balanced tree), not each into a growing sum: a sum of n
    // terms costs O(n log n) merges instead of O(n²) copies (a 143-element basis of about 200
    // terms each parsed in 0.45 s left to right, most of it re-copying the partial sums).
    let parts: Polynomial<C>[] = [term()];
    for (;;) {
      if (isOp("+")) { t++; parts.push(term()); }
      else if (isOp("-")) { t++; parts.push(neg(term())); }
      else break;
    }
    while (parts.length > 1) {
      const next: Polynomial<C>[] = [];
      for (let i = 0; i < parts.length; i += 2) next.push(i + 1 < parts.length ? add(parts[i], parts[i + 1]) : parts[i]);
      parts = next;
    }
    return parts[0];
  }

  function term(): Polynomial<C> {
    let acc = unary();
    for (;;) {
      if (isOp("*")) { t++; acc = mul(acc, unary()); }
      else if (isOp("/")) {
        const at = peek().pos;
        t++;
        const d = unary();
        if (isZeroPoly(d)) fail(at, "division by zero", "a non-zero divisor");
        if (d.coeffs.length !== 1 || d.exps[0] !== 0) fail(at, "division by a non-constant", "a number after '/'");
        acc = scale(acc, F.inv(d.coeffs[0]));
      } else return acc;
    }
  }

  function unary(): Polynomial<C> {
    if (isOp("-") || isOp("+")) {
      const minus = isOp("-");
      nest(peek().pos);
      t++;
      const inner = unary();
      depth--;
      return minus ? neg(inner) : inner;
    }
    return power();
  }

  function power(): Polynomial<C> {
    const base = atom();
    if (!isOp("^")) return base;
    t++;
    const tok = peek();
    if (tok.kind !== "num" || !/^\d+$/.test(tok.text)) {
      return fail(tok.pos, `bad exponent '${tok.text || "end of input"}'`, "a non-negative integer exponent");
    }
    t++;
    const e = Number(tok.text);
    const { maxMonomialDegree, maxExpandedDegree, maxExpandedTerms } = PARSE_LIMITS;
    if (!Number.isSafeInteger(e) || e > maxMonomialDegree) fail(tok.pos, `exponent ${tok.text} is too large`, `an exponent up to ${maxMonomialDegree}`);
    // Bound the result before computing it: the degree, and for a sum the number of terms.
    const degree = totalDegree(base) * e;
    if (numTerms(base) > 1) {
      if (degree > maxExpandedDegree) {
        fail(tok.pos, `the power has degree ${degree} when expanded`, `a power of a sum of degree at most ${maxExpandedDegree}`);
      }
      if (expandedTermsBound(numTerms(base), e) > maxExpandedTerms) {
        fail(tok.pos, `the power could have more than ${maxExpandedTerms} terms when expanded`, `a smaller exponent or fewer terms in the base`);
      }
      // Coefficients grow like (terms · height)^e over Q; over Z/p they stay the size of p.
      const height = Math.max(...base.coeffs.map((c) => { const r = F.toRational(c); return bitLength(r.num) + bitLength(r.den); }));
      const coefficientBits = F.characteristic > 0n ? bitLength(F.characteristic) : e * (Math.log2(numTerms(base)) + height);
      const half = expandedTermsBound(numTerms(base), Math.ceil(e / 2));
      if (half * half * (1 + coefficientBits / 64) > PARSE_LIMITS.maxPowerWork) {
        fail(tok.pos, "the power is too large to expand exactly", "a smaller exponent, smaller coefficients or fewer terms in the base");
      }
    } else if (degree > maxMonomialDegree) {
      fail(tok.pos, `the power has degree ${degree}`, `a monomial of degree at most ${maxMonomialDegree}`);
    }
    return pow(base, e);
  }

  function atom(): Polynomial<C> {
    const tok = peek();
    if (tok.kind === "num") {
      t++;
      const exponent = /[eE][+-]?0*(\d+)$/.exec(tok.text);
      if (exponent && (exponent[1]!.length > 4 || Number(exponent[1]) > PARSE_LIMITS.maxDecimalExponent)) {
        return fail(tok.pos, `the number '${tok.text.length > 30 ? `${tok.text.slice(0, 30)}…` : tok.text}' is too large to work with exactly`, `a decimal exponent from -${PARSE_LIMITS.maxDecimalExponent} to ${PARSE_LIMITS.maxDecimalExponent}`);
      }
      const r = parseRational(tok.text);
      if (!r) return fail(tok.pos, `bad number '${tok.text}'`, "an integer, a fraction or a decimal");
      try {
        return constantPoly(ring, F.fromRational(r));
      } catch (e) {
        return fail(tok.pos, e instanceof Error ? e.message : String(e), `a number invertible in ${F.name}`);
      }
    }
    if (tok.kind === "ident") {
      t++;
      const i = ring.indexOf(tok.text);
      if (i < 0) return fail(tok.pos, `unknown variable '${tok.text}'`, `one of the variables ${ring.vars.join(", ")}`);
      return variablePoly(ring, i);
    }
    if (isOp("(")) {
      nest(tok.pos);
      t++;
      const inner = expression();
      if (!isOp(")")) fail(peek().pos, `found '${peek().text || "end of input"}'`, "')'");
      t++;
      depth--;
      return inner;
    }
    return fail(tok.pos, `found '${tok.text || "end of input"}'`, "a number, a variable or '('");
  }

  if (peek().kind === "end") fail(0, "empty polynomial", "a polynomial");
  const result = expression();
  const tail = peek();
  if (tail.kind !== "end") {
    const hint = tail.kind === "op" ? "an operator + - * / ^" : "an operator between factors (write 2*x, not 2x or 2 x)";
    fail(tail.pos, `unexpected '${tail.text}'`, hint);
  }
  return result;
}
