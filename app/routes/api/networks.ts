import type { Route } from "./+types/networks";
import { db } from "~/db.server";
import { readNetworkPayload, saveFailureResponse } from "~/networks/api.server";
import { networkJson, networkTableRows, structureFields, versionJson } from "~/networks/pages.server";
import { createNetwork } from "~/networks/save.server";
import { structureState } from "~/networks/structure-store.server";
import { apiError } from "~/permissions/api-errors";
import { requireApiLabRole } from "~/permissions/permissions.server";

/** GET /api/labs/:labSlug/networks — the lab's networks with counts (`?archived=1` includes archived). */
export async function loader({ request, params }: Route.LoaderArgs) {
  const access = await requireApiLabRole(request, params.labSlug, "viewer");
  const includeArchived = new URL(request.url).searchParams.get("archived") === "1";
  const rows = await networkTableRows(db(), access, includeArchived);
  return Response.json({
    networks: rows.map((r) => ({
      id: r.id,
      name: r.name,
      tags: r.tags,
      archived: r.archived,
      species: r.species,
      reactions: r.reactionCount,
      deficiency: r.deficiency,
      latestVersion: r.version,
      lastChange: r.lastChange,
      author: r.author,
    })),
  });
}

/** POST /api/labs/:labSlug/networks — create from JSON, a multipart upload or a text/csv body (editors). */
export async function action({ request, params }: Route.ActionArgs) {
  const access = await requireApiLabRole(request, params.labSlug, "editor");
  if (request.method !== "POST") throw apiError("method_not_allowed", "Use GET to list or POST to create.");
  const payload = await readNetworkPayload(request);
  const result = await createNetwork(db(), { labId: access.lab.id, authorId: access.user.id, ...payload, csv: payload.csv });
  if (!result.ok) return saveFailureResponse(result);
  return Response.json(
    { network: networkJson(result.network), version: versionJson(result.version, { csv: true }), ...structureFields(await structureState(db(), result.version.csv)) },
    { status: 201, headers: { Location: `/api/labs/${access.lab.slug}/networks/${result.network.id}` } },
  );
}
