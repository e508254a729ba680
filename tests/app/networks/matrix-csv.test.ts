import { describe, expect, it } from "vitest";
import Papa from "papaparse";
import { analyseStructure, parseNetworkCsv } from "@domain/network/index";
import { stoichiometricMatrixCsv } from "~/networks/matrix-csv";

describe("stoichiometricMatrixCsv", () => {
  it("writes species rows and reaction columns that read back to the matrix", () => {
    const s = analyseStructure(parseNetworkCsv("reaction\nE + S <-> C\nC -> E + P\n"));
    const csv = stoichiometricMatrixCsv(s);
    expect(csv.split("\n")[0]).toBe("species,r1,r2,r3");
    const rows = Papa.parse<string[]>(csv.trim()).data.slice(1);
    expect(rows.map((r) => r[0])).toEqual(s.species);
    expect(rows.map((r) => r.slice(1).map(Number))).toEqual(s.stoichiometricMatrix);
  });
});
