import { execFile } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { promisify } from "node:util";
import { describe, expect, it } from "vitest";
import { cli } from "./run-cli";


const CLO_271 = "# Cox, Little, O'Shea, ch. 2 §7, Example 1\nvars: x, y\norder: grlex\nx^3 - 2*x*y\nx^2*y - 2*y^2 + x\n";

describe("cli groebner", () => {
  it("prints the reduced basis, monic, by increasing leading monomial", async () => {
    const r = await cli(["groebner", "sys.txt"], { "sys.txt": CLO_271 });
    expect(r).toEqual({ code: 0, out: "y^2 - 1/2*x\nx*y\nx^2\n", err: "" });
  });
  it("computes over Z/p with --field", async () => {
    const r = await cli(["groebner", "sys.txt", "--field", "7"], { "sys.txt": CLO_271 });
    expect(r.out).toBe("y^2 + 3*x\nx*y\nx^2\n"); // -1/2 = 3 mod 7
    expect((await cli(["groebner", "--field=7", "sys.txt"], { "sys.txt": CLO_271 })).out).toBe(r.out);
  });
  it("accepts block orders and defaults to grevlex", async () => {
    const sys = "vars: t, x, y\norder: lex(1), grevlex(2)\nx - t^2\ny - t^3\n";
    const r = await cli(["groebner", "s"], { s: sys });
    expect(r.code).toBe(0);
    expect(r.out.split("\n")).toContain("x^3 - y^2");
    const d = await cli(["groebner", "s"], { s: "vars: x, y\nx*z\n".replace("z", "y") });
    expect(d.out).toBe("x*y\n");
  });
});

describe("cli divide", () => {
  it("prints quotients and remainder (CLO ch. 2 §3, Example 2)", async () => {
    const sys = "vars: x, y\norder: lex\n# dividend, then divisors in order\nx^2*y + x*y^2 + y^2\nx*y - 1\ny^2 - 1\n";
    const r = await cli(["divide", "d.txt"], { "d.txt": sys });
    expect(r).toEqual({ code: 0, out: "q1 = x + y\nq2 = 1\nr = x + y + 1\n", err: "" });
  });
});

describe("cli errors go to stderr with exit code 2", () => {
  const cases: [string, string[], Record<string, string>, RegExp][] = [
    ["parse error with line and column", ["groebner", "f"], { f: "vars: x, y\n\nx +* y\n" }, /line 3, column 4/],
    ["unknown variable", ["groebner", "f"], { f: "vars: x, y\nx + q\n" }, /unknown variable 'q'.*line 2, column 5/],
    ["bad order", ["groebner", "f"], { f: "vars: x, y\norder: lexx\nx\n" }, /unknown order 'lexx'.*line 2, column 8/],
    ["order blocks not matching vars", ["groebner", "f"], { f: "vars: x, y\norder: lex(3)\nx\n" }, /cover 3 variables/],
    ["missing vars", ["groebner", "f"], { f: "x + y\n" }, /before the 'vars:' line.*line 1, column 1/],
    ["missing file", ["groebner", "nope"], {}, /cannot read nope: ENOENT/],
    ["not a prime", ["groebner", "f", "--field", "12"], { f: CLO_271 }, /12 is not a prime/],
    ["unknown option", ["groebner", "f", "--fast"], { f: CLO_271 }, /unknown option --fast/],
    ["unknown command", ["factor", "f"], {}, /unknown command 'factor'/],
    ["divide without divisor", ["divide", "f"], { f: "vars: x\nx^2\n" }, /at least one divisor/],
    ["division by zero polynomial", ["divide", "f"], { f: "vars: x\nx^2\n0\n" }, /zero polynomial at line 3/],
    ["denominator not invertible mod p", ["groebner", "f", "--field", "7"], { f: "vars: x\nx - 1/7\n" }, /division by zero.*line 2, column 6/],
    // Fuzz inputs from the drill (issue 16 #1): located errors, never a raw RangeError or minutes of work.
    ["deep parentheses", ["groebner", "f"], { f: `vars: x\n${"(".repeat(20000)}x${")".repeat(20000)}\n` }, /nesting deeper than 200 levels.*line 2, column 201/],
    ["a long chain of signs", ["groebner", "f"], { f: `vars: x\n${"-".repeat(20000)}x\n` }, /nesting deeper than 200 levels.*line 2/],
    ["power of a sum too large to expand", ["groebner", "f"], { f: "vars: x\n(x+1)^3000\n" }, /degree 3000 when expanded.*line 2, column 7/],
    ["number with a huge exponent", ["groebner", "f"], { f: "vars: x\nx - 1e99999999999\n" }, /too large to work with exactly.*line 2, column 5/],
    ["exponent past 32 bits", ["groebner", "f"], { f: "vars: x\nx^4294967296\n" }, /exponent 4294967296 is too large.*line 2, column 3/],
    ["monomial degree overflow by nested powers", ["groebner", "f"], { f: "vars: x\n(x^1000000)^1000000\n" }, /degree 1000000000000.*line 2/],
  ];
  for (const [name, argv, files, msg] of cases) {
    it(name, async () => {
      const r = await cli(argv, files);
      expect(r.code).toBe(2);
      expect(r.out).toBe("");
      expect(r.err).toMatch(/^error: /);
      expect(r.err).toMatch(msg);
    });
  }
});

describe("cli as a whole process (npm run -s cli)", () => {
  const run = promisify(execFile);
  const dir = mkdtempSync(join(tmpdir(), "stillpoint-cli-"));
  it("exit 0 with the basis on stdout, exit 2 with the error on stderr", async () => {
    writeFileSync(join(dir, "ok.txt"), CLO_271);
    writeFileSync(join(dir, "bad.txt"), "vars: x\nx^\n");
    const ok = await run("npm", ["run", "-s", "cli", "--", "groebner", join(dir, "ok.txt")]);
    expect(ok.stdout).toBe("y^2 - 1/2*x\nx*y\nx^2\n");
    const bad = await run("npm", ["run", "-s", "cli", "--", "groebner", join(dir, "bad.txt")]).then(
      () => ({ code: 0, stderr: "", stdout: "" }),
      (e: { code: number; stderr: string; stdout: string }) => e,
    );
    expect(bad.code).toBe(2);
    expect(bad.stdout).toBe("");
    expect(bad.stderr).toMatch(/^error: .*line 2, column 3/);
  }, 60_000);
});

describe("cli usage", () => {
  it("--help prints the commands on stdout; no command is a usage error", async () => {
    const help = await cli(["--help"], {});
    expect(help.code).toBe(0);
    expect(help.out).toMatch(/groebner FILE/);
    expect(help.out).toMatch(/divide FILE/);
    const none = await cli([], {});
    expect(none.code).toBe(2);
    expect(none.err).toMatch(/^usage:/);
  });
  it("--timeout turns a long computation into a clear error", async () => {
    const sys = "vars: a, b, c, d, e, f\n" + [
      "a+b+c+d+e+f", "a*b+b*c+c*d+d*e+e*f+f*a", "a*b*c+b*c*d+c*d*e+d*e*f+e*f*a+f*a*b",
      "a*b*c*d+b*c*d*e+c*d*e*f+d*e*f*a+e*f*a*b+f*a*b*c", "a*b*c*d*e+b*c*d*e*f+c*d*e*f*a+d*e*f*a*b+e*f*a*b*c+f*a*b*c*d", "a*b*c*d*e*f-1",
    ].join("\n");
    const r = await cli(["groebner", "c6", "--timeout", "0.001"], { c6: sys });
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/deadline exceeded/);
  });
});
