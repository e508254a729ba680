import { formatNetworkCsv, parseNetworkCsv } from "@domain/network/index";
import { stoichiometricMatrixCsv } from "./matrix-csv";
import type { NetworkRecord, VersionRecord } from "./networks.server";
import { massActionOdes, odesLatexDocument } from "./odes";
import { structureOf } from "./structure.server";

const slug = (name: string) => name.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "") || "network";

/**
 * The three downloads. The network CSV is written by the domain's formatNetworkCsv, so every
 * rate symbol is explicit and the file reads back to the same network.
 */
export function downloadFile(network: NetworkRecord, version: VersionRecord, file: string | undefined): Response {
  const stem = `${slug(network.name)}-v${version.number}`;
  const send = (body: string, type: string, name: string) =>
    new Response(body, { headers: { "Content-Type": `${type}; charset=utf-8`, "Content-Disposition": `attachment; filename="${name}"` } });
  switch (file) {
    case "network.csv":
      return send(formatNetworkCsv(parseNetworkCsv(version.csv)), "text/csv", `${stem}.csv`);
    case "odes.tex": {
      const structure = structureOf(version.csv);
      return send(odesLatexDocument(`${network.name} (version ${version.number})`, massActionOdes(structure), structure.constants), "application/x-tex", `${stem}-odes.tex`);
    }
    case "stoichiometric-matrix.csv":
      return send(stoichiometricMatrixCsv(structureOf(version.csv)), "text/csv", `${stem}-stoichiometric-matrix.csv`);
    default:
      throw new Response("No such download", { status: 404, statusText: "Not Found" });
  }
}
