import { AlgebraError } from "./errors";
import type { SourceLocation } from "./errors";
import type { Polynomial } from "./polynomial";
import { add, constantPoly, isZeroPoly, mul, neg, pow, scale, sub, variablePoly } from "./polynomial";
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
  const peek = () => tokens[t];
  const isOp = (s: string) => peek().kind === "op" && peek().text === s;

  function expression(): Polynomial<C> {
    let acc = term();
    for (;;) {
      if (isOp("+")) { t++; acc = add(acc, term()); }
      else if (isOp("-")) { t++; acc = sub(acc, term()); }
      else return acc;
    }
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
    if (isOp("-")) { t++; return neg(unary()); }
    if (isOp("+")) { t++; return unary(); }
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
    if (!Number.isSafeInteger(e) || e > 1_000_000) fail(tok.pos, `exponent ${tok.text} is too large`, "an exponent up to 1000000");
    return pow(base, e);
  }

  function atom(): Polynomial<C> {
    const tok = peek();
    if (tok.kind === "num") {
      t++;
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
      t++;
      const inner = expression();
      if (!isOp(")")) fail(peek().pos, `found '${peek().text || "end of input"}'`, "')'");
      t++;
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
