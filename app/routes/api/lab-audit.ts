import type { Route } from "./+types/lab-audit";
import { apiError } from "~/permissions/api-errors";
import { db } from "~/db.server";
import { listLabAudit } from "~/shared/audit.server";
import { requireApiLabRole } from "~/permissions/permissions.server";

/** GET /api/labs/:labSlug/audit — the lab's audit trail, newest first (owners only). */
export async function loader({ request, params }: Route.LoaderArgs) {
  const { lab } = await requireApiLabRole(request, params.labSlug, "owner");
  const events = await listLabAudit(db(), lab.id);
  return Response.json({
    events: events.map((e) => ({ kind: e.kind, actor: e.actorEmail, details: e.details, at: e.createdAt.toISOString() })),
  });
}

/** Read-only resource: other methods get the JSON error shape (after the same permission check). */
export async function action({ request, params }: Route.ActionArgs) {
  await requireApiLabRole(request, params.labSlug, "owner");
  throw apiError("method_not_allowed", "This resource is read-only; use GET.", undefined, { Allow: "GET" });
}
