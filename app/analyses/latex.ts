/**
 * Polynomials and rational expressions in the CLI's syntax (`k1*A^2 - 3/2*B`) as LaTeX, through
 * mathjs' parser (server side only). Species and rate names keep their exact spelling
 * (k12 stays k12: a subscript would make S0 and S0K look unrelated).
 */
import { parse, type MathNode } from "mathjs";

/** Names as upright words (\mathrm{ES} is one species, never E times S). */
export function nameTex(name: string): string {
  return `\\mathrm{${name.replace(/_/g, "\\_")}}`;
}

const handler = (node: MathNode) => (node.type === "SymbolNode" ? nameTex((node as unknown as { name: string }).name) : undefined);

/** Example: toTex("X^3 - 6*X^2") is "{\mathrm{X}}^{3}-6\,{\mathrm{X}}^{2}"; toTex("E*S") is "\mathrm{E}\cdot\mathrm{S}". Unparseable text comes back as \text{…}. */
export function toTex(expression: string): string {
  try {
    // A product of names keeps its explicit sign (E·S, never ES); only a number before a factor
    // gets the thin space of ordinary typesetting (6\,X²).
    return parse(expression).toTex({ handler, parenthesis: "auto", implicit: "hide" }).replace(/(\d)\\cdot/g, "$1\\,");
  } catch {
    return `\\text{${expression.replace(/[{}\\]/g, "")}}`;
  }
}

/** Names (species and parameters) in an expression, in order of first use. Example: "k1*A/(k2 + A)" gives [k1, A, k2]. */
export function namesIn(expression: string): string[] {
  return [...new Set(expression.match(/[A-Za-z_][A-Za-z0-9_]*/g) ?? [])];
}

/**
 * Total degree in the given variables, of the numerator or the denominator, whichever is larger
 * (the usual degree of a rational function). Example: degreeIn("S0*E^2*k1/(F*l3)", ["S0","E","F"]) is 3.
 */
export function degreeIn(expression: string, variables: readonly string[]): number {
  const vars = new Set(variables);
  const walk = (node: MathNode): { num: number; den: number } => {
    const n = node as unknown as { type: string; name?: string; op?: string; fn?: string; args?: MathNode[]; content?: MathNode; value?: unknown };
    switch (n.type) {
      case "SymbolNode":
        return { num: vars.has(n.name!) ? 1 : 0, den: 0 };
      case "ConstantNode":
        return { num: 0, den: 0 };
      case "ParenthesisNode":
        return walk(n.content!);
      case "OperatorNode": {
        const a = n.args!.map(walk);
        if (n.op === "*") return a.reduce((x, y) => ({ num: x.num + y.num, den: x.den + y.den }));
        if (n.op === "/") return { num: a[0].num + a[1].den, den: a[0].den + a[1].num };
        if (n.op === "^") {
          const e = Number((n.args![1] as unknown as { value?: unknown }).value ?? 1);
          return { num: a[0].num * e, den: a[0].den * e };
        }
        return a.reduce((x, y) => ({ num: Math.max(x.num, y.num), den: Math.max(x.den, y.den) }));
      }
      default:
        return { num: 0, den: 0 };
    }
  };
  try {
    const d = walk(parse(expression));
    return Math.max(d.num, d.den);
  } catch {
    return NaN;
  }
}
