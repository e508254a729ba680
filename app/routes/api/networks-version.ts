import type { Route } from "./+types/networks-version";
import { db } from "~/db.server";
import { requireNetwork, requireVersion, structureFields, versionJson } from "~/networks/pages.server";
import { structureState } from "~/networks/structure-store.server";
import { requireApiLabRole } from "~/permissions/permissions.server";

/** GET /api/labs/:labSlug/networks/:networkId/versions/:number — one version with its CSV and structure. */
export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireApiLabRole(request, params.labSlug, "viewer");
  const network = await requireNetwork(db(), access, params.networkId, true);
  const version = await requireVersion(db(), network, params.number, true);
  return Response.json({ version: versionJson(version, { csv: true }), ...structureFields(await structureState(db(), version.csv)) });
}
