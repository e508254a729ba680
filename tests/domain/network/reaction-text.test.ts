import { describe, expect, it } from "vitest";
import { formatComplex, parseReactionText } from "../../../domain/network";

const ok = (text: string) => {
  const r = parseReactionText(text);
  if (!r.ok) throw new Error(r.problems.map((p) => p.message).join("; "));
  return r.reaction;
};

describe("parseReactionText", () => {
  it("reads arrows, coefficients in both forms and the empty complex", () => {
    const a = ok("E + S <-> C");
    expect([formatComplex(a.left), a.arrow, formatComplex(a.right)]).toEqual(["E + S", "<->", "C"]);
    expect(ok("2 A -> B").left).toEqual({ A: 2 });
    expect(ok("2A -> B").left).toEqual({ A: 2 });
    expect(ok("0 -> S").left).toEqual({});
    expect(formatComplex(ok("P -> 0").right)).toBe("0");
    expect(ok("B <- A").arrow).toBe("<-");
    expect(ok("A+A->B").left).toEqual({ A: 2 });
    expect(ok("12 X_1 -> Y2").left).toEqual({ X_1: 12 });
  });

  it("keeps written species order and sorts complex keys", () => {
    const r = ok("S + E -> C");
    expect(r.speciesInOrder).toEqual(["S", "E", "C"]);
    expect(Object.keys(r.left)).toEqual(["E", "S"]);
    expect(formatComplex(r.left)).toBe("E + S");
  });

  it("species names are case-sensitive; `2E` is a coefficient and a species", () => {
    expect(ok("a + A -> B").left).toEqual({ A: 1, a: 1 });
    expect(ok("2E -> F").left).toEqual({ E: 2 });
  });

  it.each([
    ["", "empty reaction"],
    ["A B", "no arrow"],
    ["A ->> B", "malformed"],
    ["A <-- B", "malformed"],
    ["A -> B <- C", "2 arrows"],
    ["A -> ", "right side of the arrow is empty"],
    ["1/2 A -> B", "bad stoichiometric coefficient"],
    ["A -> B-C", "bad species name `B-C`"],
    ["A -> A", "same complex"],
    ["0 -> 0", "same complex"],
  ])("rejects %j (%s)", (text, message) => {
    const r = parseReactionText(text);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems.map((p) => p.message).join("; ")).toContain(message);
  });

  it("reports every bad term of a reaction", () => {
    const r = parseReactionText("1.5A + _B -> 0C");
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems).toHaveLength(3);
  });
});
