import { describe, expect, it } from "vitest";
import { QQ } from "@domain/algebra/field";
import { fieldFromFlag, parseSystemFile } from "@domain/cli/system-file";

describe("parseSystemFile", () => {
  it("reads comments, blank lines, vars and order, then one polynomial per line with its file line", () => {
    const f = parseSystemFile("# a system\n\nvars: x, y\norder: lex\nx^2 - y\n\ny - 1\n", QQ);
    expect(f.ring.vars).toEqual(["x", "y"]);
    expect(f.ring.orderName).toBe("lex");
    expect(f.polys.map((p) => f.ring.format(p))).toEqual(["x^2 - y", "y - 1"]);
    expect(f.lines).toEqual([5, 7]);
  });
  it("defaults to grevlex", () => {
    expect(parseSystemFile("vars: x\nx - 1\n", QQ).ring.orderName).toBe("grevlex");
  });
  it("locates header mistakes by line and column", () => {
    expect(() => parseSystemFile("vars: x, 2y\n", QQ)).toThrow(/bad variable name '2y'.*line 1/);
    expect(() => parseSystemFile("vars: x, x\n", QQ)).toThrow(/variable 'x' listed twice/);
    expect(() => parseSystemFile("vars: x\nvars: y\n", QQ)).toThrow(/'vars:' given twice/);
    expect(() => parseSystemFile("vars: x\nx\norder: lex\n", QQ)).toThrow(/'order:' must come before the first polynomial/);
  });
});

describe("fieldFromFlag", () => {
  it("is Q without the flag, Z/p with a prime, and a CLI error otherwise", () => {
    expect(fieldFromFlag(undefined)).toBe(QQ);
    expect((fieldFromFlag("7") as { p?: number }).p).toBe(7);
    expect(() => fieldFromFlag("seven")).toThrow("--field expects a prime number, got 'seven'");
    expect(() => fieldFromFlag("8")).toThrow(/^--field: /);
  });
});
