import { describe, expect, it } from "vitest";
import { lawAsSum, lawsAsEquations } from "~/networks/conservation-text";

describe("conservation laws as sums", () => {
  it("writes coefficients before names in species order, minus signs as −", () => {
    expect(lawAsSum({ C: 1, E: 1 }, ["E", "S", "C"])).toBe("E + C");
    expect(lawAsSum({ B: -1, A: 2 }, ["A", "B"])).toBe("2A − B");
  });
  it("names one total `total` and several `total₁`, `total₂`", () => {
    expect(lawsAsEquations([{ E: 1, C: 1 }], ["E", "C"])).toEqual(["E + C = total"]);
    expect(lawsAsEquations([{ E: 1, C: 1 }, { S: 1, C: 1, P: 1 }], ["E", "S", "C", "P"])).toEqual(["E + C = total₁", "S + C + P = total₂"]);
  });
});
