import { describe, expect, it } from "vitest";
import { singularOrdering, singularScript } from "../../../bench/lib/singular-script";

describe("Singular scripts (orderings as in the Singular manual: lp, Dp, dp)", () => {
  it("maps our orders to Singular's", () => {
    expect(singularOrdering("lex")).toBe("lp");
    expect(singularOrdering("grlex")).toBe("Dp");
    expect(singularOrdering("grevlex")).toBe("dp");
    expect(singularOrdering([{ order: "lex", size: 2 }, { order: "grevlex", size: 3 }])).toBe("(lp(2),dp(3))");
  });
  it("declares the ring, asks for the reduced basis and prints one element per line", () => {
    const script = singularScript({ comments: [], vars: ["x", "y"], order: "grevlex", polys: ["x^2 - y", "x*y - 1/2"] });
    expect(script.split("\n")[0]).toBe("ring r=0,(x,y),dp;");
    expect(script).toContain("option(redSB);");
    expect(script).toContain("ideal i = x^2 - y,\n  x*y - 1/2;");
    expect(script).toContain("print(string(g[k]))");
    expect(singularScript({ comments: [], vars: ["x"], order: "lex", polys: ["x"] }, 32003n)).toMatch(/^ring r=32003,\(x\),lp;/);
  });
});
