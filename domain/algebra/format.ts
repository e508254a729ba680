import type { Polynomial } from "./polynomial";

/**
 * Canonical text of a polynomial: terms in decreasing order, `*` between factors, `^` for
 * powers, fractions `a/b`, coefficient 1 omitted, signs as ` + ` / ` - `.
 * Example: `x^2*y - 3/2*z + 1`; the zero polynomial is `0`. Over Z/p coefficients are printed
 * in the symmetric range (-p/2, p/2], as SymPy and Singular do.
 */
export function formatPolynomial<C>(p: Polynomial<C>): string {
  const { ring } = p;
  const F = ring.field, S = ring.stride, n = ring.n;
  if (p.coeffs.length === 0) return "0";
  let out = "";
  for (let i = 0; i < p.coeffs.length; i++) {
    const c = p.coeffs[i];
    const negative = F.isNegative(c);
    const abs = negative ? F.neg(c) : c;
    const factors: string[] = [];
    for (let k = 0; k < n; k++) {
      const e = p.exps[i * S + 1 + k];
      if (e === 1) factors.push(ring.vars[k]);
      else if (e > 1) factors.push(`${ring.vars[k]}^${e}`);
    }
    const mono = factors.join("*");
    let body: string;
    if (mono === "") body = F.format(abs);
    else if (F.isOne(abs)) body = mono;
    else body = `${F.format(abs)}*${mono}`;
    if (i === 0) out = negative ? `-${body}` : body;
    else out += negative ? ` - ${body}` : ` + ${body}`;
  }
  return out;
}
