import type { Polynomial } from "./polynomial";

/**
 * Canonical text of a polynomial: terms in decreasing order, `*` between factors, `^` for
 * powers, fractions `a/b`, coefficient 1 omitted, signs as ` + ` / ` - `.
 * Example: `x^2*y - 3/2*z + 1`; the zero polynomial is `0`. Over Z/p coefficients are printed
 * in the symmetric range (-p/2, p/2], as SymPy and Singular do.
 */
export function formatPolynomial<C>(p: Polynomial<C>): string {
  return printedTerms(p)
    .map((t, i) => {
      const mono = t.factors.map((f) => (f.power === 1 ? f.name : `${f.name}^${f.power}`)).join("*");
      const body = mono === "" ? t.magnitude : t.unit ? mono : `${t.magnitude}*${mono}`;
      return i === 0 ? (t.negative ? `-${body}` : body) : t.negative ? ` - ${body}` : ` + ${body}`;
    })
    .join("") || "0";
}

/** One term as printers see it: its sign, the magnitude of its coefficient as text, and its factors. */
export interface PrintedTerm {
  readonly negative: boolean;
  /** The coefficient's absolute value in the field's text (`3`, `3/2`). */
  readonly magnitude: string;
  /** The magnitude is 1 (omitted before a monomial). */
  readonly unit: boolean;
  readonly factors: readonly { readonly name: string; readonly power: number }[];
}

/**
 * The terms of p in its order, read from the packed exponents (the one reader the text and the
 * TeX printer share, format.ts and format-tex.ts). Example: 2*x^2*y - 1 gives
 * [{ +, "2", x^2·y }, { −, "1", no factors }].
 */
export function printedTerms<C>(p: Polynomial<C>): PrintedTerm[] {
  const { ring } = p;
  const F = ring.field, S = ring.stride, n = ring.n;
  const out: PrintedTerm[] = [];
  for (let i = 0; i < p.coeffs.length; i++) {
    const c = p.coeffs[i];
    const negative = F.isNegative(c);
    const abs = negative ? F.neg(c) : c;
    const factors: { name: string; power: number }[] = [];
    for (let k = 0; k < n; k++) {
      const e = p.exps[i * S + 1 + k];
      if (e > 0) factors.push({ name: ring.vars[k], power: e });
    }
    out.push({ negative, magnitude: F.format(abs), unit: F.isOne(abs), factors });
  }
  return out;
}
