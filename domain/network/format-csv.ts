import Papa from "papaparse";
import { formatRational } from "../algebra/rational";
import { formatComplex } from "./complex";
import type { Network, NetworkRow } from "./model";
import { NETWORK_COLUMNS, type NetworkColumn } from "./parse-csv";
import { formatConstantDeclaration } from "./constant-species";
import { formatInitialDeclaration } from "./initial-values";

/**
 * Writes a network in our CSV format, one row per source row, with every rate symbol explicit
 * (defaults included) so the names stay stable. Only columns in use are written; `reaction` and
 * `rate` always are. Terms follow the network's species order, so parsing the output gives the
 * same species, reactions, rate symbols and values. Constant species are written back as one
 * `# constant: A = 2, B` line before the header (see constant-species.ts), initial values as one
 * `# initial: X = 1` line after it (initial-values.ts).
 *
 * Example: the network of "reaction\nA <-> B\n" is written as
 *   reaction,rate,reverse_rate
 *   A <-> B,k1,k2
 */
export function formatNetworkCsv(network: Network): string {
  const used = (c: NetworkColumn): boolean => {
    switch (c) {
      case "reaction":
      case "rate":
        return true;
      case "label":
        return network.rows.some((r) => r.label !== undefined);
      case "reverse_rate":
        return network.rows.some((r) => r.reverseRate !== undefined);
      case "rate_value":
        return network.rows.some((r) => r.rateValue !== undefined);
      case "reverse_rate_value":
        return network.rows.some((r) => r.reverseRateValue !== undefined);
    }
  };
  const fields = NETWORK_COLUMNS.filter(used);
  const cell = (r: NetworkRow, c: NetworkColumn): string => {
    switch (c) {
      case "reaction":
        return `${formatComplex(r.left, network.species)} ${r.arrow} ${formatComplex(r.right, network.species)}`;
      case "label":
        return r.label ?? "";
      case "rate":
        return r.rate;
      case "reverse_rate":
        return r.reverseRate ?? "";
      case "rate_value":
        return r.rateValue ? formatRational(r.rateValue) : "";
      case "reverse_rate_value":
        return r.reverseRateValue ? formatRational(r.reverseRateValue) : "";
    }
  };
  const data = network.rows.map((r) => fields.map((c) => cell(r, c)));
  // Terms of constant species are not in network.species, so they come after the others (`2X + A`).
  const declaration = network.constants && network.constants.length > 0 ? formatConstantDeclaration(network.constants) + "\n" : "";
  const initial = network.initial && network.initial.length > 0 ? formatInitialDeclaration(network.initial) + "\n" : "";
  return declaration + initial + Papa.unparse({ fields: [...fields], data }, { newline: "\n" }) + "\n";
}
