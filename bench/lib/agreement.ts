/**
 * Checks that the programs printed the same reduced Gröbner basis: every available output is
 * normalised (normalise.ts) and compared as a set with ours, or with SymPy's when ours is
 * missing. Any difference or unreadable output is a disagreement.
 *
 * Example: outputs { ours: ["x - 2"], sympy: ["2*x - 4"] } agree over Q in any order.
 */
import { compareBases, normaliseBasis } from "./normalise";
import type { MonomialOrder } from "./poly";
import type { ToolId } from "./tools";

export interface Agreement {
  readonly status: "agree" | "disagree" | "unchecked";
  readonly basisSizes: Partial<Record<ToolId, number>>;
  readonly details: string[];
}

const SHOWN = 3;

export function checkAgreement(
  outputs: Partial<Record<ToolId, readonly string[]>>,
  vars: readonly string[],
  order: MonomialOrder,
  prime?: bigint,
): Agreement {
  const normalised: Partial<Record<ToolId, string[]>> = {};
  const basisSizes: Partial<Record<ToolId, number>> = {};
  const details: string[] = [];
  for (const [id, lines] of Object.entries(outputs) as [ToolId, readonly string[]][]) {
    try {
      normalised[id] = normaliseBasis(lines, vars, order, prime);
      basisSizes[id] = normalised[id]!.length;
    } catch (e) {
      details.push(`${id}: output not readable as polynomials: ${(e as Error).message}`);
    }
  }
  const ids = Object.keys(normalised) as ToolId[];
  const anchor: ToolId | undefined = ids.includes("ours") ? "ours" : ids[0];
  for (const other of ids) {
    if (!anchor || other === anchor) continue;
    const c = compareBases(normalised[anchor]!, normalised[other]!);
    if (c.equal) continue;
    details.push(
      `${anchor} (${normalised[anchor]!.length} elements) and ${other} (${normalised[other]!.length}) differ: ` +
        `${c.onlyInFirst.length} only in ${anchor}, e.g. ${c.onlyInFirst.slice(0, SHOWN).join(" | ") || "none"}; ` +
        `${c.onlyInSecond.length} only in ${other}, e.g. ${c.onlyInSecond.slice(0, SHOWN).join(" | ") || "none"}`,
    );
  }
  const status = details.length > 0 ? "disagree" : ids.length >= 2 ? "agree" : "unchecked";
  return { status, basisSizes, details };
}
