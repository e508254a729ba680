import { describe, expect, it } from "vitest";
import { BenchOptionError, DEFAULT_OPTIONS, parseBenchOptions } from "../../../bench/lib/options";

describe("parseBenchOptions", () => {
  it("defaults to 3 runs, a 120 s timeout and all three programs", () => {
    expect(parseBenchOptions([])).toEqual(DEFAULT_OPTIONS);
    expect(DEFAULT_OPTIONS.repeat).toBe(3);
    expect(DEFAULT_OPTIONS.timeout).toBe(120);
    expect(DEFAULT_OPTIONS.tools).toEqual(["ours", "sympy", "singular"]);
    // Our CLI starts as `npm run cli` does: node scripts/cli.mjs (the bundled launcher).
    expect(DEFAULT_OPTIONS.launcher).toBe("bundle");
    expect(parseBenchOptions(["--launcher", "tsx"]).launcher).toBe("tsx");
  });
  it("reads every option", () => {
    const o = parseBenchOptions(["--only", "katsura-5,cyclic-5", "--repeat", "5", "--timeout", "60", "--quick", "--field", "32003", "--tools", "sympy,singular", "--long", "10", "--launcher", "node"]);
    expect(o).toMatchObject({ launcher: "node", only: ["katsura-5", "cyclic-5"], repeat: 5, timeout: 60, quick: true, prime: 32003n, tools: ["sympy", "singular"], long: 10 });
  });
  it("refuses bad values with a message naming the option", () => {
    expect(() => parseBenchOptions(["--repeat", "0"])).toThrow(/--repeat/);
    expect(() => parseBenchOptions(["--repeat", "1.5"])).toThrow(/--repeat/);
    expect(() => parseBenchOptions(["--timeout"])).toThrow(/--timeout/);
    expect(() => parseBenchOptions(["--tools", "maple"])).toThrow(/maple/);
    expect(() => parseBenchOptions(["--fast"])).toThrow(BenchOptionError);
    expect(() => parseBenchOptions(["--launcher", "bun"])).toThrow(/--launcher/);
  });
});
