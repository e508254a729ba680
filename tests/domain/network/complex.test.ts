import { describe, expect, it } from "vitest";
import { formatComplex, makeComplex, sameComplex } from "../../../domain/network";

describe("complexes", () => {
  it("sum repeats, sort keys and print canonically", () => {
    const c = makeComplex([["S", 1], ["E", 1], ["S", 1]]);
    expect(c).toEqual({ E: 1, S: 2 });
    expect(Object.keys(c)).toEqual(["E", "S"]);
    expect(formatComplex(c)).toBe("E + 2S");
    expect(formatComplex({})).toBe("0");
    expect(formatComplex(c, ["S", "E"])).toBe("2S + E");
    expect(sameComplex({ A: 1, B: 1 }, makeComplex([["B", 1], ["A", 1]]))).toBe(true);
    expect(sameComplex({ A: 1 }, { A: 2 })).toBe(false);
  });
});
