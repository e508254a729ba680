import type { Route } from "./+types/lab-members";
import { apiError } from "~/permissions/api-errors";
import { db } from "~/db.server";
import { listMembers } from "~/labs/memberships.server";
import { requireApiLabRole, requireLabMember } from "~/permissions/permissions.server";

/** GET /api/labs/:labSlug/members — who is in the lab, with roles (any member; not guests of a public lab). */
export async function loader({ request, params }: Route.LoaderArgs) {
  const { lab } = requireLabMember(await requireApiLabRole(request, params.labSlug, "viewer"), true);
  const members = await listMembers(db(), lab.id);
  return Response.json({
    members: members.map((m) => ({ email: m.email, displayName: m.displayName, role: m.role, since: m.since.toISOString() })),
  });
}

/** Read-only resource: other methods get the JSON error shape (after the same permission check). */
export async function action({ request, params }: Route.ActionArgs) {
  await requireApiLabRole(request, params.labSlug, "viewer");
  throw apiError("method_not_allowed", "This resource is read-only; use GET.", undefined, { Allow: "GET" });
}
