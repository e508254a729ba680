import type { Polynomial } from "./polynomial";

/**
 * TeX of a polynomial, the typeset twin of format.ts's canonical text: the same terms in the same
 * order, names upright (`\mathrm{ES}` is one species, never E times S; k12 stays k12, since a
 * subscript would make S0 and S0K look unrelated), products of names with an explicit `\cdot`, a
 * number before a factor with the thin space of ordinary typesetting, fractions as `\frac`.
 * Example: `x^3 - 6*x^2 - 3/2*x*y` gives `\mathrm{x}^{3}-6\,\mathrm{x}^{2}-\frac{3}{2}\,\mathrm{x}\cdot\mathrm{y}`.
 * The zero polynomial is `0`. Over Z/p coefficients are in the symmetric range, as in the text.
 */
export function polynomialTex<C>(p: Polynomial<C>): string {
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
      if (e === 1) factors.push(nameTex(ring.vars[k]));
      else if (e > 1) factors.push(`${nameTex(ring.vars[k])}^{${e}}`);
    }
    const mono = factors.join("\\cdot");
    let body: string;
    if (mono === "") body = numberTex(F.format(abs));
    else if (F.isOne(abs)) body = mono;
    else body = `${numberTex(F.format(abs))}\\,${mono}`;
    out += negative ? `-${body}` : i === 0 ? body : `+${body}`;
  }
  return out;
}

/** A name (species, rate constant, total) as an upright word; `_` escaped. Example: nameTex("k_on") is `\mathrm{k\_on}`. */
export function nameTex(name: string): string {
  return `\\mathrm{${name.replace(/_/g, "\\_")}}`;
}

/** A number in the field's text (`3`, `3/2`) as TeX: `3`, `\frac{3}{2}`. */
export function numberTex(text: string): string {
  const m = /^(-?)(\d+)\/(\d+)$/.exec(text);
  return m ? `${m[1]}\\frac{${m[2]}}{${m[3]}}` : text;
}
