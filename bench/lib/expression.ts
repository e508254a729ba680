/**
 * Exact evaluation of a rational expression as `analyse --json` prints them (`+ - * / ^`,
 * parentheses, integers, fractions, names) at rational values, so the benchmark can check a
 * parametrisation without any code from domain/.
 *
 * Example: evaluateExpression("S0*E*k1/(km1 + k2)", { S0: 2, E: 3, k1: 1, km1: 1, k2: 2 } as Q values) is 2.
 */
import { q, qAdd, qDiv, qMul, qNeg, type Q } from "./rational";

export class ExpressionError extends Error {}

export function evaluateExpression(text: string, values: ReadonlyMap<string, Q>): Q {
  const tokens = text.match(/\d+|[A-Za-z_][A-Za-z0-9_]*|[-+*/^()]|\S/g) ?? [];
  let at = 0;
  const peek = (): string | undefined => tokens[at];
  const expect = (t: string) => {
    if (tokens[at] !== t) throw new ExpressionError(`expected '${t}' at token ${at + 1} of "${text}", found ${tokens[at] ?? "the end"}`);
    at++;
  };
  // sum := product (('+' | '-') product)*; product := unary (('*' | '/') unary)*;
  // unary := '-' unary | power; power := atom ('^' integer)?
  const sum = (): Q => {
    let v = product();
    for (let t = peek(); t === "+" || t === "-"; t = peek()) {
      at++;
      const w = product();
      v = qAdd(v, t === "+" ? w : qNeg(w));
    }
    return v;
  };
  const product = (): Q => {
    let v = unary();
    for (let t = peek(); t === "*" || t === "/"; t = peek()) {
      at++;
      const w = unary();
      v = t === "*" ? qMul(v, w) : qDiv(v, w);
    }
    return v;
  };
  const unary = (): Q => {
    if (peek() === "-") {
      at++;
      return qNeg(unary());
    }
    return power();
  };
  const power = (): Q => {
    const base = atom();
    if (peek() !== "^") return base;
    at++;
    const e = tokens[at++];
    if (e === undefined || !/^\d+$/.test(e)) throw new ExpressionError(`expected an integer exponent in "${text}"`);
    let v = q(1n);
    for (let i = 0; i < Number(e); i++) v = qMul(v, base);
    return v;
  };
  const atom = (): Q => {
    const t = tokens[at++];
    if (t === "(") {
      const v = sum();
      expect(")");
      return v;
    }
    if (t !== undefined && /^\d+$/.test(t)) return q(BigInt(t));
    if (t !== undefined && /^[A-Za-z_]/.test(t)) {
      const v = values.get(t);
      if (v === undefined) throw new ExpressionError(`no value for '${t}' in "${text}"`);
      return v;
    }
    throw new ExpressionError(`unexpected ${t ?? "end"} in "${text}"`);
  };
  const v = sum();
  if (at !== tokens.length) throw new ExpressionError(`unexpected '${tokens[at]}' in "${text}"`);
  return v;
}
