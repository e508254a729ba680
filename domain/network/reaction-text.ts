import { SPECIES_NAME, makeComplex, sameComplex, type Complex } from "./complex";
import type { Arrow } from "./model";

export interface ParsedReaction {
  readonly left: Complex;
  readonly arrow: Arrow;
  readonly right: Complex;
  /** Species in the order they are written. */
  readonly speciesInOrder: readonly string[];
}

export interface ReactionTextProblem {
  readonly message: string;
  readonly expected?: string;
}

export type ReactionTextResult =
  | { readonly ok: true; readonly reaction: ParsedReaction }
  | { readonly ok: false; readonly problems: readonly ReactionTextProblem[] };

const ARROWS = /<->|->|<-/g;
const EXPECTED_ARROW = "one arrow: `->`, `<-` or `<->`, as in `E + S <-> C`";
const EXPECTED_TERM = "a term such as `S`, `2 A` or `2A`, or `0` alone for the empty complex";
const MAX_COEFFICIENT = 1_000_000;

/**
 * Reads arrow notation: `E + S <-> C`, `2 A -> B`, `2A -> B`, `0 -> S`, `P -> 0`, `B <- A`.
 * Repeated species on one side are summed (`A + A` is `2A`). Returns every problem found.
 *
 * Example: parseReactionText("2A + B -> 0") gives left { A: 2, B: 1 }, arrow "->", right {}.
 */
export function parseReactionText(text: string): ReactionTextResult {
  const s = text.trim();
  if (s === "") return { ok: false, problems: [{ message: "empty reaction", expected: "a reaction such as `A + B -> C`" }] };
  const arrows = [...s.matchAll(ARROWS)];
  if (arrows.length === 0) {
    return {
      ok: false,
      problems: [
        /[<>=]/.test(s)
          ? { message: `malformed or unbalanced arrow in \`${s}\``, expected: EXPECTED_ARROW }
          : { message: `no arrow in \`${s}\``, expected: EXPECTED_ARROW },
      ],
    };
  }
  if (arrows.length > 1) {
    return {
      ok: false,
      problems: [{ message: `${arrows.length} arrows in \`${s}\`; write one reaction per row`, expected: EXPECTED_ARROW }],
    };
  }
  const arrow = arrows[0][0] as Arrow;
  const at = arrows[0].index!;
  const leftText = s.slice(0, at);
  const rightText = s.slice(at + arrow.length);
  // Arrow debris next to the arrow (`-->`, `<--`, `->>`) or a second angle/equals sign anywhere.
  if (/[<>=]/.test(leftText + rightText) || /-$/.test(leftText) || /^-/.test(rightText)) {
    return { ok: false, problems: [{ message: `malformed or unbalanced arrow in \`${s}\``, expected: EXPECTED_ARROW }] };
  }
  const problems: ReactionTextProblem[] = [];
  const order: string[] = [];
  const left = parseSide(leftText, "left", problems, order);
  const right = parseSide(rightText, "right", problems, order);
  if (left && right && problems.length === 0 && sameComplex(left, right)) {
    problems.push({
      message: `both sides of \`${s}\` are the same complex`,
      expected: "a reaction that changes its complex",
    });
  }
  if (problems.length > 0 || !left || !right) return { ok: false, problems };
  return { ok: true, reaction: { left, arrow, right, speciesInOrder: order } };
}

function parseSide(text: string, side: "left" | "right", problems: ReactionTextProblem[], order: string[]): Complex | null {
  const t = text.trim();
  if (t === "") {
    problems.push({ message: `the ${side} side of the arrow is empty`, expected: "species, or `0` for the empty complex" });
    return null;
  }
  const parts = t.split("+").map((p) => p.trim());
  if (parts.length === 1 && parts[0] === "0") return makeComplex([]);
  const terms: [string, number][] = [];
  let ok = true;
  for (const part of parts) {
    const term = parseTerm(part, side);
    if ("message" in term) {
      problems.push(term);
      ok = false;
    } else {
      terms.push([term.species, term.coefficient]);
      if (!order.includes(term.species)) order.push(term.species);
    }
  }
  return ok ? makeComplex(terms) : null;
}

function parseTerm(part: string, side: string): { species: string; coefficient: number } | ReactionTextProblem {
  if (part === "") return { message: `empty term on the ${side} side (a stray \`+\`)`, expected: EXPECTED_TERM };
  if (part === "0") return { message: "`0` (the empty complex) must stand alone on its side", expected: EXPECTED_TERM };
  // A leading number-like chunk is the coefficient; the rest must be a species name.
  const m = /^([+-]?[0-9][0-9.,/]*)?\s*(.*)$/s.exec(part)!;
  const coefText = m[1];
  const name = m[2];
  let coefficient = 1;
  if (coefText !== undefined) {
    if (!/^[1-9][0-9]*$/.test(coefText) || Number(coefText) > MAX_COEFFICIENT) {
      return {
        message: `bad stoichiometric coefficient \`${coefText}\` in \`${part}\``,
        expected: `a whole number from 1 to ${MAX_COEFFICIENT}, as in \`2 A\``,
      };
    }
    coefficient = Number(coefText);
  }
  if (name === "") return { message: `coefficient \`${part}\` has no species`, expected: EXPECTED_TERM };
  if (!SPECIES_NAME.test(name)) {
    return {
      message: `bad species name \`${name}\``,
      expected: "a name starting with a letter, then letters, digits or `_` (e.g. `ATP`, `S_p2`), other than a built-in name such as `toString`",
    };
  }
  return { species: name, coefficient };
}
