import type { Route } from "./+types/networks-versions";
import { db } from "~/db.server";
import { readNetworkPayload, saveFailureResponse } from "~/networks/api.server";
import { listVersions } from "~/networks/networks.server";
import { requireNetwork, structureFields, versionJson } from "~/networks/pages.server";
import { saveVersion } from "~/networks/save.server";
import { structureState } from "~/networks/structure-store.server";
import { apiError } from "~/permissions/api-errors";
import { requireApiLabRole } from "~/permissions/permissions.server";

/** GET /api/labs/:labSlug/networks/:networkId/versions — every version, newest first (no CSV). */
export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireApiLabRole(request, params.labSlug, "viewer");
  const network = await requireNetwork(db(), access, params.networkId, true);
  const versions = await listVersions(db(), network.id);
  return Response.json({ versions: versions.map((v) => versionJson(v)) });
}

/** POST …/versions — save a new version (editors); same body forms as creating a network. */
export async function action({ request, params }: Route.ActionArgs) {
  const access = await requireApiLabRole(request, params.labSlug, "editor");
  if (request.method !== "POST") throw apiError("method_not_allowed", "Use GET to list or POST to add a version.");
  const network = await requireNetwork(db(), access, params.networkId, true);
  const payload = await readNetworkPayload(request, "version");
  const result = await saveVersion(db(), network, { authorId: access.user.id, csv: payload.csv, changeNote: payload.changeNote });
  if (!result.ok) return saveFailureResponse(result);
  return Response.json({ version: versionJson(result.version, { csv: true }), ...structureFields(await structureState(db(), result.version.csv)) }, { status: 201 });
}
