import { describe, expect, it } from "vitest";
import { formatSystemFile, monomialOrderOf, parseOrderBlocks, parseSystemFile, SystemFileError } from "../../../bench/lib/system-file";

describe("system files (CLI input format of issue 3)", () => {
  it("round-trips comments, vars, order and polynomials", () => {
    const s = { comments: ["demo"], vars: ["x", "y"], order: "lex", polys: ["x - y", "y^2 - 1"] };
    const text = formatSystemFile(s);
    expect(text).toBe("# demo\nvars: x, y\norder: lex\nx - y\ny^2 - 1\n");
    expect(parseSystemFile(text)).toEqual(s);
  });
  it("reads block orders from the highest variable", () => {
    expect(parseOrderBlocks("lex(2), grevlex(3)", 5)).toEqual([
      { order: "lex", size: 2 },
      { order: "grevlex", size: 3 },
    ]);
    expect(parseOrderBlocks("lex(2), grevlex(2)", 5)).toBeUndefined();
    expect(parseOrderBlocks("revlex", 2)).toBeUndefined();
    expect(monomialOrderOf(parseSystemFile("vars: a, b\norder: grlex\na\n"))).toBe("grlex");
  });
  it("names the line of a problem", () => {
    const lineOf = (text: string) => {
      try {
        parseSystemFile(text);
      } catch (e) {
        expect(e).toBeInstanceOf(SystemFileError);
        return (e as SystemFileError).line;
      }
      throw new Error("no error");
    };
    expect(lineOf("# c\nx + 1\nvars: x\norder: lex\n")).toBe(2);
    expect(lineOf("vars: x, 2y\norder: lex\n")).toBe(1);
    expect(lineOf("vars: x\norder: lex\norder: grlex\n")).toBe(3);
  });
});
