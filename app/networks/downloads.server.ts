import { formatNetworkCsv, formatReactionList, parseNetworkCsv } from "@domain/network/index";
import { odeJulia, odePython } from "@domain/steady-state/index";
import { formatSbml } from "@domain/network/sbml/index";
import { csvTextSafe } from "~/downloads/escape";
import { stoichiometricMatrixCsv } from "./matrix-csv";
import type { NetworkRecord, VersionRecord } from "./networks.server";
import { odesLatexDocument } from "./odes";
import type { StructureState } from "./structure-store.server";
import { odesOf } from "./structure.server";
import type { NetworkStructure } from "@domain/network/index";
import { notFound } from "~/shared/responses";

const slug = (name: string) => name.toLowerCase().replace(/[^a-z0-9]+/g, "-").replace(/^-|-$/g, "") || "network";

/**
 * The downloads. The network CSV is written by the domain's formatNetworkCsv, so every
 * rate symbol is explicit and the file reads back to the same network. Every format carries the
 * constant species and the stored initial values (SBML as boundary species and initialConcentration,
 * the reaction list as the CSV's directive lines, the code as parameters and INITIAL). The two that
 * need the structure answer 503 with Retry-After while the worker is still computing it.
 */
export function downloadFile(network: NetworkRecord, version: VersionRecord, file: string | undefined, structureState: StructureState): Response {
  const stem = `${slug(network.name)}-v${version.number}`;
  const send = (body: string, type: string, name: string) =>
    new Response(body, { headers: { "Content-Type": `${type}; charset=utf-8`, "Content-Disposition": `attachment; filename="${name}"` } });
  const withStructure = (make: (s: NetworkStructure) => Response): Response => {
    if (structureState.status === "ready") return make(structureState.structure);
    if (structureState.status === "failed") return new Response(`The structure of this version could not be computed: ${structureState.message}`, { status: 422, headers: { "Content-Type": "text/plain; charset=utf-8" } });
    return new Response("The structure of this version is still being computed; try again in a few seconds.", { status: 503, headers: { "Content-Type": "text/plain; charset=utf-8", "Retry-After": "2" } });
  };
  switch (file) {
    case "network.csv":
      return send(csvTextSafe(formatNetworkCsv(parseNetworkCsv(version.csv))), "text/csv", `${stem}.csv`);
    case "odes.tex":
      // The equations need no structure (odesOf only writes the polynomials); the held values come formatted from it.
      return withStructure((structure) =>
        send(odesLatexDocument(`${network.name} (version ${version.number})`, odesOf(version.csv), structure.constants), "application/x-tex", `${stem}-odes.tex`),
      );
    // Open formats and code (issue 14): SBML Level 3 Version 2, a reaction list, the ODEs as Python and Julia.
    case "network.xml":
      return send(formatSbml(parseNetworkCsv(version.csv), { id: slug(network.name), name: network.name }), "application/sbml+xml", `${stem}.xml`);
    case "network.txt":
      return send(formatReactionList(parseNetworkCsv(version.csv)), "text/plain", `${stem}.txt`);
    case "odes.py":
      return send(odePython(parseNetworkCsv(version.csv), { title: `${network.name} (version ${version.number})` }), "text/x-python", `${stem.replace(/-/g, "_")}_odes.py`);
    case "odes.jl":
      return send(odeJulia(parseNetworkCsv(version.csv), { title: `${network.name} (version ${version.number})` }), "text/x-julia", `${stem}-odes.jl`);
    case "stoichiometric-matrix.csv":
      return withStructure((structure) => send(stoichiometricMatrixCsv(structure), "text/csv", `${stem}-stoichiometric-matrix.csv`));
    default:
      throw notFound("No such download");
  }
}
