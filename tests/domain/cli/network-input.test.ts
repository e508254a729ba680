import { describe, expect, it } from "vitest";
import type { CliIO } from "@domain/cli/io";
import { formatInitial, inputFormat, readNetworkFile } from "@domain/cli/network-input";

const io = (files: Record<string, string>): CliIO => ({
  readFile: (p) => {
    if (!(p in files)) throw Object.assign(new Error("no"), { code: "ENOENT" });
    return files[p]!;
  },
  stdout: () => {},
  stderr: () => {},
});

describe("network input for the CLI", () => {
  it("takes --from first, then the extension, then the content", () => {
    expect(inputFormat("m.xml", undefined, "")).toBe("sbml");
    expect(inputFormat("m.txt", "csv", "")).toBe("csv");
    expect(() => inputFormat("m.csv", "excel", "")).toThrow(/--from expects one of .*not 'excel'/);
  });
  it("reads a CSV network, and reports its problems with their lines", () => {
    const doc = readNetworkFile(io({ "n.csv": "reaction,rate\nA -> B,k\n" }), "n.csv");
    expect(doc.network.species).toEqual(["A", "B"]);
    expect(() => readNetworkFile(io({ "bad.csv": "reaction,rate\nA -> ,k\n" }), "bad.csv")).toThrow(/row 2|line 2/);
    expect(() => readNetworkFile(io({}), "gone.csv")).toThrow("cannot read gone.csv: ENOENT");
  });
  it("writes initial values as NAME=VALUE, exactly", () => {
    expect(formatInitial(new Map([["E", { num: 1n, den: 1n }], ["S", { num: 1n, den: 2n }]]))).toBe("E=1,S=1/2");
  });
});
