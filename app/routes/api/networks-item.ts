import type { Route } from "./+types/networks-item";
import { db } from "~/db.server";
import { networkJson, requireNetworkWithLatest, structureFields, versionJson } from "~/networks/pages.server";
import { structureState } from "~/networks/structure-store.server";
import { requireApiLabRole } from "~/permissions/permissions.server";

/** GET /api/labs/:labSlug/networks/:networkId — the network, its newest version (CSV) and that version's structure (`structure: null` with `structureStatus: "pending"` until the worker has computed it). */
export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireApiLabRole(request, params.labSlug, "viewer");
  const { network, latest } = await requireNetworkWithLatest(db(), access, params.networkId);
  return Response.json({ network: networkJson(network), version: versionJson(latest, { csv: true }), ...structureFields(await structureState(db(), latest.csv)) });
}
