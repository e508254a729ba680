/**
 * Parses polynomial text with `+ - * / ^`, parentheses, integers and variables from a fixed
 * list (division only by non-zero constants, so fractions a/b work). Used to read the outputs of
 * our CLI, SymPy and Singular into one representation. Errors name the column.
 *
 * Example: parsePoly("2/3*x^2 - (y - 1)", ["x", "y"]) has terms 2/3*x^2, -y and 1.
 */
import { polyAdd, polyConst, polyMul, polyNeg, polyPow, polyScale, polySub, polyVar, type Poly } from "./poly";
import { q, qDiv, type Q } from "./rational";

export class PolyParseError extends Error {
  constructor(
    message: string,
    readonly column: number,
  ) {
    super(`column ${column}: ${message}`);
    this.name = "PolyParseError";
  }
}

type Token = { kind: "num" | "id" | "op"; text: string; col: number };

function tokenize(text: string): Token[] {
  const tokens: Token[] = [];
  const re = /(\d+)|([A-Za-z_][A-Za-z0-9_]*)|([-+*/^()])/y;
  let pos = 0;
  while (pos < text.length) {
    if (/\s/.test(text[pos])) {
      pos++;
      continue;
    }
    re.lastIndex = pos;
    const m = re.exec(text);
    if (!m) throw new PolyParseError(`unexpected character "${text[pos]}"`, pos + 1);
    tokens.push({ kind: m[1] ? "num" : m[2] ? "id" : "op", text: m[0], col: pos + 1 });
    pos = re.lastIndex;
  }
  return tokens;
}

export function parsePoly(text: string, vars: readonly string[]): Poly {
  const tokens = tokenize(text);
  const n = vars.length;
  const index = new Map(vars.map((v, i) => [v, i]));
  let i = 0;
  const peek = () => tokens[i];
  const endCol = text.length + 1;
  const fail = (what: string): never => {
    const t = peek();
    throw new PolyParseError(`expected ${what}, found ${t ? `"${t.text}"` : "end of text"}`, t ? t.col : endCol);
  };

  function constantOf(p: Poly, col: number): Q {
    if (p.size === 0) throw new PolyParseError("division by zero", col);
    const [t] = p.values();
    if (p.size !== 1 || t.exps.some((e) => e !== 0)) throw new PolyParseError("division by a non-constant", col);
    return t.coef;
  }

  function expr(): Poly {
    let acc = unary();
    while (peek()?.text === "+" || peek()?.text === "-") {
      const op = tokens[i++].text;
      const rhs = product();
      acc = op === "+" ? polyAdd(acc, rhs) : polySub(acc, rhs);
    }
    return acc;
  }

  function product(): Poly {
    let acc = power();
    while (peek()?.text === "*" || peek()?.text === "/") {
      const op = tokens[i++];
      const rhs = power();
      acc = op.text === "*" ? polyMul(acc, rhs) : polyScale(acc, qDiv(q(1n), constantOf(rhs, op.col)));
    }
    return acc;
  }

  function unary(): Poly {
    if (peek()?.text === "-") {
      i++;
      return polyNeg(product());
    }
    if (peek()?.text === "+") i++;
    return product();
  }

  function power(): Poly {
    const b = base();
    if (peek()?.text !== "^") return b;
    i++;
    const t = peek();
    if (t?.kind !== "num") return fail("an integer exponent");
    i++;
    return polyPow(b, Number(t.text), n);
  }

  function base(): Poly {
    const t = peek();
    if (!t) return fail("a number, variable or (");
    if (t.kind === "num") {
      i++;
      return polyConst(q(BigInt(t.text)), n);
    }
    if (t.kind === "id") {
      const v = index.get(t.text);
      if (v === undefined) throw new PolyParseError(`unknown variable "${t.text}" (vars: ${vars.join(", ")})`, t.col);
      i++;
      return polyVar(v, n);
    }
    if (t.text === "(") {
      i++;
      const inner = expr();
      if (peek()?.text !== ")") fail('")"');
      i++;
      return inner;
    }
    if (t.text === "-") {
      i++;
      return polyNeg(power());
    }
    return fail("a number, variable or (");
  }

  const result = expr();
  if (i < tokens.length) fail("an operator or end of text");
  return result;
}
