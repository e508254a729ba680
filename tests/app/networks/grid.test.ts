import { describe, expect, it } from "vitest";
import { readFileSync } from "node:fs";
import { parseNetworkCsv, tryParseNetworkCsv } from "@domain/network/index";
import { checkGrid, csvToGrid, emptyRow, gridToCsv, moveRow } from "~/networks/grid";

const row = (reaction: string, extra: Partial<Record<string, string>> = {}) => ({ ...emptyRow(), reaction, ...extra });

describe("grid ↔ CSV", () => {
  it("writes the columns in use with the header on line 1 and row i on line i + 2", () => {
    const csv = gridToCsv([row("A -> B", { rate: "k1" }), row("B -> C", { label: "two, with comma" })]);
    expect(csv).toBe('reaction,label,rate\nA -> B,,k1\nB -> C,"two, with comma",\n');
    expect(parseNetworkCsv(csv).rows.map((r) => r.line)).toEqual([2, 3]);
  });

  it("keeps pasted newlines from shifting line numbers", () => {
    const csv = gridToCsv([row("A -> B", { label: "one\ntwo" }), row("B -> ")]);
    const result = tryParseNetworkCsv(csv);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.problems[0]!.row).toBe(3);
  });

  it("reads a file into rows with their source lines, leaving out unknown columns with a notice", () => {
    const g = csvToGrid("# comment\nreaction;notes;rate\nA -> B;x;k1\n\nB -> C;y;\n");
    expect(g.rows.map((r) => [r.reaction, r.rate, r.sourceLine])).toEqual([
      ["A -> B", "k1", 3],
      ["B -> C", "", 5],
    ]);
    expect(g.notices.join(" ")).toMatch(/`notes`.*left out/);
  });

  it("names every unknown column whose cells the grid would lose (rate names under `rate_constant`)", () => {
    const g = csvToGrid("reaction,rate_constant,Value\nA -> B,k1,2\nB -> C,k2,\n");
    expect(g.dropped.map((p) => [p.row, p.columnIndex, p.column, p.message])).toEqual([
      [1, 2, "rate_constant", "unknown column `rate_constant`: the grid has no place for its cells"],
      [1, 3, "Value", "unknown column `Value`: the grid has no place for its cells"],
    ]);
    expect(g.dropped[0]!.expected).toContain("reaction, label, rate, reverse_rate, rate_value, reverse_rate_value");
    // A nameless column with data counts too; a nameless empty one (a trailing comma) does not.
    expect(csvToGrid("reaction,\nA -> B,k1\n").dropped).toHaveLength(1);
    expect(csvToGrid("reaction,\nA -> B,\n").dropped).toEqual([]);
    expect(csvToGrid("reaction,rate\nA -> B,k1\n").dropped).toEqual([]);
  });

  it("refuses to guess the columns of a headerless file with more than reactions in it", () => {
    const g = csvToGrid("A -> B,k1\nB -> C\nC -> A,k3\n");
    expect(g.dropped).toHaveLength(1);
    expect(g.dropped[0]!.message).toBe("the file has no header naming its columns, and lines 1, 3 have cells after the reaction that could only be guessed at");
  });

  it("reads a headerless file as reactions", () => {
    const g = csvToGrid("A -> B\nB -> C\n");
    expect(g.rows.map((r) => r.reaction)).toEqual(["A -> B", "B -> C"]);
    expect(g.notices[0]).toMatch(/not a header/);
  });

  it("round-trips every valid fixture through the grid to the same network (labels on one line)", () => {
    for (const name of ["michaelis-menten", "two-site-phosphorylation", "format-features", "cycle"]) {
      const text = readFileSync(`tests/fixtures/networks/${name}.csv`, "utf8");
      const original = parseNetworkCsv(text);
      const again = parseNetworkCsv(gridToCsv(csvToGrid(text).rows));
      expect(again.species, name).toEqual(original.species);
      expect(again.reactions.map((r) => [r.rate, r.reactant, r.product, r.rateValue, r.label]), name).toEqual(
        original.reactions.map((r) => [r.rate, r.reactant, r.product, r.rateValue, r.label?.replace(/\s*\n\s*/g, " ")]),
      );
    }
  });
});

