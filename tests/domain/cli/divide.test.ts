import { describe, expect, it } from "vitest";
import { cli } from "./run-cli";

describe("cli divide", () => {
  it("divides by the divisors in order (Cox, Little & O'Shea, ch. 2 §3, Example 1: x*y^2 + 1 by x*y + 1, y + 1)", async () => {
    const r = await cli(["divide", "d.txt"], { "d.txt": "vars: x, y\norder: lex\nx*y^2 + 1\nx*y + 1\ny + 1\n" });
    expect(r.code).toBe(0);
    // q1 = y, q2 = -1, r = 2 (the book's worked answer; SymPy reduced agrees).
    expect(r.out).toBe("q1 = y\nq2 = -1\nr = 2\n");
  });
  it("refuses a missing divisor and the zero divisor, with the line", async () => {
    expect((await cli(["divide", "d.txt"], { "d.txt": "vars: x\nx^2\n" })).err).toMatch(/needs a dividend and at least one divisor/);
    expect((await cli(["divide", "d.txt"], { "d.txt": "vars: x\nx^2\n0\n" })).err).toMatch(/division by the zero polynomial at line 3, column 1/);
  });
  it("works over Z/p with --field and refuses a non-prime", async () => {
    const r = await cli(["divide", "d.txt", "--field", "5"], { "d.txt": "vars: x\n3*x^2 + 1\n2*x\n" });
    // 3/2 = 4 ≡ -1 (mod 5), printed as the symmetric residue: (-x)(2x) = -2x^2 ≡ 3x^2.
    expect(r.out).toBe("q1 = -x\nr = 1\n");
    expect((await cli(["divide", "d.txt", "--field", "6"], { "d.txt": "vars: x\nx\nx\n" })).code).not.toBe(0);
  });
});
