import { add, div, fromInt, isZero, mul, neg, parseRational, rational, type Rational, ONE } from "../../algebra/rational";
import { textOf, type XmlElement } from "./xml-tree";

/**
 * Content MathML as SBML uses it for kinetic laws, read into an exact Laurent polynomial (a sum of
 * rational multiples of products of symbols to integer powers). Only `plus`, `minus`, `times`,
 * `divide` (by a single term), `power` (integer exponents) and numbers and names are read; anything
 * else (functions, `exp`, `piecewise`, time) is reported, because it is not a polynomial rate law.
 * Follows the MathML 2.0 content markup subset of the SBML Level 3 Version 2 Core specification, section 3.4.
 *
 * Example: <apply><minus/><apply><times/><ci>kf</ci><ci>A</ci></apply><apply><times/><ci>kr</ci><ci>B</ci></apply></apply>
 * reads as kf·A − kr·B: [{ coefficient: 1, powers: {kf: 1, A: 1} }, { coefficient: −1, powers: {kr: 1, B: 1} }].
 */
export interface Monomial {
  readonly coefficient: Rational;
  /** Symbol → non-zero integer exponent. */
  readonly powers: ReadonlyMap<string, number>;
}

export type Polynomial = readonly Monomial[];

export class MathError extends Error {}

const MAX_EXPONENT = 64;

/** Reads the `<math>` element (or any content element) into a polynomial; throws MathError with the reason. */
export function readMathPolynomial(math: XmlElement): Polynomial {
  const body = math.name === "math" ? math.children : [math];
  if (body.length !== 1) throw new MathError(`has ${body.length} expressions inside <math> instead of one`);
  return [...expr(body[0]).values()].filter((m) => !isZero(m.coefficient));
}

type Poly = Map<string, Monomial>;

const keyOf = (powers: ReadonlyMap<string, number>): string =>
  [...powers.entries()].sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)).map(([s, p]) => `${s}^${p}`).join("*");

const constant = (c: Rational): Poly => new Map([["", { coefficient: c, powers: new Map() }]]);
const symbol = (s: string): Poly => {
  const powers = new Map([[s, 1]]);
  return new Map([[keyOf(powers), { coefficient: ONE, powers }]]);
};

function addPoly(a: Poly, b: Poly): Poly {
  const out = new Map(a);
  for (const [k, m] of b) {
    const seen = out.get(k);
    const c = seen ? add(seen.coefficient, m.coefficient) : m.coefficient;
    if (isZero(c)) out.delete(k);
    else out.set(k, { coefficient: c, powers: m.powers });
  }
  return out;
}

const negPoly = (a: Poly): Poly => new Map([...a].map(([k, m]) => [k, { coefficient: neg(m.coefficient), powers: m.powers }]));

function mulPoly(a: Poly, b: Poly): Poly {
  let out: Poly = new Map();
  for (const x of a.values()) {
    for (const y of b.values()) {
      const powers = new Map(x.powers);
      for (const [s, p] of y.powers) {
        const q = (powers.get(s) ?? 0) + p;
        if (q === 0) powers.delete(s);
        else powers.set(s, q);
      }
      out = addPoly(out, new Map([[keyOf(powers), { coefficient: mul(x.coefficient, y.coefficient), powers }]]));
    }
  }
  return out;
}

function invertTerm(a: Poly): Poly {
  const terms = [...a.values()];
  if (terms.length !== 1) throw new MathError("divides by a sum (the law is not a polynomial, as in Michaelis–Menten kinetics)");
  const t = terms[0];
  if (isZero(t.coefficient)) throw new MathError("divides by zero");
  const powers = new Map([...t.powers].map(([s, p]) => [s, -p]));
  return new Map([[keyOf(powers), { coefficient: div(ONE, t.coefficient), powers }]]);
}

function expr(e: XmlElement): Poly {
  switch (e.name) {
    case "cn":
      return constant(readNumber(e));
    case "ci": {
      const name = textOf(e);
      if (name === "") throw new MathError("has an empty <ci>");
      return symbol(name);
    }
    case "apply":
      return apply(e);
    case "semantics":
      // The first child is the expression; annotations beside it do not change its value.
      if (e.children.length === 0) throw new MathError("has an empty <semantics>");
      return expr(e.children[0]);
    case "csymbol":
      throw new MathError(`uses the symbol \`${textOf(e) || e.attrs.definitionURL}\` (time, delay or another built-in), which mass action does not`);
    default:
      throw new MathError(`uses <${e.name}>, which is not part of a mass-action rate law`);
  }
}

