import { describe, expect, it } from "vitest";
import { CliError, parseArgs, readInput, type CliIO } from "@domain/cli/io";

describe("parseArgs", () => {
  it("separates positionals from known flags, as --name value or --name=value", () => {
    const { positionals, flags } = parseArgs(["a.csv", "--order", "X,Y", "--timeout=5", "b"], ["order", "timeout"]);
    expect(positionals).toEqual(["a.csv", "b"]);
    expect([...flags]).toEqual([["order", "X,Y"], ["timeout", "5"]]);
  });
  it("names an unknown flag with the known ones, and a flag without its value", () => {
    expect(() => parseArgs(["--fast"], ["order"])).toThrow("unknown option --fast (known: --order)");
    expect(() => parseArgs(["--fast"], [])).toThrow("(known: none)");
    expect(() => parseArgs(["--order"], ["order"])).toThrow(new CliError("option --order needs a value"));
  });
});

describe("readInput", () => {
  const io: CliIO = {
    readFile: (p) => {
      if (p === "here.txt") return "x^2";
      throw Object.assign(new Error("gone"), { code: "ENOENT" });
    },
    stdout: () => {},
    stderr: () => {},
  };
  it("reads through the injected file system and names the path it could not read", () => {
    expect(readInput(io, "here.txt")).toBe("x^2");
    expect(() => readInput(io, "missing.txt")).toThrow("cannot read missing.txt: ENOENT");
  });
});
