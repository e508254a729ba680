import { describe, expect, it } from "vitest";
import { readCsvTable } from "../../../domain/network/csv-table";

describe("readCsvTable", () => {
  it("keeps file line numbers across comments, blank lines, CRLF and quoted newlines", () => {
    const t = readCsvTable('\uFEFF# c\r\n\r\nreaction;label\r\nA -> B;"x\r\ny"\r\n\r\nB -> C;z\r\n');
    expect(t.delimiter).toBe(";");
    expect(t.header).toEqual({ line: 3, cells: ["reaction", "label"] });
    expect(t.rows.map((r) => r.line)).toEqual([4, 7]);
    expect(t.rows[0].cells).toEqual(["A -> B", "x\r\ny"]);
  });

  it("chooses the comma unless the header has more semicolons; lone CR counts as a line break", () => {
    expect(readCsvTable("reaction,label\nA -> B,x;y\n").delimiter).toBe(",");
    expect(readCsvTable('reaction;"a,b,c"\n').delimiter).toBe(";");
    expect(readCsvTable("reaction\rA -> B\r").rows[0].line).toBe(2);
  });

  it("reports an unterminated quote as a located problem", () => {
    const t = readCsvTable('reaction,label\nA -> B,"open\n');
    expect(t.problems).toHaveLength(1);
    expect(t.problems[0].row).toBe(2);
  });
});
