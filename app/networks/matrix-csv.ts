import Papa from "papaparse";
import type { NetworkStructure } from "@domain/network/index";
import { csvCell, csvRows } from "~/downloads/escape";

/**
 * The stoichiometric matrix as CSV: a header `species,r1,r2,…` and one row per species. A
 * second header-like comment is avoided so spreadsheet programs read it directly.
 * Example: E + S -> C gives `species,r1` / `E,-1` / `S,-1` / `C,1`.
 */
export function stoichiometricMatrixCsv(structure: Pick<NetworkStructure, "species" | "reactionList" | "stoichiometricMatrix">): string {
  const fields = ["species", ...structure.reactionList.map((r) => r.id)];
  const data = structure.species.map((s, i) => [s, ...structure.stoichiometricMatrix[i]!.map(String)]);
  return Papa.unparse({ fields: fields.map((f) => String(csvCell(f))), data: csvRows(data) }, { newline: "\n" }) + "\n";
}
