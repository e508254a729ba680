import { printedTerms } from "./format";
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
  return printedTerms(p)
    .map((t, i) => {
      const mono = t.factors.map((f) => (f.power === 1 ? nameTex(f.name) : `${nameTex(f.name)}^{${f.power}}`)).join("\\cdot");
      const body = mono === "" ? numberTex(t.magnitude) : t.unit ? mono : `${numberTex(t.magnitude)}\\,${mono}`;
      return t.negative ? `-${body}` : i === 0 ? body : `+${body}`;
    })
    .join("") || "0";
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
