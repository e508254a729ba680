import type { Route } from "./+types/networks-item";
import { db } from "~/db.server";
import { networkJson, requireNetwork, requireVersion, versionJson } from "~/networks/pages.server";
import { structureOf } from "~/networks/structure.server";
import { requireApiLabRole } from "~/permissions/permissions.server";

/** GET /api/labs/:labSlug/networks/:networkId — the network, its newest version (CSV) and that version's structure. */
export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireApiLabRole(request, params.labSlug, "viewer");
  const network = await requireNetwork(db(), access, params.networkId, true);
  const version = await requireVersion(db(), network, null, true);
  return Response.json({ network: networkJson(network), version: versionJson(version, { csv: true }), structure: structureOf(version.csv) });
}
