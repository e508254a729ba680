import { describe, expect, it } from "vitest";
import { checkAgreement } from "../../../bench/lib/agreement";

describe("checkAgreement", () => {
  const vars = ["x", "y"];
  it("accepts the same reduced basis printed three ways", () => {
    const a = checkAgreement({ ours: ["x - 2", "y^2 + 1/2"], sympy: ["y^2 + 1/2", "x - 2"], singular: ["2*y^2+1", "x-2"] }, vars, "lex");
    expect(a.status).toBe("agree");
    expect(a.basisSizes).toEqual({ ours: 2, sympy: 2, singular: 2 });
  });
  it("flags a different basis and names what differs", () => {
    const a = checkAgreement({ ours: ["x - 2"], sympy: ["x - 2", "y"] }, vars, "lex");
    expect(a.status).toBe("disagree");
    expect(a.details[0]).toContain("1 only in sympy, e.g. y");
  });
  it("flags unreadable output and leaves a single output unchecked", () => {
    expect(checkAgreement({ ours: ["x +"], sympy: ["x"] }, vars, "lex").status).toBe("disagree");
    expect(checkAgreement({ sympy: ["x"] }, vars, "lex").status).toBe("unchecked");
  });
});
