import type { Route } from "./+types/labs";
import { db } from "~/db.server";
import { createLab, listLabsOf, parseLabName } from "~/labs/labs.server";
import { requireBody } from "~/api/body";
import { LAB_CREATE } from "~/api/schemas";
import { apiError } from "~/permissions/api-errors";
import { requireApiUser } from "~/permissions/permissions.server";

/** GET /api/labs — the caller's labs. */
export async function loader({ request }: Route.LoaderArgs) {
  const user = await requireApiUser(request);
  const labs = await listLabsOf(db(), user.id);
  return Response.json({ labs: labs.map((l) => ({ slug: l.slug, name: l.name, role: l.role, memberCount: l.memberCount })) });
}

/** POST /api/labs {"name": "…"} — creates a lab owned by the caller. */
export async function action({ request }: Route.ActionArgs) {
  const user = await requireApiUser(request);
  if (request.method !== "POST") throw apiError("method_not_allowed", "Use POST to create a lab.");
  const body = await request.json().catch(() => undefined);
  if (body === undefined) throw apiError("invalid_request", 'The body must be a JSON object such as { "name": "Invertase lab" }.');
  const name = parseLabName(requireBody(LAB_CREATE, body).name);
  if (!name.ok) throw apiError("invalid_request", name.message, { field: "name" });
  const lab = await createLab(db(), { userId: user.id, name: name.value });
  return Response.json({ lab: { slug: lab.slug, name: lab.name, role: "owner" } }, { status: 201 });
}