describe("checkGrid", () => {
  it("maps each domain problem to its grid row, and header-level ones to general", () => {
    const check = checkGrid([row("A -> B"), row("B => C"), row("C -> D", { rate_value: "-1" })]);
    expect(check.ok).toBe(false);
    expect([...check.byRow.keys()]).toEqual([1, 2]);
    expect(check.byRow.get(1)![0]!.column).toBe("reaction");
    expect(check.byRow.get(2)![0]!.column).toBe("rate_value");
    expect(check.general).toEqual([]);
  });

  it("reports an empty grid as a general problem", () => {
    const check = checkGrid([emptyRow()]);
    expect(check.ok).toBe(false);
    expect(check.general[0]!.message).toMatch(/no reactions/);
  });

  it("accepts a valid grid", () => {
    expect(checkGrid([row("E + S <-> C"), row("C -> E + P")]).ok).toBe(true);
  });

  it("moves rows", () => {
    expect(moveRow(["a", "b", "c"], 2, 0)).toEqual(["c", "a", "b"]);
    expect(moveRow(["a", "b"], 0, -1)).toEqual(["a", "b"]);
  });
});

describe("constant species in the grid", () => {
  it("reads the `# constant:` lines into one field and writes them back after the rows", () => {
    const g = csvToGrid("# constant: A = 2\nreaction\nA + 2X <-> 3X\nX <-> B\n# constants: B\n");
    expect(g.constants).toBe("A = 2, B");
    expect(g.notices).toEqual([]);
    const csv = gridToCsv(g.rows, g.constants);
    expect(csv).toBe("reaction\nA + 2X <-> 3X\nX <-> B\n# constant: A = 2, B\n");
  });

  it("keeps row lines unchanged and reports declaration problems apart from the rows", () => {
    const g = csvToGrid("reaction\nA + X -> 2X\n");
    const check = checkGrid(g.rows, "A = 0, Q");
    expect(check.ok).toBe(false);
    expect(check.byRow.size).toBe(0);
    expect(check.constants.map((p) => p.message)).toEqual([
      "the concentration `0` of `A` is not a positive number",
      "`Q` is declared constant but is not a species of any reaction",
    ]);
    expect(checkGrid(g.rows, "A = 1/2").ok).toBe(true);
  });

  it("says which comment lines the grid does not keep", () => {
    expect(csvToGrid("# Restored from version 1 as version 3.\nreaction\nA -> B\n").notices).toEqual([
      "The comment on line 1 (`# Restored from version 1 as version 3.`) is not kept by the grid.",
    ]);
  });
});

describe("initial values in the grid", () => {
  it("reads the `# initial:` line into its own field, writes it back after the rows, and keeps it out of the comment notices", () => {
    const g = csvToGrid("# initial: X = 1/2\nreaction\nA + 2X <-> 3X\nX <-> B\n# constant: A = 2\n");
    expect(g.initial).toBe("X = 1/2");
    expect(g.notices).toEqual([]);
    const csv = gridToCsv(g.rows, g.constants, g.initial);
    expect(csv).toBe("reaction\nA + 2X <-> 3X\nX <-> B\n# constant: A = 2\n# initial: X = 1/2\n");
    expect(parseNetworkCsv(csv).initial?.map((i) => i.name)).toEqual(["X"]);
  });

  it("reports the field's problems apart from the rows", () => {
    const rows = [{ ...emptyRow(), reaction: "A + 2X <-> 3X" }];
    const check = checkGrid(rows, "A = 2", "X = -1, A = 1");
    expect(check.byRow.size).toBe(0);
    expect(check.initial.map((p) => p.message)).toEqual(["the initial value `-1` of `X` is negative", "`A` is held constant, so it has no initial value of its own"]);
  });
});
