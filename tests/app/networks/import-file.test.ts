import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { importFormat, importNetworkText } from "~/networks/import-file";

const HATCHERY = readFileSync("tests/fixtures/sbml/hatchery.xml", "utf8");

describe("importFormat", () => {
  it("goes by the extension, then an XML type or a leading `<`, else stays CSV", () => {
    expect(importFormat("m.SBML", "", "")).toBe("sbml");
    expect(importFormat("m.xml", "", "")).toBe("sbml");
    expect(importFormat("list.txt", "text/plain", "A -> B")).toBe("text");
    expect(importFormat("n.csv", "text/csv", "A -> B")).toBe("csv");
    expect(importFormat(undefined, "application/sbml+xml", "")).toBe("sbml");
    expect(importFormat(undefined, undefined, "  <?xml version='1.0'?><sbml/>")).toBe("sbml");
    // A CSV without its header stays a CSV, so the CSV's own message explains it.
    expect(importFormat(undefined, undefined, "A -> B,k1\n")).toBe("csv");
  });
});

describe("importNetworkText", () => {
  it("reads SBML into our CSV, initial values as its `# initial:` line", () => {
    const r = importNetworkText(HATCHERY, "sbml");
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.csv.split("\n")[1]).toBe("Egg -> Fry,hatching,kh,,3,");
    expect(r.csv.trimEnd().split("\n").at(-1)).toBe("# initial: Egg = 2, Fry = 0, Feed = 1, Fingerling = 0");
    expect(r.notes.join("\n")).not.toMatch(/initial/);
  });

  it("refuses with located problems and every reaction's fate", () => {
    const r = importNetworkText(HATCHERY.replace('species="Egg" stoichiometry="1"', 'species="Egg" stoichiometry="1.5"'), "sbml");
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.message).toBe("The SBML file has 1 problem; nothing was saved.");
    expect(r.problems[0]).toMatchObject({ id: "hatch", row: 19 });
    expect(r.reactions?.map((x) => x.status)).toEqual(["refused", "read"]);
  });

  it("reads a reaction list with its line numbers in problems", () => {
    const r = importNetworkText("A -> B\nB => C\n", "text");
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.problems[0]).toMatchObject({ row: 2, column: "reaction" });
  });
});
