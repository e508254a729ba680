import type { Route } from "./+types/networks-version";
import { db } from "~/db.server";
import { requireNetwork, requireVersion, versionJson } from "~/networks/pages.server";
import { structureOf } from "~/networks/structure.server";
import { requireApiLabRole } from "~/permissions/permissions.server";

/** GET /api/labs/:labSlug/networks/:networkId/versions/:number — one version with its CSV and structure. */
export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireApiLabRole(request, params.labSlug, "viewer");
  const network = await requireNetwork(db(), access, params.networkId, true);
  const version = await requireVersion(db(), network, params.number, true);
  return Response.json({ version: versionJson(version, { csv: true }), structure: structureOf(version.csv) });
}
