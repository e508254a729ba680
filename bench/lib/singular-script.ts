/**
 * Builds the Singular script for one bench system: `ring r=0,(vars),dp;` (lp for lex, Dp for
 * grlex, dp for grevlex, `(lp(2),dp(3))` for blocks; characteristic p with `--field p`),
 * `std` with option(redSB) so the result is the reduced basis like ours and SymPy's, and one
 * basis element per output line (`short=0` keeps `x^2*y` syntax).
 * Orderings as in the Singular manual, "Monomial orderings" (lp, Dp, dp).
 *
 * Example: singularScript({vars:["x","y"], order:"lex", polys:["x - y"], comments:[]}) starts
 * with "ring r=0,(x,y),lp;".
 */
import type { MonomialOrder, SimpleOrder } from "./poly";
import { monomialOrderOf, type SystemFile } from "./system-file";

const SINGULAR_ORDER: Record<SimpleOrder, string> = { lex: "lp", grlex: "Dp", grevlex: "dp" };

export function singularOrdering(order: MonomialOrder): string {
  if (typeof order === "string") return SINGULAR_ORDER[order];
  return `(${order.map((b) => `${SINGULAR_ORDER[b.order]}(${b.size})`).join(",")})`;
}

export function singularScript(system: SystemFile, prime?: bigint): string {
  const order = singularOrdering(monomialOrderOf(system));
  return [
    `ring r=${prime ?? 0},(${system.vars.join(",")}),${order};`,
    "short=0;",
    "option(redSB); option(redTail);",
    `ideal i = ${system.polys.join(",\n  ")};`,
    "ideal g = std(i);",
    "int k;",
    "for (k=1; k<=size(g); k++) { print(string(g[k])); }",
    "quit;",
    "",
  ].join("\n");
}
