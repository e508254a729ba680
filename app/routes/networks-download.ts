import type { Route } from "./+types/networks-download";
import { db } from "~/db.server";
import { downloadFile } from "~/networks/downloads.server";
import { requireNetwork, requireVersion } from "~/networks/pages.server";
import { structureState } from "~/networks/structure-store.server";
import { requireLabRole } from "~/permissions/permissions.server";

/** network.csv · odes.tex · stoichiometric-matrix.csv · network.xml · network.txt · odes.py · odes.jl, of ?v=N or the newest version (viewers too). */
export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireLabRole(request, params.labSlug, "viewer");
  const network = await requireNetwork(db(), access, params.networkId);
  const version = await requireVersion(db(), network, new URL(request.url).searchParams.get("v"));
  return downloadFile(network, version, params.file, await structureState(db(), version.csv));
}