function apply(e: XmlElement): Poly {
  const [op, ...args] = e.children;
  if (op === undefined) throw new MathError("has an empty <apply>");
  const vals = () => args.map(expr);
  switch (op.name) {
    case "plus":
      return vals().reduce(addPoly, new Map());
    case "times":
      return vals().reduce(mulPoly, constant(ONE));
    case "minus": {
      const v = vals();
      if (v.length === 1) return negPoly(v[0]);
      if (v.length === 2) return addPoly(v[0], negPoly(v[1]));
      throw new MathError(`has <minus/> with ${v.length} arguments`);
    }
    case "divide": {
      const v = vals();
      if (v.length !== 2) throw new MathError(`has <divide/> with ${v.length} arguments`);
      return mulPoly(v[0], invertTerm(v[1]));
    }
    case "power": {
      const v = vals();
      if (v.length !== 2) throw new MathError(`has <power/> with ${v.length} arguments`);
      const exps = [...v[1].values()];
      const ex = exps.length === 0 ? fromInt(0) : exps.length === 1 && exps[0].powers.size === 0 ? exps[0].coefficient : null;
      if (ex === null || ex.den !== 1n) throw new MathError("has a power whose exponent is not a whole number");
      const n = Number(ex.num);
      if (Math.abs(n) > MAX_EXPONENT) throw new MathError(`has the exponent ${n}, beyond ${MAX_EXPONENT}`);
      let base = n < 0 ? invertTerm(v[0]) : v[0];
      let out = constant(ONE);
      for (let i = 0; i < Math.abs(n); i++) out = mulPoly(out, base);
      base = out;
      return base;
    }
    case "ci":
      throw new MathError(`calls the function \`${textOf(op)}\`; only plain mass-action products are read`);
    default:
      throw new MathError(`uses <${op.name}/>, which is not part of a mass-action rate law`);
  }
}

/** `<cn>` of type integer, real (default), e-notation (`m<sep/>e`) or rational (`p<sep/>q`), read exactly. */
export function readNumber(e: XmlElement): Rational {
  const type = e.attrs.type ?? "real";
  const parts = e.items.filter((x): x is string => typeof x === "string").map((s) => s.trim());
  const bad = () => new MathError(`has a number that cannot be read, <cn type="${type}">${parts.join(" <sep/> ")}</cn>`);
  if (type === "rational" || type === "e-notation") {
    if (parts.length !== 2) throw bad();
    const a = parseRational(parts[0]);
    const b = parseRational(parts[1]);
    if (a === null || b === null || b.den !== 1n) throw bad();
    if (type === "rational") {
      if (a.den !== 1n || b.num === 0n) throw bad();
      return rational(a.num, b.num);
    }
    const exp = b.num;
    return exp >= 0n ? mul(a, fromInt(10n ** exp)) : div(a, fromInt(10n ** -exp));
  }
  if (type !== "real" && type !== "integer" && type !== "double") throw bad();
  const v = parts.length === 1 ? parseRational(parts[0]) : null;
  if (v === null) throw bad();
  if (type === "integer" && v.den !== 1n) throw bad();
  return v;
}

/** `<cn>` text for an exact value: an integer, an exact decimal, or `p<sep/>q` as type rational. */
export function writeNumber(v: Rational): string {
  if (v.den === 1n) return `<cn type="integer">${v.num}</cn>`;
  const d = exactDecimal(v);
  if (d !== null) return `<cn>${d}</cn>`;
  return `<cn type="rational">${v.num}<sep/>${v.den}</cn>`;
}

/** The exact decimal text of a rational whose denominator is 2^a·5^b, else null. Example: 3/8 → "0.375". */
export function exactDecimal(v: Rational): string | null {
  let den = v.den;
  let twos = 0;
  let fives = 0;
  while (den % 2n === 0n) {
    den /= 2n;
    twos++;
  }
  while (den % 5n === 0n) {
    den /= 5n;
    fives++;
  }
  if (den !== 1n) return null;
  const digits = Math.max(twos, fives);
  const scaled = (v.num * 10n ** BigInt(digits)) / v.den;
  const negative = scaled < 0n;
  const s = (negative ? -scaled : scaled).toString().padStart(digits + 1, "0");
  const text = digits === 0 ? s : `${s.slice(0, s.length - digits)}.${s.slice(s.length - digits)}`;
  return (negative ? "-" : "") + text;
}
