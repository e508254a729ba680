import { readFileSync, readdirSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { NetworkFileError, parseNetworkCsv, type NetworkFileProblem } from "../../../domain/network";

const DIR = join(__dirname, "../../fixtures/networks/malformed");
interface Expected {
  row: number;
  column?: string;
  columnIndex?: number;
  message: string;
}
const expected: Record<string, Expected[]> = JSON.parse(readFileSync(join(DIR, "expected.json"), "utf8"));
const files = readdirSync(DIR).filter((f) => f.endsWith(".csv")).sort();

function problemsOf(text: string): readonly NetworkFileProblem[] {
  try {
    parseNetworkCsv(text);
  } catch (e) {
    if (e instanceof NetworkFileError) return e.problems;
    throw e;
  }
  throw new Error("parsed without a problem");
}

describe("malformed network files (tests/fixtures/networks/malformed)", () => {
  it("has at least 30 cases, each with expectations", () => {
    expect(files.length).toBeGreaterThanOrEqual(30);
    expect(Object.keys(expected).sort()).toEqual(files);
  });

  it.each(files)("%s gives every expected located problem and nothing else", (file) => {
    const problems = problemsOf(readFileSync(join(DIR, file), "utf8"));
    const want = expected[file];
    expect(problems.map((p) => `${p.row}: ${p.message}`)).toHaveLength(want.length);
    want.forEach((w, k) => {
      const p = problems[k];
      expect(p.row, `problem ${k + 1} row`).toBe(w.row);
      if (w.column !== undefined) expect(p.column).toBe(w.column);
      if (w.columnIndex !== undefined) expect(p.columnIndex).toBe(w.columnIndex);
      expect(p.message).toContain(w.message);
      expect(p.expected, "each problem says what was expected").toBeTruthy();
    });
  });

  it("puts every problem into one error message with its line", () => {
    try {
      parseNetworkCsv(readFileSync(join(DIR, "34-several-problems.csv"), "utf8"));
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(NetworkFileError);
      const message = (e as Error).message;
      expect(message).toContain("4 problems");
      for (const line of ["line 2, column 1 (reaction)", "line 3, column 3 (rate_value)", "line 4, column 1 (reaction)", "line 4, column 3 (rate_value)"]) {
        expect(message).toContain(line);
      }
    }
  });
});
