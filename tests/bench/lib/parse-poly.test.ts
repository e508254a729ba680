import { describe, expect, it } from "vitest";
import { parsePoly, PolyParseError } from "../../../bench/lib/parse-poly";
import { canonical } from "../../../bench/lib/poly";

const vars = ["x", "y", "z"];
const canon = (text: string) => canonical(parsePoly(text, vars), vars, "grevlex");

describe("parsePoly", () => {
  it("reads our syntax, Singular's (no spaces, integer content) and SymPy's printer output", () => {
    expect(canon("x^2 - 3/2*x*y + 1")).toBe("x^2 - 3/2*x*y + 1");
    expect(canon("4*x^2-6*x*y+3")).toBe("4*x^2 - 6*x*y + 3");
    expect(canon("-x + y^2")).toBe("y^2 - x");
  });
  it("expands products, powers and parentheses exactly", () => {
    expect(canon("(x + y)^2 - (x - y)^2")).toBe("4*x*y");
    expect(canon("2/3*(3*x - 6/4)")).toBe("2*x - 1");
    expect(canon("x*-y")).toBe("-x*y");
    expect(canon("-x^2")).toBe("-x^2");
    expect(canon("x - x")).toBe("0");
  });
  it("reports the column of what is wrong", () => {
    const at = (text: string) => {
      try {
        parsePoly(text, vars);
      } catch (e) {
        expect(e).toBeInstanceOf(PolyParseError);
        return (e as PolyParseError).column;
      }
      throw new Error("no error");
    };
    expect(at("x + w")).toBe(5);
    expect(at("x + $")).toBe(5);
    expect(at("x / y")).toBe(3);
    expect(at("x / 0")).toBe(3);
    expect(at("(x + y")).toBe(7);
    expect(at("x y")).toBe(3);
    expect(at("x^y")).toBe(3);
  });
});
